// Invitations by e-mail: a single-use link that expires. Only a hash of the
// link's token is stored (the queued mail's copy loses it once sent); resending
// makes a new link and retires the old one. The mail is queued in the
// invitation's own transaction: both are saved, or neither. Having the link is
// not enough to join: the account must have the invited address verified on
// GitHub, since a link can be forwarded or read by others.
import { randomBytes } from "node:crypto";
import { and, desc, eq, gt, inArray, isNull } from "drizzle-orm";
import { invitations, memberships, users, workspaces, type Role } from "../../../db/schema";
import { hashToken, type Member, type User } from "../../platform/access.server";
import { recordAudit } from "../../platform/audit.server";
import { config } from "../../platform/config.server";
import { database, type Tx } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { formatDate } from "../../platform/format";
import { latestMailFor, queueMail, type MailStatus } from "../../platform/outbox.server";
import { invitableRoles, ROLE_LABELS } from "../../platform/permissions";

export const INVITATION_DAYS = 7;

export type InvitationRow = typeof invitations.$inferSelect;

const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

function newLink(): { token: string; tokenHash: string; expiresAt: Date } {
  const token = randomBytes(24).toString("base64url");
  return { token, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000) };
}

async function queueInvitationMail(tx: Tx, invitation: InvitationRow, token: string, inviter: User, workspaceName: string) {
  const link = `${config().publicUrl}/invitations/${token}`;
  await queueMail(tx, { workspaceId: invitation.workspaceId, senderId: inviter.id }, [
    {
      topic: "invitation",
      target: { type: "invitation", id: invitation.id },
      to: invitation.email,
      subject: `${inviter.name} invited you to ${workspaceName} on Gaitloom`,
      text: [
        `${inviter.name} invited you to join ${workspaceName} on Gaitloom as ${ROLE_LABELS[invitation.role].toLowerCase()}.`,
        "",
        `Accept the invitation: ${link}`,
        "",
        `The link works once and expires on ${formatDate(invitation.expiresAt)}.`,
        "If you did not expect this, you can ignore this e-mail.",
      ].join("\n"),
    },
  ]);
}

/** The workspace's pending invitations, each with the state of its newest mail (null for one from before the outbox). */
export async function listInvitations(workspaceId: string): Promise<(InvitationRow & { invitedBy: string | null; mail: MailStatus | null })[]> {
  const rows = await database()
    .select({ invitation: invitations, invitedBy: users.name })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(and(eq(invitations.workspaceId, workspaceId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .orderBy(desc(invitations.createdAt));
  const mail = await latestMailFor(
    "invitation",
    rows.map((row) => row.invitation.id),
  );
  return rows.map((row) => ({ ...row.invitation, invitedBy: row.invitedBy, mail: mail.get(row.invitation.id) ?? null }));
}

export async function invite(actor: Member, email: string, role: Role): Promise<InvitationRow> {
  const address = email.trim().toLowerCase();
  if (!EMAIL.test(address)) throw new ServiceError(422, "invalid", `"${email}" is not an e-mail address.`, { field: "email" });
  if (!invitableRoles(actor.role).includes(role)) {
    throw new ServiceError(403, "forbidden", `A ${actor.role} cannot invite someone as ${role}.`, { field: "role" });
  }
  const link = newLink();
  const invitation = await database().transaction(async (tx) => {
    const [member] = await tx
      .select({ id: users.id })
      .from(users)
      .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.workspaceId, actor.workspace.id)))
      .where(eq(users.email, address));
    if (member) throw new ServiceError(409, "conflict", `${address} is already a member of this workspace.`, { field: "email" });
    const [pending] = await tx
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(
          eq(invitations.workspaceId, actor.workspace.id),
          eq(invitations.email, address),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
          gt(invitations.expiresAt, new Date()),
        ),
      );
    if (pending) throw new ServiceError(409, "conflict", `${address} already has a pending invitation; resend it instead.`, { field: "email" });
    const [row] = await tx
      .insert(invitations)
      .values({ workspaceId: actor.workspace.id, email: address, role, tokenHash: link.tokenHash, invitedById: actor.user.id, expiresAt: link.expiresAt })
      .returning();
    await recordAudit(
      {
        workspaceId: actor.workspace.id,
        actorId: actor.user.id,
        action: "invitation.created",
        targetType: "invitation",
        targetId: row.id,
        details: { email: address, role },
      },
      tx,
    );
    await queueInvitationMail(tx, row, link.token, actor.user, actor.workspace.name);
    return row;
  });
  return invitation;
}

async function pendingInvitation(actor: Member, invitationId: string): Promise<InvitationRow> {
  const [row] = await database()
    .select()
    .from(invitations)
    .where(and(eq(invitations.id, invitationId), eq(invitations.workspaceId, actor.workspace.id)));
  if (!row) throw new ServiceError(404, "not-found", "No such invitation in this workspace.");
  if (row.acceptedAt) throw new ServiceError(409, "conflict", "This invitation was already accepted.");
  if (row.revokedAt) throw new ServiceError(409, "conflict", "This invitation was revoked.");
  if (!invitableRoles(actor.role).includes(row.role)) {
    throw new ServiceError(403, "forbidden", `A ${actor.role} cannot manage an invitation for the ${row.role} role.`);
  }
  return row;
}

