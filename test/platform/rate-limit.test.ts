// GAITLOOM_RATE_LIMITS=off (for npm run probe) holds only for a request that
// server.js saw come in on a loopback socket, to an app whose public address
// is loopback too.
import { AsyncLocalStorage } from "node:async_hooks";
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { REQUEST_PEER, type RequestPeer } from "~/platform/loopback.server";
import { checkRateLimit, rateLimitsLifted, resetRateLimits } from "~/platform/rate-limit.server";

const peers = new AsyncLocalStorage<RequestPeer>();
const asRequestFrom = <T>(loopback: boolean, run: () => T) => peers.run({ loopback }, run);

beforeEach(() => {
  resetRateLimits();
  vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", "2");
  vi.stubEnv("PUBLIC_URL", "http://127.0.0.1:3000");
  (globalThis as { [REQUEST_PEER]?: unknown })[REQUEST_PEER] = peers;
});

afterEach(() => {
  vi.unstubAllEnvs();
  delete (globalThis as { [REQUEST_PEER]?: unknown })[REQUEST_PEER];
});

const third = (now: number) => {
  checkRateLimit("token", now);
  checkRateLimit("token", now);
  return checkRateLimit("token", now);
};

describe("the per-token rate limit", () => {
  test("the third request in a minute over a limit of two is refused, with when to retry", () => {
    expect(asRequestFrom(true, () => third(0))).toEqual({ ok: false, retryAfterS: 60 });
  });

  test("GAITLOOM_RATE_LIMITS=off lifts it for a request from loopback to an app on loopback", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    expect(asRequestFrom(true, () => rateLimitsLifted())).toBe(true);
    expect(asRequestFrom(true, () => third(0))).toEqual({ ok: true });
  });

  test("but not for a request from another address", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    expect(asRequestFrom(false, () => third(0)).ok).toBe(false);
  });

  test("nor where the server did not record the address (no store: another server, or a loader called directly)", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    expect(rateLimitsLifted()).toBe(false);
    expect(third(0).ok).toBe(false);
  });

  test("nor when the app's public address is not loopback (behind a proxy on the same host every request comes from loopback)", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    vi.stubEnv("PUBLIC_URL", "https://gaitloom.example");
    expect(asRequestFrom(true, () => third(0)).ok).toBe(false);
  });

  test("any other value keeps the limit", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "false");
    expect(asRequestFrom(true, () => third(0)).ok).toBe(false);
  });
});
