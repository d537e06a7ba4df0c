// Requests per API token per minute, counted in this process (one app server).
import { config } from "./config.server";
import { requestFromLoopback, servedOnLoopback } from "./loopback.server";

const windows = new Map<string, { startedAt: number; count: number }>();
const WINDOW_MS = 60_000;

/**
 * GAITLOOM_RATE_LIMITS=off lifts the limit for the probe (npm run probe),
 * which sends thousands of requests with one token: only for a request from
 * loopback to an app whose public address is loopback too.
 */
export function rateLimitsLifted(): boolean {
  return process.env.GAITLOOM_RATE_LIMITS === "off" && requestFromLoopback() && servedOnLoopback();
}

export function checkRateLimit(key: string, now = Date.now()): { ok: true } | { ok: false; retryAfterS: number } {
  if (rateLimitsLifted()) return { ok: true };
  const limit = config().tokenRequestsPerMinute;
  const current = windows.get(key);
  if (!current || now - current.startedAt >= WINDOW_MS) {
    windows.set(key, { startedAt: now, count: 1 });
    return { ok: true };
  }
  if (current.count >= limit) return { ok: false, retryAfterS: Math.ceil((current.startedAt + WINDOW_MS - now) / 1000) };
  current.count += 1;
  return { ok: true };
}

export function resetRateLimits(): void {
  windows.clear();
}
