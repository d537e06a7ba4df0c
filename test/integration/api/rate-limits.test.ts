// Rate limits on /api/v1, counted in PostgreSQL so that every app process
// shares them: each token's requests, each signed-in person's API calls with
// the session cookie, and failed token attempts per client address. The
// limits are stubbed small where the number itself is not the point.
import { sql } from "drizzle-orm";
import { afterEach, beforeAll, beforeEach, describe, expect, test, vi } from "vitest";
import { seedDemo } from "../../../db/seed";
import { forgetPeers, fromPeer, recordPeers } from "../../support/peers";
import { bearer, demoIds, load, memberAs, outcome, requestsAs, type ApiRefusal, type DemoIds } from "../../support/routes";
import { createToken, revokeToken } from "~/features/accounts/tokens.server";
import type { Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { resetRateLimits } from "~/platform/rate-limit.server";
import * as workspaceRoute from "~/routes/api.v1/workspace";

type RouteModule = typeof workspaceRoute;

let ids: DemoIds;
let firmware: Member;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  firmware = await memberAs("firmware", ids);
});

beforeEach(async () => {
  await resetRateLimits();
  recordPeers();
});

afterEach(() => {
  vi.unstubAllEnvs();
  vi.useRealTimers();
  vi.restoreAllMocks();
  forgetPeers();
});

const UNKNOWN_TOKEN = `gl_${"Q".repeat(43)}`;

/** GET /api/v1/workspace with a token, from `address`, through a route module (of this process unless given another's). */
const withToken = (token: string, address = "198.51.100.20", route: RouteModule = workspaceRoute) =>
  fromPeer(address, () => outcome<ApiRefusal>(() => load(route, bearer("/api/v1/workspace", token))));

const statusesOf = (answers: { status: number }[]) => answers.map((answer) => answer.status);
const tally = (statuses: number[]) => statuses.reduce<Record<number, number>>((counts, status) => ({ ...counts, [status]: (counts[status] ?? 0) + 1 }), {});

function expectRateLimited(answer: { status: number; headers: Headers; body: ApiRefusal }) {
  expect(answer.status).toBe(429);
  expect(answer.body.error.code).toBe("rate_limited");
  const retryAfterS = Number(answer.headers.get("Retry-After"));
  expect(retryAfterS, "Retry-After, in seconds").toBeGreaterThanOrEqual(1);
  expect(retryAfterS, "Retry-After, in seconds").toBeLessThanOrEqual(60);
  expect(answer.body.error.message).toContain(`${retryAfterS} s`);
}

describe("each token: 120 requests a minute, shared by every app process", () => {
  test("Rate limit: two app processes on one database give one token 120 requests a minute in total, not 240", async () => {
    const { token } = await createToken(firmware, "two processes");
    // The second process: the app's modules loaded again, with their own connection pool to the same database.
    vi.resetModules();
    const otherRoute = (await import("~/routes/api.v1/workspace")) as RouteModule;
    const otherDatabase = await import("~/platform/db.server");
    try {
      const answers = [];
      for (let i = 0; i < 240; i++) answers.push(await withToken(token, "198.51.100.20", i % 2 === 0 ? workspaceRoute : otherRoute));
      const statuses = statusesOf(answers);
      expect(tally(statuses), "answers to 240 requests, alternating between the two processes").toEqual({ 200: 120, 429: 120 });
      expect(statuses.slice(0, 120).every((status) => status === 200)).toBe(true);
      expectRateLimited(answers[120]);
      expectRateLimited(answers[239]);
    } finally {
      await otherDatabase.closeDatabase();
    }
  });

  test("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE sets the limit, and a new minute gives the token its requests again", async () => {
    vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", "3");
    vi.useFakeTimers({ toFake: ["Date"], now: new Date() });
    const { token } = await createToken(firmware, "a minute later");
    const first = [];
    for (let i = 0; i < 4; i++) first.push(await withToken(token));
    expect(statusesOf(first)).toEqual([200, 200, 200, 429]);
    vi.setSystemTime(Date.now() + 61_000);
    expect((await withToken(token)).status, "61 s later").toBe(200);
  });

  test("each token has its own count", async () => {
    vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", "2");
    const busy = await createToken(firmware, "busy");
    const quiet = await createToken(firmware, "quiet");
    for (let i = 0; i < 3; i++) await withToken(busy.token);
    expectRateLimited(await withToken(busy.token));
    expect((await withToken(quiet.token)).status).toBe(200);
  });
});

