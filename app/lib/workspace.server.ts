// Which workspace a request works in, and what the shell shows about it.
import { asc, count, eq } from "drizzle-orm";
import { gaits, robots, workspaces } from "../../db/schema";
import { database } from "./db.server";

export type WorkspaceSummary = { id: string; slug: string; name: string; robotCount: number; gaitCount: number };

// Until sign-in lands every visitor works in the oldest workspace (the seeded demo lab).
export async function currentWorkspace(_request: Request): Promise<WorkspaceSummary | null> {
  const db = database();
  const [workspace] = await db.select().from(workspaces).orderBy(asc(workspaces.createdAt)).limit(1);
  if (!workspace) return null;
  const [[robotTotal], [gaitTotal]] = await Promise.all([
    db.select({ n: count() }).from(robots).where(eq(robots.workspaceId, workspace.id)),
    db.select({ n: count() }).from(gaits).where(eq(gaits.workspaceId, workspace.id)),
  ]);
  return { id: workspace.id, slug: workspace.slug, name: workspace.name, robotCount: robotTotal.n, gaitCount: gaitTotal.n };
}
