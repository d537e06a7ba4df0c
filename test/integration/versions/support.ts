// Helpers of the version and review integration tests: fresh versions in a
// chosen state, reading states back, and the mail a test file's own SMTP fake
// received (test/support/mail.ts).
import { eq } from "drizzle-orm";
import { gaitVersions, gaits, type VersionState } from "../../../db/schema";
import { changeDraft } from "../../support/drafts";
import { waitForMail, type InboxMail } from "../../support/mail";
import { uniqueName } from "../../support/names";
import { demoIds, memberAs, type DemoIds } from "../../support/routes";
import type { Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { commitDraft, type Committer } from "~/features/versions/versions.server";
import { seedDemo } from "../../../db/seed";

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

/** Mails to `to` whose text contains `needle`, newest first, waiting up to `timeoutMs` for at least one (the file's `mailStackForFile` fake). */
export async function mailsTo(to: string, needle: string, timeoutMs = 15_000): Promise<InboxMail[]> {
  const inbox = process.env.MAIL_INBOX_URL;
  if (!inbox) throw new Error("no SMTP fake: call mailStackForFile() in the test file");
  return waitForMail(inbox, to, { needle, timeoutMs });
}
