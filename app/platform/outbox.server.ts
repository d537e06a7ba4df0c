// Outgoing mail: queued in the transaction of the action that sends it (a
// row in mail_outbox and its delivery job, both or neither), delivered by the
// job runner with retries and backoff, and its state shown to the sender.
//
// Exactly once, as far as SMTP lets: the job carries the row's id and is the
// row's own (job id = row id, so a sweep never adds a second); the runner
// locks the row (FOR UPDATE SKIP LOCKED), sends, and marks it sent in the
// same transaction, so a second job or runner finds it locked or no longer
// queued. The window left: SMTP accepted the message but the runner died or
// lost the database before its commit; the row is still queued and is sent
// again (at least once, never lost). See docs/decisions/009.
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { mailOutbox, type MailState } from "../../db/schema";
import type { Member } from "./access.server";
import { recordAudit } from "./audit.server";
import { config } from "./config.server";
import { database, type Tx } from "./db.server";
import { ServiceError } from "./errors.server";
import { enqueueJob, type Job, type JobDefinition } from "./jobs.server";
import type { MailTopic } from "./mail-labels";
import { sendMail } from "./mail.server";
import { isId } from "./params";

export const MAIL_QUEUE = "mail-delivery";

export type OutgoingMail = { to: string; subject: string; text: string; topic: MailTopic; target: { type: string; id: string } };

/** A mail as its sender's page shows it. */
export type MailStatus = { id: string; topic: MailTopic; to: string; state: MailState; attempts: number; lastError: string | null; createdAt: Date };

type MailRow = typeof mailOutbox.$inferSelect;

const status = (row: MailRow): MailStatus => ({
  id: row.id,
  topic: row.topic as MailTopic,
  to: row.to,
  state: row.state,
  attempts: row.attempts,
  lastError: row.lastError,
  createdAt: row.createdAt,
});

/** Queues `mails` in the caller's transaction, each with its delivery job; gives how many. */
export async function queueMail(tx: Tx, from: { workspaceId: string; senderId: string | null }, mails: OutgoingMail[]): Promise<number> {
  if (mails.length === 0) return 0;
  const rows = await tx
    .insert(mailOutbox)
    .values(
      mails.map((mail) => ({
        workspaceId: from.workspaceId,
        senderId: from.senderId,
        topic: mail.topic,
        targetType: mail.target.type,
        targetId: mail.target.id,
        to: mail.to,
        subject: mail.subject,
        body: mail.text,
      })),
    )
    .returning({ id: mailOutbox.id });
  for (const row of rows) await enqueueJob(tx, MAIL_QUEUE, { mailId: row.id }, { id: row.id });
  return rows.length;
}

// An invitation's link is a credential of which the app keeps only a hash:
// the stored copy loses it once the mail has gone out or given up.
const redact = (body: string) => body.replace(/(\/invitations\/)[\w-]+/g, "$1(link sent)");

const errorText = (error: unknown) => (error instanceof Error ? error.message : String(error)).slice(0, 500);

/** The runner's work for one delivery job: send the row if it is still queued, and record how it went. */
async function deliver(job: Job<{ mailId: string }>): Promise<void> {
  const { mailId } = job.data;
  const failure = await database().transaction(async (tx): Promise<Error | null> => {
    const [row] = await tx
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.id, mailId), eq(mailOutbox.state, "queued")))
      .for("update", { skipLocked: true });
    if (!row) {
      const [other] = await tx.select({ state: mailOutbox.state }).from(mailOutbox).where(eq(mailOutbox.id, mailId));
      // Locked by another runner's try: this job tries again later, in case that runner dies with it.
      return other?.state === "queued" ? new Error("Another runner is delivering this mail.") : null;
    }
    const attempts = row.attempts + 1;
    try {
      await sendMail({ to: row.to, subject: row.subject, text: row.body });
    } catch (error) {
      const lastTry = job.retryCount >= job.retryLimit;
      const lastError = errorText(error);
      await tx
        .update(mailOutbox)
        .set(lastTry ? { attempts, lastError, state: "failed", failedAt: new Date(), body: redact(row.body) } : { attempts, lastError })
        .where(eq(mailOutbox.id, row.id));
      if (lastTry) {
        await recordAudit(
          {
            workspaceId: row.workspaceId,
            actorId: null,
            action: "mail.failed",
            targetType: row.targetType ?? "mail",
            targetId: row.targetId ?? row.id,
            details: { mailId: row.id, topic: row.topic, to: row.to, senderId: row.senderId, attempts, error: lastError },
          },
          tx,
        );
      }
      // Committed with the transaction; pg-boss then retries the job, or marks it failed after the last try.
      return error instanceof Error ? error : new Error(lastError);
    }
    await tx
      .update(mailOutbox)
      .set({ state: "sent", sentAt: new Date(), attempts, lastError: null, body: redact(row.body) })
      .where(eq(mailOutbox.id, row.id));
    return null;
  });
  if (failure) throw failure;
}

