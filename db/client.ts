// One way to reach the database: a drizzle instance over postgres.js.
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";

export type Database = ReturnType<typeof createDatabase>["db"];

export function createDatabase(url: string, options: { max?: number } = {}) {
  const client = postgres(url, { max: options.max ?? 10, idle_timeout: 30, onnotice: () => {} });
  return { db: drizzle(client, { schema }), client };
}

export function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set; start the app with `npm start`.");
  return url;
}