export async function resendInvitation(actor: Member, invitationId: string): Promise<void> {
  const row = await pendingInvitation(actor, invitationId);
  const link = newLink();
  await database().transaction(async (tx) => {
    const [updated] = await tx
      .update(invitations)
      .set({ tokenHash: link.tokenHash, expiresAt: link.expiresAt, lastSentAt: new Date(), sendCount: row.sendCount + 1 })
      .where(eq(invitations.id, row.id))
      .returning();
    await recordAudit(
      {
        workspaceId: actor.workspace.id,
        actorId: actor.user.id,
        action: "invitation.resent",
        targetType: "invitation",
        targetId: row.id,
        details: { email: row.email },
      },
      tx,
    );
    await queueInvitationMail(tx, updated, link.token, actor.user, actor.workspace.name);
  });
}

export async function revokeInvitation(actor: Member, invitationId: string): Promise<void> {
  const row = await pendingInvitation(actor, invitationId);
  await database().transaction(async (tx) => {
    await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, row.id));
    await recordAudit(
      {
        workspaceId: actor.workspace.id,
        actorId: actor.user.id,
        action: "invitation.revoked",
        targetType: "invitation",
        targetId: row.id,
        details: { email: row.email },
      },
      tx,
    );
  });
}

export type InvitationView = { id: string; email: string; role: Role; workspaceId: string; workspaceName: string; invitedBy: string | null; expiresAt: Date };

function checkUsable(row: InvitationRow): void {
  if (row.revokedAt) throw new ServiceError(410, "gone", "This invitation was revoked. Ask the person who invited you for a new one.");
  if (row.acceptedAt) throw new ServiceError(410, "gone", "This invitation link was already used.");
  if (row.expiresAt.getTime() < Date.now()) throw new ServiceError(410, "gone", "This invitation has expired. Ask the person who invited you to resend it.");
}

export async function invitationForToken(token: string): Promise<InvitationView> {
  const [row] = await database()
    .select({ invitation: invitations, workspaceName: workspaces.name, invitedBy: users.name })
    .from(invitations)
    .innerJoin(workspaces, eq(workspaces.id, invitations.workspaceId))
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(eq(invitations.tokenHash, hashToken(token)));
  if (!row) throw new ServiceError(404, "not-found", "This invitation link is not valid. It may have been resent with a new link.");
  checkUsable(row.invitation);
  const { id, email, role, workspaceId, expiresAt } = row.invitation;
  return { id, email, role, workspaceId, workspaceName: row.workspaceName, invitedBy: row.invitedBy, expiresAt };
}

/** Pending invitations addressed to any of `addresses` (a person's verified ones, offered on the welcome page). */
export async function invitationsForAddresses(addresses: readonly string[]): Promise<InvitationView[]> {
  const lowered = [...new Set(addresses.map((address) => address.toLowerCase()))];
  if (lowered.length === 0) return [];
  const rows = await database()
    .select({ invitation: invitations, workspaceName: workspaces.name, invitedBy: users.name })
    .from(invitations)
    .innerJoin(workspaces, eq(workspaces.id, invitations.workspaceId))
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(and(inArray(invitations.email, lowered), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())));
  return rows.map(({ invitation, workspaceName, invitedBy }) => ({
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    workspaceId: invitation.workspaceId,
    workspaceName,
    invitedBy,
    expiresAt: invitation.expiresAt,
  }));
}

/** Whether GitHub had verified `address` for the person at their last sign-in (e-mail addresses compared case aside). */
export function hasVerified(user: Pick<User, "verifiedEmails">, address: string): boolean {
  const wanted = address.toLowerCase();
  return user.verifiedEmails.some((verified) => verified.toLowerCase() === wanted);
}

/** An address shown to someone it may not belong to: its first character and its domain ("d***@breakwater-lab.test"). */
export function maskAddress(address: string): string {
  const at = address.lastIndexOf("@");
  return at <= 0 ? "***" : `${address[0]}***${address.slice(at)}`;
}

/** Why the person cannot accept an invitation to `address`, or null when they can. */
export function addressRefusal(user: Pick<User, "verifiedEmails">, address: string): string | null {
  if (hasVerified(user, address)) return null;
  return (
    `This invitation is for ${maskAddress(address)}, which is not a verified address of the GitHub account you signed in with. ` +
    "Verify that address on GitHub and sign in again, or ask for an invitation to an address you have verified."
  );
}

/**
 * Uses an invitation, by its link's token or by id (the welcome page's), for
 * a person whose verified addresses hold the invited one. Adds the membership
 * once; the row lock makes a double click or two tabs accept it only once.
 */
export async function acceptInvitation(user: User, by: { token: string } | { id: string }): Promise<{ workspaceId: string; role: Role }> {
  return database().transaction(async (tx) => {
    const condition = "token" in by ? eq(invitations.tokenHash, hashToken(by.token)) : eq(invitations.id, by.id);
    const [row] = await tx.select().from(invitations).where(condition).for("update");
    if (!row) throw new ServiceError(404, "not-found", "This invitation link is not valid. It may have been resent with a new link.");
    const refused = addressRefusal(user, row.email);
    if (refused) throw new ServiceError(403, "forbidden", refused);
    checkUsable(row);
    const [existing] = await tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.workspaceId, row.workspaceId), eq(memberships.userId, user.id)));
    if (!existing) await tx.insert(memberships).values({ workspaceId: row.workspaceId, userId: user.id, role: row.role });
    await tx.update(invitations).set({ acceptedAt: new Date(), acceptedById: user.id }).where(eq(invitations.id, row.id));
    await recordAudit(
      {
        workspaceId: row.workspaceId,
        actorId: user.id,
        action: "invitation.accepted",
        targetType: "invitation",
        targetId: row.id,
        details: { role: existing?.role ?? row.role, email: row.email },
      },
      tx,
    );
    return { workspaceId: row.workspaceId, role: existing?.role ?? row.role };
  });
}