/** Queued mail, oldest first, for jobs sent with the row's id: only rows whose job was lost get a new one. */
async function sweep(): Promise<{ id: string; data: { mailId: string } }[]> {
  const rows = await database()
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(eq(mailOutbox.state, "queued"))
    .orderBy(asc(mailOutbox.createdAt))
    .limit(500);
  return rows.map((row) => ({ id: row.id, data: { mailId: row.id } }));
}

export const mailDelivery: JobDefinition<{ mailId: string }> = {
  queue: MAIL_QUEUE,
  settings: () => ({
    retryLimit: config().mail.retryLimit,
    retryDelaySeconds: config().mail.retryDelaySeconds,
    retryBackoff: true,
    // Well past the SMTP timeouts, so a try is never expired while it runs.
    expireInSeconds: 120,
  }),
  work: deliver,
  sweep,
};

// ---------------------------------------------------------------------------
// What the sender sees

/** The newest mail about each of `targetIds` (an invitation and its resends: the newest counts). */
export async function latestMailFor(targetType: string, targetIds: string[]): Promise<Map<string, MailStatus>> {
  if (targetIds.length === 0) return new Map();
  const rows = await database()
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.targetType, targetType), inArray(mailOutbox.targetId, targetIds)))
    .orderBy(asc(mailOutbox.createdAt));
  return new Map(rows.map((row) => [row.targetId!, status(row)]));
}

/** The mail `senderId` sent about a target, newest first, one per topic and address (a resend replaces the failed one). */
export async function mailSentAbout(target: { type: string; id: string }, senderId: string): Promise<MailStatus[]> {
  const rows = await database()
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.targetType, target.type), eq(mailOutbox.targetId, target.id), eq(mailOutbox.senderId, senderId)))
    .orderBy(desc(mailOutbox.createdAt));
  const seen = new Set<string>();
  return rows.filter((row) => !seen.has(`${row.topic} ${row.to}`) && seen.add(`${row.topic} ${row.to}`)).map(status);
}

/**
 * Queues a failed mail again, as it was, for the person who sent it. Not an
 * invitation's: its stored copy lost the link, and resending the invitation
 * makes a new one.
 */
export async function resendMail(actor: Member, mailId: string, target: { type: string; id: string }): Promise<MailStatus> {
  if (!isId(mailId)) throw new ServiceError(404, "not-found", "No such e-mail.");
  return database().transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(mailOutbox)
      .where(
        and(
          eq(mailOutbox.id, mailId),
          eq(mailOutbox.workspaceId, actor.workspace.id),
          eq(mailOutbox.targetType, target.type),
          eq(mailOutbox.targetId, target.id),
        ),
      )
      .for("update");
    if (!row) throw new ServiceError(404, "not-found", "No such e-mail about this page.");
    if (row.senderId !== actor.user.id) throw new ServiceError(403, "forbidden", "Only the person who sent an e-mail can send it again.");
    if (row.topic === "invitation") throw new ServiceError(409, "conflict", "Resend the invitation instead: it makes a new link.");
    if (row.state !== "failed") throw new ServiceError(409, "conflict", `This e-mail is ${row.state}; only one that failed is sent again.`);
    const [copy] = await tx
      .insert(mailOutbox)
      .values({
        workspaceId: row.workspaceId,
        senderId: row.senderId,
        topic: row.topic,
        targetType: row.targetType,
        targetId: row.targetId,
        to: row.to,
        subject: row.subject,
        body: row.body,
      })
      .returning();
    await enqueueJob(tx, MAIL_QUEUE, { mailId: copy.id }, { id: copy.id });
    await recordAudit(
      {
        workspaceId: actor.workspace.id,
        actorId: actor.user.id,
        action: "mail.resent",
        targetType: row.targetType ?? "mail",
        targetId: row.targetId ?? row.id,
        details: { mailId: copy.id, failedMailId: row.id, topic: row.topic, to: row.to },
      },
      tx,
    );
    return status(copy);
  });
}
