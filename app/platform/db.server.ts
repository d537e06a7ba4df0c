// The app's one database connection pool (server only).
import { createDatabase, databaseUrl, type Database } from "../../db/client";

let instance: ReturnType<typeof createDatabase> | undefined;

/** A handle that reads: the pool or an open transaction. */
export type Reader = Pick<Database, "select">;
/** A handle that reads and writes: the pool or an open transaction. */
export type Writer = Pick<Database, "select" | "insert" | "update" | "delete">;
/** An open transaction. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/**
 * Whether PostgreSQL refused a write as a duplicate (SQLSTATE 23505), of
 * `constraint` when one is named. Drizzle wraps the driver's error and keeps
 * it as `cause`, so the whole chain is searched.
 */
export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  // The bound only guards against a cause that points back into its own chain.
  for (
    let current = error, depth = 0;
    typeof current === "object" && current !== null && depth < 8;
    current = (current as { cause?: unknown }).cause, depth++
  ) {
    const { code, constraint_name } = current as { code?: unknown; constraint_name?: unknown };
    if (code === "23505") return constraint === undefined || constraint_name === constraint;
  }
  return false;
}

export function database(): Database {
  instance ??= createDatabase(databaseUrl());
  return instance.db;
}

export async function pingDatabase(): Promise<{ ok: true; latencyMs: number } | { ok: false; error: string }> {
  const started = performance.now();
  try {
    instance ??= createDatabase(databaseUrl());
    await instance.client`select 1`;
    return { ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch (error) {
    return { ok: false, error: error instanceof Error ? error.message : String(error) };
  }
}

/** Ends the pool (tests and scripts that exit). */
export async function closeDatabase(): Promise<void> {
  const current = instance;
  instance = undefined;
  await current?.client.end({ timeout: 5 });
}
