// Writes the job queue's schema (pg-boss, schema "pgboss") into its migration
// from pg-boss's own construction plans, so the schema comes with our
// migrations (and the cloned test template) and the runner starts with
// `migrate: false`. Run after upgrading pg-boss: npx tsx db/job-queue-migration.ts
import { writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { jobQueueSchemaSql } from "./job-queue-schema";

const target = fileURLToPath(new URL("./migrations/0005_job-queue.sql", import.meta.url));
writeFileSync(target, jobQueueSchemaSql());
console.log(`wrote ${target}`);
