// Requests per API token per minute, counted in this process (one app server).
import { config } from "./config.server";

const windows = new Map<string, { startedAt: number; count: number }>();
const WINDOW_MS = 60_000;

export function checkRateLimit(key: string, now = Date.now()): { ok: true } | { ok: false; retryAfterS: number } {
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
