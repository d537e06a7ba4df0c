// API rate limits, counted in PostgreSQL (the rate_limits table, through
// rate-limiter-flexible's Drizzle store) so that every app process shares one
// count: each token's requests, each person's API calls with the session
// cookie, and failed token attempts per client address. Each count runs for
// a minute from its first point (config().rateLimits has the numbers).
import { RateLimiterDrizzle, RateLimiterMemory, RateLimiterRes, type RateLimiterAbstract } from "rate-limiter-flexible";
import { rateLimits } from "../../db/schema";
import type { Database } from "../../db/client";
import { config } from "./config.server";
import { database } from "./db.server";
import { clientAddress, requestFromLoopback, servedOnLoopback } from "./loopback.server";

export type Verdict = { ok: true } | { ok: false; retryAfterS: number };

type Count = "token" | "session" | "failed-token";

const WINDOW_S = 60;
const OK: Verdict = { ok: true };

/**
 * GAITLOOM_RATE_LIMITS=off lifts the limits for the probe (npm run probe),
 * which sends thousands of requests with one token: only for a request from
 * loopback to an app whose public address is loopback too.
 */
export function rateLimitsLifted(): boolean {
  return process.env.GAITLOOM_RATE_LIMITS === "off" && requestFromLoopback() && servedOnLoopback();
}

/** Counts one API request by a token (its id) or a signed-in person (their id). */
export async function countRequest(count: "token" | "session", key: string): Promise<Verdict> {
  if (rateLimitsLifted()) return OK;
  try {
    await ask(count, (limiter) => limiter.consume(key));
    return OK;
  } catch (error) {
    return refusalOf(error);
  }
}

/**
 * Whether the request's client address has used up its failed token attempts
 * this minute. Asked before the token is looked up, so that guesses from a
 * refused address learn nothing; a valid token from there waits too.
 */
export async function checkFailedTokenAttempts(): Promise<Verdict> {
  if (rateLimitsLifted()) return OK;
  const counted = await ask("failed-token", (limiter) => limiter.get(failedAttemptKey()));
  if (!counted || counted.consumedPoints < pointsOf("failed-token")) return OK;
  return refusalOf(counted);
}

/** Counts an unknown or revoked token against the request's client address. */
export async function countFailedTokenAttempt(): Promise<void> {
  if (rateLimitsLifted()) return;
  // Past the limit the consume is refused; checkFailedTokenAttempts refuses the address's next request.
  await ask("failed-token", (limiter) => limiter.consume(failedAttemptKey())).catch(refusalOf);
}

/** Forgets every count (tests). */
export async function resetRateLimits(): Promise<void> {
  inProcess.clear();
  await database().delete(rateLimits);
}

// Where no server recorded the address (a loader called in-process), such requests share one count.
const failedAttemptKey = () => clientAddress() ?? "unrecorded";

function pointsOf(count: Count): number {
  const limits = config().rateLimits;
  if (count === "token") return limits.tokenRequestsPerMinute;
  if (count === "session") return limits.sessionRequestsPerMinute;
  return limits.failedTokenAttemptsPerMinute;
}

function refusalOf(error: unknown): Verdict {
  if (error instanceof RateLimiterRes) return { ok: false, retryAfterS: Math.max(1, Math.ceil(error.msBeforeNext / 1000)) };
  throw error;
}

// Built once per pool, count and limit: each shared one runs a timer that clears old rows.
const shared = new WeakMap<Database, Map<string, RateLimiterDrizzle>>();
const inProcess = new Map<string, RateLimiterMemory>();

/**
 * Runs `operation` on the shared count. When PostgreSQL cannot answer (the
 * table locked or unwritable), this process's own count answers instead, as
 * the limit was before it was shared, and the log says so: a limit per
 * process is better than refusing every API call (a 503) for a fault in the
 * counters alone, and better than none. A count that is over its limit
 * (a RateLimiterRes) passes through as it is.
 */
async function ask<T>(count: Count, operation: (limiter: RateLimiterAbstract) => Promise<T>): Promise<T> {
  const points = pointsOf(count);
  const id = `${count}/${points}`;
  const db = database();
  let limiters = shared.get(db);
  if (!limiters) shared.set(db, (limiters = new Map()));
  let limiter = limiters.get(id);
  if (!limiter) limiters.set(id, (limiter = new RateLimiterDrizzle({ storeClient: db, schema: rateLimits, points, duration: WINDOW_S, keyPrefix: count })));
  try {
    return await operation(limiter);
  } catch (error) {
    if (error instanceof RateLimiterRes) throw error;
    console.warn(`[rate-limit] the shared ${count} count in PostgreSQL failed; this process counts on its own meanwhile: ${reasonOf(error)}`);
    let fallback = inProcess.get(id);
    if (!fallback) inProcess.set(id, (fallback = new RateLimiterMemory({ points, duration: WINDOW_S, keyPrefix: count })));
    return operation(fallback);
  }
}

// Drizzle's own message holds the whole query; PostgreSQL's, kept as the cause, says what went wrong.
function reasonOf(error: unknown): string {
  const cause = error instanceof Error && error.cause instanceof Error ? error.cause : error;
  return cause instanceof Error ? cause.message : String(cause);
}
