// The return address after sign-in and after a workspace switch, through the
// routes that take it: the sign-in page, POST /auth/github (which keeps it in
// the session for the callback) and POST /workspace. A crafted address never
// leads off the site, and no address makes a route fail.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, outcome, requestsAs, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import { sessionStorage } from "~/platform/session.server";
import * as gitHubSignIn from "~/routes/auth/github";
import * as signIn from "~/routes/auth/sign-in";
import * as gaitList from "~/routes/gaits/list";
import * as workspaceSwitch from "~/routes/workspace-switch";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

// [what it is, the address as sent, where the person lands]
const ADDRESSES: [string, string, string][] = [
  ["a tab browsers drop (//evil.example)", "/\t/evil.example", "/"],
  ["a CR LF pair", "/gaits\r\nSet-Cookie: x=1", "/"],
  ["a backslash", "/\\evil.example", "/"],
  ["a path beyond Latin-1", "/gaits/Kőhíd", "/gaits/K%C5%91h%C3%ADd"],
  ["an ordinary path", "/gaits?sort=date", "/gaits?sort=date"],
];

describe("the sign-in page sends a signed-in person on, never off the site", () => {
  test.each(ADDRESSES)("%s", async (_label, returnTo, expected) => {
    const request = await requestsAs("owner", ids);
    const answer = await outcome(async () => load(signIn, await request("GET", `/sign-in?returnTo=${encodeURIComponent(returnTo)}`)));
    expect(answer.status).toBe(302);
    expect(answer.location).toBe(expected);
  });

  test("a signed-out person gets the form with the checked address in it", async () => {
    const request = await requestsAs("signed-out", ids);
    const answer = await outcome(async () => load(signIn, await request("GET", `/sign-in?returnTo=${encodeURIComponent("/\t/evil.example")}`)));
    expect(answer.body).toEqual({ returnTo: "/", invitation: null });
  });
});

describe("POST /auth/github keeps only a checked address for the callback", () => {
  test.each(ADDRESSES)("%s", async (_label, returnTo, expected) => {
    const request = await requestsAs("signed-out", ids);
    const answer = await outcome(async () => act(gitHubSignIn, await request("POST", "/auth/github", { form: { returnTo } })));
    expect(answer.status).toBe(302);
    const cookie = answer.headers
      .getSetCookie()
      .map((header) => header.split(";")[0])
      .find((pair) => pair.startsWith("gaitloom_session="));
    expect(cookie, "the session cookie carries the return address").toBeDefined();
    const session = await sessionStorage().getSession(cookie);
    expect(session.get("returnTo")).toBe(expected);
  });
});

describe("POST /workspace returns to a checked address", () => {
  test.each(ADDRESSES)("%s", async (_label, returnTo, expected) => {
    const request = await requestsAs("owner", ids);
    const answer = await outcome(async () => act(workspaceSwitch, await request("POST", "/workspace", { form: { workspaceId: ids.workspaceId, returnTo } })));
    expect(answer.status).toBe(302);
    expect(answer.location).toBe(expected);
  });
});

describe("a page asked for while signed out sends to sign-in with its own address", () => {
  test("the path and query, encoded", async () => {
    const request = await requestsAs("signed-out", ids);
    const answer = await outcome(async () => load(gaitList, await request("GET", "/gaits?sort=date")));
    expect(answer.status).toBe(302);
    expect(answer.location).toBe(`/sign-in?returnTo=${encodeURIComponent("/gaits?sort=date")}`);
  });

  // The probe's 16 KB query once gave a Location longer than Node's 16 KB header limit; sign-in would drop it anyway (2 KB at most).
  test("only the path when the query makes the address longer than sign-in keeps", async () => {
    const request = await requestsAs("signed-out", ids);
    const answer = await outcome(async () => load(gaitList, await request("GET", `/gaits?q=${"x".repeat(16 * 1024)}`)));
    expect(answer.status).toBe(302);
    expect(answer.location).toBe(`/sign-in?returnTo=${encodeURIComponent("/gaits")}`);
  });
});
