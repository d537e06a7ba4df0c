// Prints a fresh API token of the demo lead, for the HTTP benchmarks.
import { eq } from "drizzle-orm";
import { createDatabase, databaseUrl } from "../../db/client";
import { demoWorkspace } from "../../db/demo/scenario";
import { memberships, users, workspaces } from "../../db/schema";
import { createToken } from "../../app/features/accounts/tokens.server";
import { closeDatabase } from "../../app/platform/db.server";

const { db, client } = createDatabase(databaseUrl(), { max: 1 });
const [workspace] = await db.select().from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));
const [row] = await db
  .select({ user: users, role: memberships.role })
  .from(memberships)
  .innerJoin(users, eq(users.id, memberships.userId))
  .where(eq(memberships.role, "lead"));
const { token } = await createToken({ user: row.user, workspace, role: row.role }, `bench ${new Date().toISOString()}`);
console.log(token);
await client.end();
await closeDatabase();
