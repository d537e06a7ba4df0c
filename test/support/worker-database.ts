// Integration tests: each test file gets a fresh database of its worker's own,
// cloned from the migrated template that `npm test` prepared, so parallel
// workers never see each other's rows.
import postgres from "postgres";
import { afterAll } from "vitest";
import { closeDatabase } from "~/platform/db.server";
import { closeCorePool } from "~/platform/worker-pool.server";

const adminUrl = process.env.GAITLOOM_TEST_ADMIN_URL;
const template = process.env.GAITLOOM_TEST_TEMPLATE_DB;
const prefix = process.env.GAITLOOM_TEST_DATABASE_URL_PREFIX;
if (!adminUrl || !template || !prefix) {
  throw new Error("Integration tests need the database that `npm test` sets up; run them with `npm test`.");
}

const worker = process.env.VITEST_POOL_ID ?? "0";
// The name is the prefix's database name plus the worker, so two runs with
// different prefixes can share one cluster.
const name = `${new URL(prefix).pathname.slice(1)}${worker}`;
const admin = postgres(adminUrl, { max: 1, onnotice: () => {} });
try {
  await admin.unsafe(`drop database if exists "${name}" with (force)`);
  await admin.unsafe(`create database "${name}" template "${template}"`);
} finally {
  await admin.end();
}
process.env.DATABASE_URL = `${prefix}${worker}`;

afterAll(async () => {
  await closeDatabase();
  // Each test file loads the app afresh, with a worker pool of its own: its threads end with the file.
  await closeCorePool();
});
