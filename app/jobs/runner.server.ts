// The job runner: pg-boss on its own connection pool, the schema left to our
// migrations (`migrate: false`; it refuses a schema of another version), each
// queue of app/jobs/index.server.ts created or updated with its settings and
// worked, and each queue's sweep run at start and then every few seconds.
// Any number of runners may share one database: pg-boss hands each job to one.
import PgBoss from "pg-boss";
import { databaseUrl } from "../../db/client";
import { JOB_QUEUE_SCHEMA } from "../../db/job-queue-schema";
import { config } from "../platform/config.server";
import { closeDatabase } from "../platform/db.server";
import type { JobDefinition, QueueSettings } from "../platform/jobs.server";
import { closeMailTransport } from "../platform/mail.server";
import { JOBS } from "./index.server";

export type JobRunner = { queues: string[]; stop: () => Promise<void> };

const queueOptions = (name: string, settings: QueueSettings): PgBoss.Queue => ({
  name,
  retryLimit: settings.retryLimit,
  retryDelay: settings.retryDelaySeconds,
  retryBackoff: settings.retryBackoff,
  expireInSeconds: settings.expireInSeconds,
});

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- definitions of different job data
export async function startJobRunner(definitions: readonly JobDefinition<any>[] = JOBS): Promise<JobRunner> {
  const settings = config().jobs;
  const boss = new PgBoss({
    connectionString: databaseUrl(),
    schema: JOB_QUEUE_SCHEMA,
    migrate: false,
    // No cron jobs yet; pg-boss's own maintenance (expiring, archiving) stays on.
    schedule: false,
    max: 4,
    application_name: "gaitloom-jobs",
  });
  boss.on("error", (error) => console.error("[jobs] pg-boss:", error));
  await boss.start();

  for (const definition of definitions) {
    const options = queueOptions(definition.queue, definition.settings());
    // createQueue leaves an existing queue as it is; the update brings its settings up to date.
    await boss.createQueue(definition.queue, options);
    await boss.updateQueue(definition.queue, options);
    for (let worker = 0; worker < (definition.workers ?? 1); worker++) {
      await boss.work<object>(definition.queue, { includeMetadata: true, pollingIntervalSeconds: settings.pollSeconds }, async (jobs) => {
        for (const job of jobs) {
          await definition.work({ id: job.id, data: job.data, retryCount: job.retryCount, retryLimit: job.retryLimit });
        }
      });
    }
  }

  const sweeping = new Set<Promise<void>>();
  const sweepAll = () => {
    for (const definition of definitions) {
      if (!definition.sweep) continue;
      const run = definition
        .sweep()
        .then(async (jobs) => {
          for (const job of jobs) await boss.send(definition.queue, job.data, { id: job.id });
        })
        .catch((error) => console.error(`[jobs] sweeping ${definition.queue} failed:`, error))
        .finally(() => sweeping.delete(run));
      sweeping.add(run);
    }
  };
  sweepAll();
  const timer = setInterval(sweepAll, settings.sweepSeconds * 1000);

  return {
    queues: definitions.map((definition) => definition.queue),
    async stop() {
      clearInterval(timer);
      await Promise.all(sweeping);
      // Waits for the jobs in hand; one still running at the timeout is failed back to its queue and retried.
      await boss.stop({ graceful: true, timeout: settings.stopTimeoutMs, wait: true });
      closeMailTransport();
      await closeDatabase();
    },
  };
}
