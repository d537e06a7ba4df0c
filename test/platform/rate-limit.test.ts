// GAITLOOM_RATE_LIMITS=off (for npm run probe) holds only for a request that
// server.js saw come in on a loopback socket, to an app whose public address
// is loopback too; and the limits' settings. The counting itself needs the
// database: test/integration/api/rate-limits.test.ts.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { forgetPeers, fromPeer, recordPeers } from "../support/peers";
import { config } from "~/platform/config.server";
import { rateLimitsLifted } from "~/platform/rate-limit.server";

beforeEach(() => {
  vi.stubEnv("PUBLIC_URL", "http://127.0.0.1:3000");
  recordPeers();
});

afterEach(() => {
  vi.unstubAllEnvs();
  forgetPeers();
});

describe("GAITLOOM_RATE_LIMITS=off", () => {
  test("lifts the limits for a request from loopback to an app on loopback", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    expect(fromPeer("127.0.0.1", () => rateLimitsLifted())).toBe(true);
    expect(fromPeer("::1", () => rateLimitsLifted())).toBe(true);
  });

  test("but not for a request from another address", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    expect(fromPeer("198.51.100.7", () => rateLimitsLifted())).toBe(false);
  });

  test("nor where the server did not record the address (no store: another server, or a loader called directly)", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    forgetPeers();
    expect(rateLimitsLifted()).toBe(false);
  });

  test("nor when the app's public address is not loopback (behind a proxy on the same host every request comes from loopback)", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "off");
    vi.stubEnv("PUBLIC_URL", "https://gaitloom.example");
    expect(fromPeer("127.0.0.1", () => rateLimitsLifted())).toBe(false);
  });

  test("any other value keeps the limits", () => {
    vi.stubEnv("GAITLOOM_RATE_LIMITS", "false");
    expect(fromPeer("127.0.0.1", () => rateLimitsLifted())).toBe(false);
  });
});

describe("the limits' settings", () => {
  test("default to 120 requests a minute per token, 600 per person with the session cookie, 10 failed token attempts per client address", () => {
    expect(config().rateLimits).toEqual({ tokenRequestsPerMinute: 120, sessionRequestsPerMinute: 600, failedTokenAttemptsPerMinute: 10 });
  });

  test("are read from the environment", () => {
    vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", "30");
    vi.stubEnv("GAITLOOM_SESSION_API_REQUESTS_PER_MINUTE", "90");
    vi.stubEnv("GAITLOOM_FAILED_TOKEN_ATTEMPTS_PER_MINUTE", "5");
    expect(config().rateLimits).toEqual({ tokenRequestsPerMinute: 30, sessionRequestsPerMinute: 90, failedTokenAttemptsPerMinute: 5 });
  });

  test.each(["abc", "0", "-5", "2.5", ""])(
    "a limit that is not a whole number from 1 (%j) is refused with the variable's name, not taken as no limit",
    (value) => {
      vi.stubEnv("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", value);
      expect(() => config()).toThrow(/GAITLOOM_TOKEN_REQUESTS_PER_MINUTE/);
    },
  );
});
