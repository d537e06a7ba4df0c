// The job queue as the app uses it: pg-boss 10 in the schema our migrations
// create (db/job-queue-schema.ts). A job is written inside the transaction of
// the action that asks for it, so it exists exactly when the action committed;
// the job runner process (app/jobs) works the queues its definitions name.
import { sql } from "drizzle-orm";
import PgBoss from "pg-boss";
import { JOB_QUEUE_SCHEMA } from "../../db/job-queue-schema";
import type { Tx } from "./db.server";

/** How a queue retries: pg-boss's retryLimit, retryDelay (s, doubled each retry with backoff) and expiry of a running job. */
export type QueueSettings = { retryLimit: number; retryDelaySeconds: number; retryBackoff: boolean; expireInSeconds: number };

/** One job as a definition's `work` gets it; `retryCount` is 0 on the first try and `retryLimit` on the last. */
export type Job<Data> = { id: string; data: Data; retryCount: number; retryLimit: number };

/**
 * What the runner needs to work a queue: its name, settings (read when the
 * runner starts), the work for one job (throw to have it retried), how many
 * jobs one runner works at once, and optionally a sweep that finds work whose
 * job was lost and names the jobs to send for it (sent with their id, so a job
 * that still exists is not sent twice).
 */
export type JobDefinition<Data extends object> = {
  queue: string;
  settings: () => QueueSettings;
  work: (job: Job<Data>) => Promise<void>;
  workers?: number;
  sweep?: () => Promise<{ id: string; data: Data }[]>;
};

// Used only to write jobs through a transaction's connection, never started:
// the runner has its own, with its own pool.
let writer: PgBoss | undefined;

function jobWriter(): PgBoss {
  writer ??= new PgBoss({
    db: { executeSql: () => Promise.reject(new Error("Jobs are written only inside a transaction: enqueueJob(tx, …).")) },
    schema: JOB_QUEUE_SCHEMA,
    migrate: false,
    supervise: false,
    schedule: false,
  });
  return writer;
}

/** pg-boss's SQL with $n parameters, run on the transaction's connection. */
function throughTransaction(tx: Tx): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const query = sql.empty();
      // split() with a capture group alternates text and parameter numbers.
      text.split(/\$(\d+)/).forEach((part, index) => {
        if (index % 2 === 0) query.append(sql.raw(part));
        else query.append(sql`${driverValue(values[Number(part) - 1])}`);
      });
      return { rows: [...(await tx.execute(query))] };
    },
  };
}

// pg sends undefined as NULL and objects as JSON; postgres.js refuses undefined and does neither.
function driverValue(value: unknown): unknown {
  if (value === undefined) return null;
  if (value !== null && typeof value === "object" && !(value instanceof Date)) return JSON.stringify(value);
  return value;
}

/**
 * Adds a job to `queue` in the caller's transaction. Null when no job was
 * written: the queue does not exist yet (no runner has started on this
 * database) or a job with this id exists; the queue's sweep covers the first.
 */
export async function enqueueJob<Data extends object>(tx: Tx, queue: string, data: Data, options: { id?: string } = {}): Promise<string | null> {
  return jobWriter().send(queue, data, { ...(options.id ? { id: options.id } : {}), db: throughTransaction(tx) });
}
