// pg-boss's construction plans for our schema, as one migration: its own
// BEGIN and COMMIT are dropped because the migrator runs every migration in a
// transaction of its own (the advisory lock and lock timeouts stay).
import PgBoss from "pg-boss";

export const JOB_QUEUE_SCHEMA = "pgboss";

export function jobQueueSchemaSql(): string {
  const plans = PgBoss.getConstructionPlans(JOB_QUEUE_SCHEMA);
  const body = plans.replace(/^\s*BEGIN;\s*$/m, "").replace(/^\s*COMMIT;\s*$/m, "");
  return `-- The job queue's tables (pg-boss), written by db/job-queue-migration.ts from its construction plans; do not edit.\n${body.trim()}\n`;
}
