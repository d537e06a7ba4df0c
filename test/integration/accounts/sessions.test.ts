// Browser sessions kept in PostgreSQL: the cookie holds only a signed random
// id, so signing out — here, from the list of one's sessions, or everywhere —
// ends a session for good, and its cookie reads as signed out from then on.
import { randomBytes } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { createCookie } from "react-router";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, sessions, users } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { uniqueName } from "../../support/names";
import {
  act,
  demoIds,
  load,
  outcome,
  PUBLIC_ORIGIN,
  requestsWith,
  sessionCookieFor,
  type DemoIds,
  type FormRefusal,
  type MakeRequest,
} from "../../support/routes";
import { signInThroughGitHub } from "./support";
import { currentUser, type User } from "~/platform/access.server";
import { config } from "~/platform/config.server";
import { database } from "~/platform/db.server";
import * as accountSessions from "~/routes/account/sessions";
import * as gitHubSignIn from "~/routes/auth/github";
import * as signOut from "~/routes/auth/sign-out";
import * as welcome from "~/routes/welcome";

const FIREFOX = "Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0";
const CHROME = "Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36";
const DAY_MS = 86_400_000;

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

/** The session cookie's value as the app reads it: verified with the app's secret, then decoded. */
const cookieValue = (cookie: string): Promise<unknown> =>
  createCookie("gaitloom_session", { secrets: [config().sessionSecret] }).parse(cookie.startsWith("gaitloom_session=") ? cookie : `gaitloom_session=${cookie}`);

/** The `name=value` pair of a session cookie signed with the app's secret, holding `value`. */
const signedCookie = async (value: unknown): Promise<string> =>
  (await createCookie("gaitloom_session", { secrets: [config().sessionSecret] }).serialize(value)).split(";")[0];

/** Who the app takes a request with `cookie` (and `userAgent`) to be. */
const whoIs = async (cookie: string, userAgent?: string) =>
  (await currentUser(new Request(`${PUBLIC_ORIGIN}/`, { headers: { Cookie: cookie, ...(userAgent ? { "User-Agent": userAgent } : {}) } })))?.id ?? null;

const rowOf = async (cookie: string) => {
  const id = await cookieValue(cookie);
  return typeof id === "string" ? ((await database().select().from(sessions).where(eq(sessions.id, id)))[0] ?? null) : null;
};

async function person(label: string): Promise<User> {
  const login = uniqueName(label);
  const email = `${login}@example.test`;
  const [user] = await database()
    .insert(users)
    .values({ login, name: login, email, verifiedEmails: [email] })
    .returning();
  return user;
}

type SessionsPage = {
  sessions: { id: string; current: boolean; createdAt: Date | string; lastSeenAt: Date | string; browser: string }[];
};

const page = async (request: MakeRequest) => (await outcome<SessionsPage>(async () => load(accountSessions, await request("GET", "/account/sessions")))).body;

describe("signing out", () => {
  test("ends the session for good: the cookie from before reads as signed out, and its row is gone", async () => {
    const cookie = await sessionCookieFor(ids.userIds.owner, ids.workspaceId);
    expect(await whoIs(cookie)).toBe(ids.userIds.owner);
    const answer = await outcome(async () => act(signOut, await requestsWith(cookie)("POST", "/sign-out")));
    expect(answer.status).toBe(302);
    expect(await whoIs(cookie)).toBeNull();
    expect(await rowOf(cookie)).toBeNull();
  });

  test("with the signed-out cookie a page sends you to sign in and a form is refused with 401", async () => {
    const cookie = await sessionCookieFor(ids.userIds.viewer, ids.workspaceId);
    await act(signOut, await requestsWith(cookie)("POST", "/sign-out"));
    const request = requestsWith(cookie);
    const opened = await outcome(async () => load(welcome, await request("GET", "/welcome")));
    expect([opened.status, opened.location]).toEqual([302, "/sign-in?returnTo=%2Fwelcome"]);
    const posted = await outcome(async () => act(welcome, await request("POST", "/welcome", { form: { intent: "create", name: uniqueName("Lab") } })));
    expect(posted.status).toBe(401);
  });
});

