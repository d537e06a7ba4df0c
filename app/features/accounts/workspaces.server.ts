// Creating workspaces; the shell's picture of the current one.
import { count, eq } from "drizzle-orm";
import { gaits, memberships, robots, workspaces } from "../../../db/schema";
import { recordAudit } from "../../platform/audit.server";
import { database } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import type { User, Workspace } from "../../platform/access.server";

export type WorkspaceSummary = { id: string; slug: string; name: string; robotCount: number; gaitCount: number };

export async function summarizeWorkspace(workspace: Workspace): Promise<WorkspaceSummary> {
  const db = database();
  const [[robotTotal], [gaitTotal]] = await Promise.all([
    db.select({ n: count() }).from(robots).where(eq(robots.workspaceId, workspace.id)),
    db.select({ n: count() }).from(gaits).where(eq(gaits.workspaceId, workspace.id)),
  ]);
  return { id: workspace.id, slug: workspace.slug, name: workspace.name, robotCount: robotTotal.n, gaitCount: gaitTotal.n };
}

export function slugify(name: string): string {
  return name
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48);
}

/** A new workspace with its creator as owner. */
export async function createWorkspace(user: User, name: string): Promise<Workspace> {
  const trimmed = name.trim();
  if (trimmed.length < 2 || trimmed.length > 80) throw new ServiceError(422, "invalid", "A workspace name needs 2 to 80 characters.", { field: "name" });
  const base = slugify(trimmed) || "workspace";
  return database().transaction(async (tx) => {
    let slug = base;
    for (let n = 2; (await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, slug))).length > 0; n++) {
      slug = `${base}-${n}`;
    }
    const [workspace] = await tx.insert(workspaces).values({ slug, name: trimmed }).returning();
    await tx.insert(memberships).values({ workspaceId: workspace.id, userId: user.id, role: "owner" });
    await recordAudit({ workspaceId: workspace.id, actorId: user.id, action: "workspace.created", targetType: "workspace", targetId: workspace.id }, tx);
    return workspace;
  });
}

export async function renameWorkspace(actor: User, workspace: Workspace, name: string): Promise<void> {
  const trimmed = name.trim();
  if (trimmed.length < 2 || trimmed.length > 80) throw new ServiceError(422, "invalid", "A workspace name needs 2 to 80 characters.", { field: "name" });
  await database().transaction(async (tx) => {
    await tx.update(workspaces).set({ name: trimmed }).where(eq(workspaces.id, workspace.id));
    await recordAudit({ workspaceId: workspace.id, actorId: actor.id, action: "workspace.renamed", details: { from: workspace.name, to: trimmed } }, tx);
  });
}
