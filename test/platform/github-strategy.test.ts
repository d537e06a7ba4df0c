import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { ConfigurableGitHubStrategy, GitHubAtBaseUrl } from "~/platform/github-strategy.server";

let server: Server;
let base: string;
const seen: { path: string; authorization?: string; body: string }[] = [];

beforeAll(async () => {
  server = createServer(async (request, response) => {
    let body = "";
    for await (const chunk of request) body += chunk;
    seen.push({ path: request.url ?? "", authorization: request.headers.authorization, body });
    const code = new URLSearchParams(body).get("code");
    response.writeHead(200, { "Content-Type": "application/json" });
    response.end(
      JSON.stringify(
        code === "good"
          ? { access_token: "tok-1", token_type: "bearer", scope: "" }
          : { error: "bad_verification_code", error_description: "The code is wrong." },
      ),
    );
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

const client = () =>
  new GitHubAtBaseUrl({ clientId: "id 1", clientSecret: "s:cret", redirectURI: "http://127.0.0.1:3000/auth/github/callback", oauthUrl: base });

describe("the GitHub strategy's endpoint override", () => {
  test("the authorize URL keeps GitHub's path and parameters on the configured host", () => {
    const url = client().createAuthorizationURL("state-1", ["read:user", "user:email"]);
    expect(url.origin).toBe(base);
    expect(url.pathname).toBe("/login/oauth/authorize");
    expect(Object.fromEntries(url.searchParams)).toMatchObject({
      response_type: "code",
      client_id: "id 1",
      state: "state-1",
      scope: "read:user user:email",
      redirect_uri: "http://127.0.0.1:3000/auth/github/callback",
    });
  });

  test("the code is exchanged at the configured host with the client's Basic credentials", async () => {
    const tokens = await client().validateAuthorizationCode("good");
    expect(tokens.accessToken()).toBe("tok-1");
    const call = seen.at(-1)!;
    expect(call.path).toBe("/login/oauth/access_token");
    expect(call.authorization).toBe(`Basic ${Buffer.from("id%201:s%3Acret").toString("base64")}`);
    expect(new URLSearchParams(call.body).get("grant_type")).toBe("authorization_code");
  });

  test("an error answer becomes an OAuth2 request error with GitHub's description", async () => {
    await expect(client().validateAuthorizationCode("bad")).rejects.toMatchObject({ code: "bad_verification_code", description: "The code is wrong." });
  });

  test("the strategy sends people to the configured host, not github.com", async () => {
    const strategy = new ConfigurableGitHubStrategy(
      { clientId: "id", clientSecret: "secret", redirectURI: "http://127.0.0.1:3000/auth/github/callback", oauthUrl: base },
      async () => ({}),
    );
    const outcome = await strategy.authenticate(new Request("http://127.0.0.1:3000/auth/github", { method: "POST" })).catch((e) => e);
    expect(outcome).toBeInstanceOf(Response);
    expect(new URL((outcome as Response).headers.get("Location")!).origin).toBe(base);
  });
});