describe("the session cookie", () => {
  test("holds only a signed random id of 32 bytes or more, nothing about the person, whose session is a row of its own", async () => {
    const cookie = await sessionCookieFor(ids.userIds.lead, ids.workspaceId);
    expect(cookie).not.toContain(ids.userIds.lead);
    expect(Buffer.from(cookie.slice("gaitloom_session=".length).split(".")[0], "base64").toString()).not.toContain(ids.userIds.lead);
    const id = await cookieValue(cookie);
    expect(typeof id).toBe("string");
    expect(Buffer.from(id as string, "base64url").length).toBeGreaterThanOrEqual(32);
    const row = await rowOf(cookie);
    expect(row?.userId).toBe(ids.userIds.lead);
  });

  test("a tampered cookie, a signed id of no session and a signed value that is no id read as signed out, and no form fails on them", async () => {
    const cookie = await sessionCookieFor(ids.userIds.lead, ids.workspaceId);
    const tampered = cookie.slice(0, -2) + (cookie.endsWith("AA") ? "BB" : "AA");
    const unknown = await signedCookie(randomBytes(32).toString("base64url"));
    const notAnId = await signedCookie({ userId: ids.userIds.owner, workspaceId: ids.workspaceId });
    for (const stale of [tampered, unknown, notAnId]) {
      expect(await whoIs(stale)).toBeNull();
      const signIn = await outcome(async () => act(gitHubSignIn, await requestsWith(stale)("POST", "/auth/github", { form: { returnTo: "/robots" } })));
      expect(signIn.status).toBe(302);
    }
  });

  test("signing in starts a new session: the visitor's session before it, which carried the return address, is gone", async () => {
    const { visitorCookie, cookie } = await signInThroughGitHub({ login: "kenji-wu" });
    expect(await cookieValue(cookie)).not.toEqual(await cookieValue(visitorCookie));
    expect(await rowOf(visitorCookie)).toBeNull();
    expect(await whoIs(cookie)).toBe(ids.userIds.viewer);
  });

  test("a session ends 30 days after it starts at the latest; an expired one reads as signed out and its row is removed", async () => {
    const cookie = await sessionCookieFor(ids.userIds.animator, ids.workspaceId);
    const row = (await rowOf(cookie))!;
    const lifetimeMs = row.expiresAt.getTime() - row.createdAt.getTime();
    expect(lifetimeMs).toBeLessThanOrEqual(30 * DAY_MS + 60_000);
    expect(lifetimeMs).toBeGreaterThan(29 * DAY_MS);
    await database()
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(sessions.id, row.id));
    expect(await whoIs(cookie)).toBeNull();
    expect(await rowOf(cookie)).toBeNull();
  });

  test("last seen and the browser are written at most once every few minutes, not on every request", async () => {
    const cookie = await sessionCookieFor(ids.userIds.firmware, ids.workspaceId);
    const row = (await rowOf(cookie))!;
    const tenMinutesAgo = new Date(Date.now() - 10 * 60_000);
    await database().update(sessions).set({ lastSeenAt: tenMinutesAgo }).where(eq(sessions.id, row.id));
    await whoIs(cookie, FIREFOX);
    const seen = (await rowOf(cookie))!;
    expect(seen.lastSeenAt.getTime()).toBeGreaterThan(tenMinutesAgo.getTime() + 9 * 60_000);
    expect(seen.userAgent).toBe(FIREFOX);
    await whoIs(cookie, FIREFOX);
    await whoIs(cookie, FIREFOX);
    expect((await rowOf(cookie))!.lastSeenAt).toEqual(seen.lastSeenAt);
  });
});

describe("the account's sessions", () => {
  test("are listed — created, last seen, browser — with this one marked, none of anyone else's, and no session's own id", async () => {
    const me = await person("lister");
    const other = await person("other");
    const here = await sessionCookieFor(me.id);
    const there = await sessionCookieFor(me.id);
    await sessionCookieFor(other.id);
    await whoIs(there, FIREFOX);
    const listed = await page(requestsWith(here, { "User-Agent": CHROME }));
    expect(listed.sessions).toHaveLength(2);
    expect(listed.sessions.filter((entry) => entry.current)).toHaveLength(1);
    const current = listed.sessions.find((entry) => entry.current)!;
    const elsewhere = listed.sessions.find((entry) => !entry.current)!;
    expect(current.browser).toMatch(/Chrome/);
    expect(elsewhere.browser).toMatch(/Firefox/);
    for (const entry of listed.sessions) {
      expect(new Date(entry.createdAt).getTime()).toBeGreaterThan(Date.now() - 60_000);
      expect(new Date(entry.lastSeenAt).getTime()).toBeGreaterThan(Date.now() - 60_000);
    }
    const ownIds = await Promise.all([here, there].map(cookieValue));
    expect(JSON.stringify(listed)).not.toContain(ownIds[0]);
    expect(JSON.stringify(listed)).not.toContain(ownIds[1]);
  });

  test("signing out everywhere ends every session of the person, this one too, and no one else's; the audit log keeps it", async () => {
    const me = await person("everywhere");
    const other = await person("bystander");
    const here = await sessionCookieFor(me.id);
    const there = await sessionCookieFor(me.id);
    const theirs = await sessionCookieFor(other.id);
    const answer = await outcome(async () => act(accountSessions, await requestsWith(here)("POST", "/account/sessions", { form: { intent: "end-all" } })));
    expect(answer.status).toBe(302);
    expect(answer.headers.get("Set-Cookie")).toMatch(/gaitloom_session=;.*Expires=Thu, 01 Jan 1970/i);
    expect([await whoIs(here), await whoIs(there), await whoIs(theirs)]).toEqual([null, null, other.id]);
    const audit = await database()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.actorId, me.id), eq(auditLog.action, "user.signed-out-everywhere")));
    expect(audit).toHaveLength(1);
    expect(audit[0].details).toMatchObject({ sessions: 2 });
  });

  test("one other session ended from the list ends only it; another person's is not found", async () => {
    const me = await person("ender");
    const other = await person("stranger");
    const here = await sessionCookieFor(me.id);
    const there = await sessionCookieFor(me.id);
    const theirs = await sessionCookieFor(other.id);
    const request = requestsWith(here);
    const elsewhere = (await page(request)).sessions.find((entry) => !entry.current)!;
    const ended = await outcome(async () =>
      act(accountSessions, await request("POST", "/account/sessions", { form: { intent: "end", sessionId: elsewhere.id } })),
    );
    expect(ended.status).toBe(200);
    expect([await whoIs(here), await whoIs(there)]).toEqual([me.id, null]);

    const someoneElses = (await page(requestsWith(theirs))).sessions[0];
    const refused = await outcome<FormRefusal>(async () =>
      act(accountSessions, await request("POST", "/account/sessions", { form: { intent: "end", sessionId: someoneElses.id } })),
    );
    expect(refused.status).toBe(404);
    expect(await whoIs(theirs)).toBe(other.id);
  });
});
