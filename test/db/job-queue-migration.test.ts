// The job queue's migration is pg-boss's construction plans as written by
// db/job-queue-migration.ts: after an upgrade of pg-boss whose plans differ,
// this fails until a new migration carries the change (the runner starts with
// `migrate: false` and refuses a schema of another version).
import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { jobQueueSchemaSql } from "../../db/job-queue-schema";

describe("the job queue's migration", () => {
  test("0005_job-queue.sql is what the installed pg-boss's construction plans write", () => {
    const committed = readFileSync(new URL("../../db/migrations/0005_job-queue.sql", import.meta.url), "utf8");
    expect(committed).toBe(jobQueueSchemaSql());
  });
});
