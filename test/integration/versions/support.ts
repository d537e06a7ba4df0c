// Helpers of the version and review integration tests: fresh versions in a
// chosen state, reading states back, and the local fake SMTP server's messages.
import { eq } from "drizzle-orm";
import { gaitVersions, gaits, type VersionState } from "../../../db/schema";
import { changeDraft } from "../../support/drafts";
import { uniqueName } from "../../support/names";
import { demoIds, memberAs, type DemoIds } from "../../support/routes";
import type { Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { commitDraft, type Committer } from "~/features/versions/versions.server";
import { seedDemo } from "../../../db/seed";

export const MAIL_API = process.env.MAIL_INBOX_URL ?? "http://127.0.0.1:2626";

export async function setUp(): Promise<DemoIds> {
  await seedDemo(database());
  return demoIds(database());
}

/** A member as commitDraft and restoreDraft take the committer. */
export const committerOf = (member: Member, ids: DemoIds): Committer => ({ userId: member.user.id, workspaceId: ids.workspaceId });

/** The demo for a file whose tests commit as the animator: the ids, the animator, and the animator as committer. */
export async function setUpCommitting(): Promise<{ ids: DemoIds; animator: Member; committer: Committer }> {
  const ids = await setUp();
  const animator = await memberAs("animator", ids);
  return { ids, animator, committer: committerOf(animator, ids) };
}

/** Changes the gait's draft and commits it as `author`, then moves the version straight to `state` (as the seed does). */
export async function versionIn(ids: DemoIds, gaitName: string, state: VersionState, author: Member, options: { reviewerId?: string; message?: string } = {}) {
  const message = options.message ?? uniqueName("Test version");
  // An unchanged draft would be the newest version again, which a commit refuses.
  await changeDraft(database(), ids.gaitIds[gaitName]);
  const version = await commitDraft(committerOf(author, ids), ids.gaitIds[gaitName], message);
  if (state !== "committed") {
    await database()
      .update(gaitVersions)
      .set({ state, reviewerId: options.reviewerId ?? ids.userIds.lead })
      .where(eq(gaitVersions.id, version.id));
  }
  return { ...version, message, gaitId: ids.gaitIds[gaitName] };
}

export async function stateOf(versionId: string): Promise<VersionState> {
  const [row] = await database().select({ state: gaitVersions.state }).from(gaitVersions).where(eq(gaitVersions.id, versionId));
  return row.state;
}

export async function draftRevisionOf(gaitId: string): Promise<number> {
  const [row] = await database().select({ draftRevision: gaits.draftRevision }).from(gaits).where(eq(gaits.id, gaitId));
  return row.draftRevision;
}

export type Mail = { subject: string; text: string; to: string[] };

/** Mails to `to` whose text contains `needle`, newest first, waiting up to `timeoutMs` for at least one. */
export async function mailsTo(to: string, needle: string, timeoutMs = 5_000): Promise<Mail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await fetch(`${MAIL_API}/messages?to=${encodeURIComponent(to)}`);
    const found = ((await response.json()) as Mail[]).filter((mail) => mail.text.includes(needle));
    if (found.length > 0 || Date.now() > deadline) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
