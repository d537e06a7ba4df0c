// The app's one database connection pool (server only).
import { createDatabase, databaseUrl, type Database } from "../../db/client";

let instance: ReturnType<typeof createDatabase> | undefined;

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
