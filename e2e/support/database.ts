// The e2e database itself, for set-up a spec cannot do through the pages in
// reasonable time (hundreds of audit entries) or must not do there (a token
// already past its expiry). The scripts that run the specs export DATABASE_URL.
import { eq } from "drizzle-orm";
import { createDatabase, databaseUrl } from "../../db/client";
import { demoWorkspace } from "../../db/demo/scenario";
import { users, workspaces } from "../../db/schema";

export function e2eDatabase() {
  return createDatabase(databaseUrl(), { max: 2 });
}

export type E2eDatabase = ReturnType<typeof e2eDatabase>["db"];

/** The demo workspace's id and a demo person's id by login. */
export async function demoWorkspaceId(db: E2eDatabase): Promise<string> {
  const [row] = await db.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));
  return row.id;
}

export async function userId(db: E2eDatabase, login: string): Promise<string> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.login, login));
  return row.id;
}
