// The audit log: one row for every sign-in, role change, invitation, token
// change and review decision. Written inside the caller's transaction when given.
import { auditLog } from "../../db/schema";
import { database, type Writer } from "./db.server";

export type AuditEntry = {
  workspaceId: string | null;
  actorId: string | null;
  action: string;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
};

export async function recordAudit(entry: AuditEntry, db: Writer = database()): Promise<void> {
  await db.insert(auditLog).values({ ...entry, details: entry.details ?? {} });
}
