// A local stand-in for GitHub's OAuth service, on 127.0.0.1 only: the
// authorize page (pick a demo person or type a new one), the token exchange,
// and the user and e-mails endpoints the app reads after sign-in. A demo
// person's address is verified; a typed-in person's too, unless left
// unverified, so the app's handling of an unverified address can be tried.
// Usage: tsx scripts/fakes/github.ts --port 3001 --client-id ID --client-secret SECRET
import { createHash, randomBytes } from "node:crypto";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { parseArgs } from "node:util";
import { demoPeople } from "../../db/demo/scenario";

type Person = { id: number; login: string; name: string; email: string; verified: boolean };

const { values } = parseArgs({
  options: {
    port: { type: "string", default: "3001" },
    "client-id": { type: "string", default: "gaitloom-local" },
    "client-secret": { type: "string", default: "gaitloom-local-secret" },
  },
});
const port = Number(values.port);
const clientId = values["client-id"]!;
const clientSecret = values["client-secret"]!;

const codes = new Map<string, { person: Person; redirectUri: string; expires: number }>();
const tokens = new Map<string, Person>();

function personFor(login: string, name: string, email: string, verified: boolean): Person {
  const demo = demoPeople.find((person) => person.login === login);
  if (demo) return { id: demo.githubId, login: demo.login, name: demo.name, email: demo.email, verified: true };
  // A stable id for a typed-in person, so signing in again finds the same user.
  const id = 2_000_000 + (createHash("sha256").update(login).digest().readUInt32BE(0) % 1_000_000);
  return { id, login, name: name || login, email, verified };
}

const escape = (text: string) => text.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function authorizePage(query: URLSearchParams): string {
  const hidden = ["state", "redirect_uri", "client_id", "scope"]
    .map((key) => `<input type="hidden" name="${key}" value="${escape(query.get(key) ?? "")}">`)
    .join("");
  const people = demoPeople
    .map(
      (person) => `<form method="post"><input type="hidden" name="login" value="${person.login}">${hidden}
        <button type="submit">Continue as ${escape(person.name)} <small>(${person.role})</small></button></form>`,
    )
    .join("");
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Local sign-in</title>
<style>body{font:16px system-ui,sans-serif;max-width:34rem;margin:3rem auto;color:#222}button{display:block;width:100%;
margin:.4rem 0;padding:.6rem;text-align:left;font:inherit;cursor:pointer}label{display:block;margin:.5rem 0}
input[type=text],input[type=email]{width:100%;padding:.4rem;font:inherit}</style></head><body>
<h1>Local sign-in</h1><p>This page stands in for GitHub while Gaitloom runs on this machine.</p>
<h2>Demo people</h2>${people}
<h2>Someone new</h2><form method="post">${hidden}
<label>Login <input type="text" name="login" required pattern="[A-Za-z0-9-]+"></label>
<label>Name <input type="text" name="name"></label>
<label>E-mail <input type="email" name="email" required></label>
<label><input type="checkbox" name="unverified" value="yes"> Leave this address unverified</label>
<button type="submit">Continue as this person</button></form></body></html>`;
}

async function readBody(request: IncomingMessage): Promise<string> {
  let body = "";
  for await (const chunk of request) body += chunk;
  return body;
}

function send(response: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}) {
  const text = typeof body === "string" ? body : JSON.stringify(body);
  const type = typeof body === "string" ? "text/html; charset=utf-8" : "application/json";
  response.writeHead(status, { "Content-Type": type, ...headers });
  response.end(text);
}

function bearer(request: IncomingMessage): Person | undefined {
  const header = request.headers.authorization ?? "";
  const token = header.replace(/^(Bearer|token)\s+/i, "");
  return tokens.get(token);
}

const server = createServer(async (request, response) => {
  const url = new URL(request.url ?? "/", `http://127.0.0.1:${port}`);
  try {
    if (url.pathname === "/login/oauth/authorize" && request.method === "GET") {
      if (url.searchParams.get("client_id") !== clientId) return send(response, 400, "<p>Unknown client_id.</p>");
      return send(response, 200, authorizePage(url.searchParams));
    }
    if (url.pathname === "/login/oauth/authorize" && request.method === "POST") {
      const form = new URLSearchParams(await readBody(request));
      const login = form.get("login") ?? "";
      const demo = demoPeople.find((person) => person.login === login);
      const email = demo?.email ?? form.get("email") ?? "";
      if (!login || !email) return send(response, 400, "<p>A login and an e-mail are needed.</p>");
      const code = randomBytes(16).toString("hex");
      const redirectUri = form.get("redirect_uri") ?? "";
      const person = personFor(login, form.get("name") ?? "", email, form.get("unverified") !== "yes");
      codes.set(code, { person, redirectUri, expires: Date.now() + 60_000 });
      const target = new URL(redirectUri);
      target.searchParams.set("code", code);
      target.searchParams.set("state", form.get("state") ?? "");
      return send(response, 302, "", { Location: target.toString() });
    }
    if (url.pathname === "/login/oauth/access_token" && request.method === "POST") {
      const [id, secret] = Buffer.from((request.headers.authorization ?? "").replace(/^Basic /, ""), "base64")
        .toString()
        .split(":");
      if (decodeURIComponent(id ?? "") !== clientId || decodeURIComponent(secret ?? "") !== clientSecret) {
        return send(response, 401, { error: "incorrect_client_credentials", error_description: "Unknown client." });
      }
      const form = new URLSearchParams(await readBody(request));
      const grant = codes.get(form.get("code") ?? "");
      codes.delete(form.get("code") ?? "");
      if (!grant || grant.expires < Date.now()) {
        return send(response, 200, { error: "bad_verification_code", error_description: "The code is wrong or expired." });
      }
      const accessToken = `gho_${randomBytes(18).toString("hex")}`;
      tokens.set(accessToken, grant.person);
      return send(response, 200, { access_token: accessToken, token_type: "bearer", scope: "read:user,user:email" });
    }
    if (url.pathname === "/user" && request.method === "GET") {
      const person = bearer(request);
      if (!person) return send(response, 401, { message: "Bad credentials" });
      return send(response, 200, { id: person.id, login: person.login, name: person.name, email: person.email, avatar_url: null });
    }
    if (url.pathname === "/user/emails" && request.method === "GET") {
      const person = bearer(request);
      if (!person) return send(response, 401, { message: "Bad credentials" });
      return send(response, 200, [{ email: person.email, primary: true, verified: person.verified, visibility: "private" }]);
    }
    send(response, 404, { message: "Not Found" });
  } catch (error) {
    send(response, 500, { message: error instanceof Error ? error.message : String(error) });
  }
});

server.listen(port, "127.0.0.1", () => console.log(`fake GitHub on http://127.0.0.1:${port}`));
for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => server.close(() => process.exit(0)));
