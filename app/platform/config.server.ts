// Settings from the environment, read once. `npm start` and `npm test` set the
// local values; production sets them itself (see the README).
import { availableParallelism } from "node:os";

export type Mode = "local" | "test" | "production";

function required(name: string, fallback?: string): string {
  const value = process.env[name] ?? fallback;
  if (!value) throw new Error(`${name} is not set; see "Running in production" in the README.`);
  return value;
}

/** A count from the environment: a whole number from 1, or refused (NaN or 0 would silently mean no limit or none allowed). */
function wholeNumber(name: string, fallback: number): number {
  const text = process.env[name];
  if (text === undefined) return fallback;
  if (!/^[1-9]\d*$/.test(text.trim())) throw new Error(`${name} must be a whole number from 1 (got ${JSON.stringify(text)}).`);
  return Number(text);
}

export function config() {
  const mode = (process.env.GAITLOOM_ENV ?? "production") as Mode;
  const local = mode !== "production";
  const publicUrl = required("PUBLIC_URL", local ? "http://127.0.0.1:3000" : undefined).replace(/\/$/, "");
  return {
    mode,
    local,
    publicUrl,
    sessionSecret: required("SESSION_SECRET", local ? "gaitloom-local-session-secret" : undefined),
    github: {
      clientId: required("GITHUB_CLIENT_ID", local ? "gaitloom-local" : undefined),
      clientSecret: required("GITHUB_CLIENT_SECRET", local ? "gaitloom-local-secret" : undefined),
      // The real service unless pointed elsewhere (the local fake, or GitHub Enterprise).
      oauthUrl: (process.env.GITHUB_OAUTH_URL ?? "https://github.com").replace(/\/$/, ""),
      apiUrl: (process.env.GITHUB_API_URL ?? "https://api.github.com").replace(/\/$/, ""),
    },
    mail: {
      smtpUrl: required("SMTP_URL", local ? "smtp://127.0.0.1:2525" : undefined),
      from: process.env.MAIL_FROM ?? "Gaitloom <gaitloom@127.0.0.1>",
      // The local fake's message list, shown in the app's inbox page (never in production).
      inboxUrl: local ? (process.env.MAIL_INBOX_URL ?? "http://127.0.0.1:2526") : null,
      // Delivery by the job runner: a failed try is retried up to retryLimit times, the
      // n-th retry after retryDelay·2^(n−1) to twice that (pg-boss's backoff). Production:
      // 8 retries from 15 s give up after 1.1 to 2.1 hours; npm start after 8.5 to 17
      // minutes; npm test after 31 to 62 seconds.
      retryLimit: Number(process.env.GAITLOOM_MAIL_RETRY_LIMIT ?? (mode === "test" ? 5 : 8)),
      retryDelaySeconds: Number(process.env.GAITLOOM_MAIL_RETRY_DELAY_S ?? (mode === "production" ? 15 : mode === "local" ? 2 : 1)),
    },
    // The job runner (app/jobs): how often an idle worker asks for a job, how often
    // work that lost its job is looked for, and how long a stop waits for running jobs.
    jobs: {
      pollSeconds: Number(process.env.GAITLOOM_JOB_POLL_S ?? (local ? 0.5 : 2)),
      sweepSeconds: Number(process.env.GAITLOOM_JOB_SWEEP_S ?? (local ? 5 : 60)),
      // Under the 5 s the start and test scripts give a service before they kill it.
      stopTimeoutMs: 4_000,
    },
    // Counted in PostgreSQL, shared by every app process (app/platform/rate-limit.server.ts).
    rateLimits: {
      tokenRequestsPerMinute: wholeNumber("GAITLOOM_TOKEN_REQUESTS_PER_MINUTE", 120),
      // The editor sends up to two (autosave, reference solve) per pause in editing: some 170 a minute in a busy tab.
      sessionRequestsPerMinute: wholeNumber("GAITLOOM_SESSION_API_REQUESTS_PER_MINUTE", 600),
      // Unknown or revoked tokens per client address; a person retyping a token needs a few.
      failedTokenAttemptsPerMinute: wholeNumber("GAITLOOM_FAILED_TOKEN_ATTEMPTS_PER_MINUTE", 10),
    },
    // Solves, table builds and URDF imports run on worker threads (app/platform/worker-pool.server.ts),
    // one core left to the request thread. GAITLOOM_SOLVE_POOL=off runs them on the request thread, for comparison.
    workerPool: {
      enabled: process.env.GAITLOOM_SOLVE_POOL !== "off",
      threads: Number(process.env.GAITLOOM_SOLVE_THREADS ?? Math.max(1, availableParallelism() - 1)),
      // The longest a task may expect to wait for a thread; beyond it the request is refused with 503 and Retry-After.
      queueBudgetMs: Number(process.env.GAITLOOM_SOLVE_QUEUE_BUDGET_MS ?? 10_000),
    },
  };
}
