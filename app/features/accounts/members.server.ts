// Members of a workspace: who they are, role changes and removal. A
// workspace always keeps at least one owner.
import { and, asc, count, eq } from "drizzle-orm";
import { memberships, users, type Role } from "../../../db/schema";
import { recordAudit } from "../../platform/audit.server";
import { database, type Tx } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { ROLES } from "../../platform/permissions";
import type { Member } from "../../platform/access.server";

export type MemberRow = { userId: string; login: string; name: string; email: string; role: Role; joinedAt: Date };

export async function listMembers(workspaceId: string): Promise<MemberRow[]> {
  return database()
    .select({
      userId: users.id,
      login: users.login,
      name: users.name,
      email: users.email,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.workspaceId, workspaceId))
    .orderBy(asc(users.name));
}

export function parseRole(value: unknown): Role {
  if (typeof value === "string" && (ROLES as readonly string[]).includes(value)) return value as Role;
  throw new ServiceError(422, "invalid", `Unknown role "${String(value)}"; choose one of ${ROLES.join(", ")}.`, { field: "role" });
}

/** The membership, locked, with the person's name (which the audit entry records, so it says whose role changed). */
async function lockedMembership(tx: Tx, workspaceId: string, userId: string) {
  const [row] = await tx
    .select({ role: memberships.role, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))
    .for("update", { of: memberships });
  if (!row) throw new ServiceError(404, "not-found", "That person is not a member of this workspace.");
  return row;
}

/**
 * Locks the owners' rows, always first and in one order, so two owners
 * demoting each other at once queue up instead of both succeeding (or
 * deadlocking); the second then sees only one owner left.
 */
async function lockOwners(tx: Tx, workspaceId: string): Promise<string[]> {
  const owners = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "owner")))
    .orderBy(asc(memberships.userId))
    .for("update");
  return owners.map((owner) => owner.userId);
}

export async function changeRole(actor: Member, userId: string, role: Role): Promise<void> {
  await database().transaction(async (tx) => {
    const owners = await lockOwners(tx, actor.workspace.id);
    const current = await lockedMembership(tx, actor.workspace.id, userId);
    if (current.role === role) return;
    if (current.role === "owner" && owners.filter((id) => id !== userId).length === 0) {
      throw new ServiceError(409, "conflict", "This is the workspace's only owner; make someone else an owner first.", { field: "role" });
    }
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.workspaceId, actor.workspace.id), eq(memberships.userId, userId)));
    await recordAudit(
      {
        workspaceId: actor.workspace.id,
        actorId: actor.user.id,
        action: "member.role-changed",
        targetType: "user",
        targetId: userId,
        details: { member: current.name, from: current.role, to: role },
      },
      tx,
    );
  });
}

export async function removeMember(actor: Member, userId: string): Promise<void> {
  await database().transaction(async (tx) => {
    const owners = await lockOwners(tx, actor.workspace.id);
    const current = await lockedMembership(tx, actor.workspace.id, userId);
    if (current.role === "owner" && owners.filter((id) => id !== userId).length === 0) {
      throw new ServiceError(409, "conflict", "This is the workspace's only owner and cannot be removed; make someone else an owner first.");
    }
    await tx.delete(memberships).where(and(eq(memberships.workspaceId, actor.workspace.id), eq(memberships.userId, userId)));
    await recordAudit(
      {
        workspaceId: actor.workspace.id,
        actorId: actor.user.id,
        action: "member.removed",
        targetType: "user",
        targetId: userId,
        details: { member: current.name, role: current.role },
      },
      tx,
    );
  });
}

export async function ownerCount(workspaceId: string): Promise<number> {
  const [row] = await database()
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "owner")));
  return row.n;
}
