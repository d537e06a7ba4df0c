// Where a person is signed in: the list of their live sessions, and ending
// them, one or all at once ("sign out everywhere"), each in the audit log.
// A session goes by publicSessionId here, never its id, which is secret.
import { and, desc, eq, gt } from "drizzle-orm";
import { sessions } from "../../../db/schema";
import type { User } from "../../platform/access.server";
import { recordAudit } from "../../platform/audit.server";
import { database } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { publicSessionId } from "../../platform/session.server";
import { browserName } from "./browser-name";

export type SessionEntry = { id: string; current: boolean; browser: string; createdAt: Date; lastSeenAt: Date; expiresAt: Date };

/** The person's live sessions, the most recently used first; `currentId` (the asking session's id) is marked current. */
export async function listSessions(userId: string, currentId: string): Promise<SessionEntry[]> {
  const rows = await database()
    .select()
    .from(sessions)
    .where(and(eq(sessions.userId, userId), gt(sessions.expiresAt, new Date())))
    .orderBy(desc(sessions.lastSeenAt), desc(sessions.createdAt));
  return rows.map((row) => ({
    id: publicSessionId(row.id),
    current: row.id === currentId,
    browser: browserName(row.userAgent),
    createdAt: row.createdAt,
    lastSeenAt: row.lastSeenAt,
    expiresAt: row.expiresAt,
  }));
}

/** Ends one of the person's sessions, named by its public id; says whether it was `currentId`. */
export async function endSession(user: User, publicId: string, currentId: string): Promise<{ current: boolean }> {
  return database().transaction(async (tx) => {
    // A person has a handful of sessions: hashing each is simpler than keeping the hash in a column.
    const rows = await tx.select({ id: sessions.id, userAgent: sessions.userAgent }).from(sessions).where(eq(sessions.userId, user.id));
    const row = rows.find((candidate) => publicSessionId(candidate.id) === publicId);
    if (!row) throw new ServiceError(404, "not-found", "That is not one of your sessions, or it has ended already.");
    await tx.delete(sessions).where(eq(sessions.id, row.id));
    await recordAudit(
      {
        workspaceId: null,
        actorId: user.id,
        action: "session.ended",
        targetType: "user",
        targetId: user.id,
        details: { browser: browserName(row.userAgent) },
      },
      tx,
    );
    return { current: row.id === currentId };
  });
}

/** Ends every session of the person, the asking one too; gives how many there were. */
export async function endAllSessions(user: User): Promise<number> {
  return database().transaction(async (tx) => {
    const ended = await tx.delete(sessions).where(eq(sessions.userId, user.id)).returning({ id: sessions.id });
    await recordAudit(
      {
        workspaceId: null,
        actorId: user.id,
        action: "user.signed-out-everywhere",
        targetType: "user",
        targetId: user.id,
        details: { sessions: ended.length },
      },
      tx,
    );
    return ended.length;
  });
}
