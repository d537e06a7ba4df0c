// The heavy work of requests (solves, table builds, URDF imports) on a pool
// of worker threads, so the request thread keeps answering while it runs: the
// largest allowed solve would otherwise hold up every other request for
// seconds. piscina keeps max(1, cores − 1) threads, one core left to the
// request thread. The tasks are app/workers/core-tasks.ts: plain data in,
// strings and bytes out.
//
// A request that would wait longer than the queue budget for a thread
// (config: workerPool.queueBudgetMs) is refused with 503 and Retry-After
// rather than queued: the wait is the tasks ahead of it times the recent mean
// task time, spread over the threads. GAITLOOM_SOLVE_POOL=off runs the tasks
// on the request thread instead, for comparison.
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { Piscina } from "piscina";
import { CORE_TASKS, type CoreTaskInput, type CoreTaskName, type CoreTaskOutput } from "../workers/core-tasks";
import type { WorkerAnswer, WorkerRequest } from "../workers/core-worker";
import { config } from "./config.server";
import { ServiceError } from "./errors.server";

/** The weight of the newest task in the mean task time: recent tasks count, one odd task does not swing it. */
const NEWEST_TASK_WEIGHT = 0.2;

/**
 * The worker's entry: the compiled one the build puts beside the server bundle
 * (build/server/core-worker.js), or in the source tree (tests, dev) the .mjs
 * that registers tsx and loads the TypeScript one.
 */
function workerFile(): string {
  const here = path.dirname(fileURLToPath(import.meta.url));
  const candidates = [path.join(here, "core-worker.js"), path.resolve(here, "../workers/core-worker.mjs")];
  const found = candidates.find((candidate) => existsSync(candidate));
  if (!found) throw new Error(`No worker entry: looked for ${candidates.join(" and ")}; \`npx react-router build\` makes the first.`);
  return found;
}

let workers: { pool: Piscina<WorkerRequest, WorkerAnswer>; threads: number } | null = null;
let inFlight = 0;
let completed = 0;
let meanTaskMs = 0;

function startedPool() {
  if (!workers) {
    const threads = Math.max(1, Math.floor(config().workerPool.threads) || 1);
    // As many threads from the start as ever: a solve should not wait for a thread to boot.
    workers = { pool: new Piscina<WorkerRequest, WorkerAnswer>({ filename: workerFile(), minThreads: threads, maxThreads: threads }), threads };
  }
  return workers;
}

const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;

function busy(waitMs: number, budgetMs: number): ServiceError {
  const retryAfterS = Math.max(1, Math.ceil(waitMs / 1000));
  return new ServiceError(
    503,
    "busy",
    `The server is busy: this would wait about ${seconds(waitMs)} for a free worker, more than the ${seconds(budgetMs)} a request may wait. Try again in ${retryAfterS} s.`,
    { retryAfterS, waitMs: Math.round(waitMs), budgetMs },
  );
}

/**
 * Runs one of the core's tasks on a worker thread (or, with the pool off, here)
 * and gives its output. Refuses with 503 (`retryAfterS` in the details) when
 * the task would wait longer than the queue budget.
 */
export async function runCoreTask<Name extends CoreTaskName>(task: Name, input: CoreTaskInput<Name>): Promise<CoreTaskOutput<Name>> {
  const settings = config().workerPool;
  if (!settings.enabled) return (CORE_TASKS[task] as (input: CoreTaskInput<Name>) => CoreTaskOutput<Name>)(input);
  const { pool, threads } = startedPool();
  const waitMs = (inFlight * meanTaskMs) / threads;
  if (waitMs > settings.queueBudgetMs) throw busy(waitMs, settings.queueBudgetMs);
  inFlight += 1;
  try {
    const answer = (await pool.run({ task, input })) as WorkerAnswer<Name>;
    meanTaskMs = completed === 0 ? answer.workMs : meanTaskMs + NEWEST_TASK_WEIGHT * (answer.workMs - meanTaskMs);
    completed += 1;
    return answer.output;
  } finally {
    inFlight -= 1;
  }
}

/** What the pool is doing: whether its threads are running, how many tasks are in flight (running or queued), the recent mean task time. */
export function corePoolStats() {
  return { pooled: workers !== null, threads: workers?.threads ?? 0, inFlight, queued: workers?.pool.queueSize ?? 0, completed, meanTaskMs };
}

/** Stops the threads once their tasks are done (tests; the server's process ends with them). */
export async function closeCorePool(): Promise<void> {
  const closing = workers;
  workers = null;
  await closing?.pool.close();
}