describe("API calls with the session cookie: a limit per person", () => {
  const withCookie = async (role: "lead" | "animator") =>
    fromPeer("198.51.100.30", async () =>
      outcome<ApiRefusal>(async () => load(workspaceRoute, await (await requestsAs(role, ids))("GET", "/api/v1/workspace"))),
    );

  test("past GAITLOOM_SESSION_API_REQUESTS_PER_MINUTE, 429 with Retry-After; another person from the same address is not counted with them", async () => {
    vi.stubEnv("GAITLOOM_SESSION_API_REQUESTS_PER_MINUTE", "3");
    const answers = [];
    for (let i = 0; i < 4; i++) answers.push(await withCookie("lead"));
    expect(statusesOf(answers)).toEqual([200, 200, 200, 429]);
    expectRateLimited(answers[3]);
    expect((await withCookie("animator")).status).toBe(200);
  });
});

describe("failed token attempts: a small number a minute per client address", () => {
  test("after GAITLOOM_FAILED_TOKEN_ATTEMPTS_PER_MINUTE unknown or revoked tokens from one address, the next request is 429 with Retry-After, even with a valid token", async () => {
    vi.stubEnv("GAITLOOM_FAILED_TOKEN_ATTEMPTS_PER_MINUTE", "3");
    const { token: revoked, row } = await createToken(firmware, "to revoke");
    await revokeToken(firmware, row.id);
    const { token: valid } = await createToken(firmware, "valid");
    const failed = [await withToken(UNKNOWN_TOKEN, "203.0.113.7"), await withToken(revoked, "203.0.113.7"), await withToken(UNKNOWN_TOKEN, "203.0.113.7")];
    expect(statusesOf(failed)).toEqual([401, 401, 401]);
    expectRateLimited(await withToken(UNKNOWN_TOKEN, "203.0.113.7"));
    // Refused before the token is looked up, so that guesses from the address learn nothing until the minute is over.
    expectRateLimited(await withToken(valid, "203.0.113.7"));
    // Another address is counted on its own.
    expect((await withToken(UNKNOWN_TOKEN, "203.0.113.8")).status).toBe(401);
    expect((await withToken(valid, "203.0.113.8")).status).toBe(200);
  });

  test("by default ten a minute, and a valid token's requests are not failures", async () => {
    const { token: valid } = await createToken(firmware, "busy but right");
    for (let i = 0; i < 20; i++) expect((await withToken(valid, "203.0.113.9")).status).toBe(200);
    const failed = [];
    for (let i = 0; i < 11; i++) failed.push(await withToken(UNKNOWN_TOKEN, "203.0.113.9"));
    expect(tally(statusesOf(failed))).toEqual({ 401: 10, 429: 1 });
    expect(failed[10].status).toBe(429);
  });
});

describe("GAITLOOM_RATE_LIMITS=off (npm run probe)", () => {
  test("lifts all three limits for a request from loopback to an app on loopback", async () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    vi.stubEnv("PUBLIC_URL", "http://127.0.0.1:3000");
    vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", "1");
    vi.stubEnv("GAITLOOM_SESSION_API_REQUESTS_PER_MINUTE", "1");
    vi.stubEnv("GAITLOOM_FAILED_TOKEN_ATTEMPTS_PER_MINUTE", "1");
    const { token } = await createToken(firmware, "probe");
    const asLead = await requestsAs("lead", ids);
    for (let i = 0; i < 3; i++) {
      expect((await withToken(token, "127.0.0.1")).status).toBe(200);
      expect((await withToken(UNKNOWN_TOKEN, "127.0.0.1")).status).toBe(401);
      expect((await fromPeer("127.0.0.1", async () => outcome(async () => load(workspaceRoute, await asLead("GET", "/api/v1/workspace"))))).status).toBe(200);
    }
    // From anywhere else the limits hold.
    await withToken(token, "198.51.100.40");
    expect((await withToken(token, "198.51.100.40")).status).toBe(429);
  });
});

describe("when the counters cannot be read or written", () => {
  test("the request is answered, not a 500: a warning is logged and this process counts on its own meanwhile", async () => {
    vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", "3");
    const warnings = vi.spyOn(console, "warn").mockImplementation(() => {});
    const { token } = await createToken(firmware, "database trouble");
    await database().execute(sql`alter table rate_limits rename to rate_limits_away`);
    try {
      const answers = [];
      for (let i = 0; i < 4; i++) answers.push(await withToken(token));
      expect(statusesOf(answers)).toEqual([200, 200, 200, 429]);
      expectRateLimited(answers[3]);
      expect(warnings).toHaveBeenCalled();
      expect(String(warnings.mock.calls[0][0])).toMatch(/rate.?limit/i);
    } finally {
      await database().execute(sql`alter table rate_limits_away rename to rate_limits`);
    }
  });
});
