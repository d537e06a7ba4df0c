// Outgoing mail goes through the outbox: written in the transaction of the
// action that sends it, delivered by the job runner (a process of its own)
// with retries and backoff, exactly once per mail while the runner can mark
// what it sent. The SMTP fake and the runner are real processes here, stopped
// and started as an outage would.
import { and, eq, inArray, type SQL } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { auditLog, invitations, mailOutbox } from "../../../db/schema";
import { demoPeople } from "../../../db/demo/scenario";
import { JobRunner, MailFake, sleep, waitForMail } from "../../support/mail";
import { uniqueName } from "../../support/names";
import { act, loaderData, memberAs, outcome, refusal, requestsAs, type DemoIds } from "../../support/routes";
import { setUp, versionIn } from "../versions/support";
import type { Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { invite, resendInvitation } from "~/features/accounts/invitations.server";
import * as membersPage from "~/routes/settings/members";
import * as versionPage from "~/routes/gaits/version";

let ids: DemoIds;
let owner: Member;
let animator: Member;
let fake: MailFake;
const runners: JobRunner[] = [];
const leadEmail = demoPeople.find((person) => person.role === "lead")!.email;

beforeAll(async () => {
  ids = await setUp();
  [owner, animator] = await Promise.all([memberAs("owner", ids), memberAs("animator", ids)]);
  fake = await MailFake.start();
}, 60_000);

afterAll(async () => {
  for (const runner of runners) await runner.stop("SIGKILL");
  await fake?.stop();
}, 30_000);

async function startRunner(settings: Parameters<typeof JobRunner.start>[1] = {}): Promise<JobRunner> {
  const runner = await JobRunner.start(fake.smtpUrl, settings);
  runners.push(runner);
  return runner;
}

async function stopRunner(runner: JobRunner) {
  runners.splice(runners.indexOf(runner), 1);
  return runner.stop();
}

const mailRows = (where: SQL) => database().select().from(mailOutbox).where(where).orderBy(mailOutbox.createdAt);

/** Polls the outbox until `done` holds for the rows `where` picks, and gives them. */
async function outboxUntil(
  where: SQL,
  done: (rows: (typeof mailOutbox.$inferSelect)[]) => boolean,
  what: string,
  timeoutMs = 30_000,
): Promise<(typeof mailOutbox.$inferSelect)[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const rows = await mailRows(where);
    if (done(rows)) return rows;
    if (Date.now() > deadline) throw new Error(`the outbox did not reach "${what}" within ${timeoutMs} ms: ${JSON.stringify(rows, null, 1)}`);
    await sleep(200);
  }
}

/** Invites through the members page as the owner; gives the page's notice. */
async function inviteOnPage(email: string): Promise<string> {
  const request = await requestsAs("owner", ids);
  const answer = await outcome<{ success: string }>(async () =>
    act(membersPage, await request("POST", "/settings/members", { form: { intent: "invite", email, role: "viewer" } })),
  );
  expect(answer.status).toBe(200);
  return answer.body.success;
}

/** The mail state the members page shows the owner for the invitation to `email`. */
async function invitationMailOnPage(email: string) {
  const page = await loaderData(membersPage, await (await requestsAs("owner", ids))("GET", "/settings/members"));
  return page.invitations.find((row) => row.email === email)?.mail ?? null;
}

/** Requests a review of a fresh version through its page, as the animator (reviewer: the lead); gives the version and the notice. */
async function requestReviewOnPage() {
  const version = await versionIn(ids, "Tripod cruise", "committed", animator);
  const params = { gaitId: version.gaitId, number: String(version.number) };
  const request = await requestsAs("animator", ids);
  const answer = await outcome<{ ok: true; notice: string }>(async () =>
    act(
      versionPage,
      await request("POST", `/gaits/${version.gaitId}/versions/${version.number}`, { form: { intent: "request-review", reviewerId: ids.userIds.lead } }),
      params,
    ),
  );
  expect(answer.status).toBe(200);
  return { version, params, notice: answer.body.notice };
}

/** The mails the version page shows the animator (the requester) about the version. */
async function versionMailsOnPage(version: { gaitId: string; number: number }) {
  const request = await requestsAs("animator", ids);
  const page = await loaderData(versionPage, await request("GET", `/gaits/${version.gaitId}/versions/${version.number}`), {
    gaitId: version.gaitId,
    number: String(version.number),
  });
  return page.mails;
}

describe("before any runner has worked this database", () => {
  test("an invitation is saved with its mail queued, and the first runner to start delivers it (its sweep finds mail without a job)", async () => {
    const email = `${uniqueName("early")}@example.test`;
    const row = await invite(owner, email, "viewer");
    const [queued] = await mailRows(eq(mailOutbox.targetId, row.id));
    expect(queued).toMatchObject({ state: "queued", topic: "invitation", to: email, workspaceId: ids.workspaceId, senderId: owner.user.id, attempts: 0 });
    const runner = await startRunner();
    const mails = await waitForMail(fake.inboxUrl, email);
    expect(mails).toHaveLength(1);
    await outboxUntil(eq(mailOutbox.targetId, row.id), ([one]) => one?.state === "sent", "sent");
    await stopRunner(runner);
  });
});

describe("mail through the outbox", () => {
  test("Mail: with the SMTP fake stopped, an invitation and a review request say 'queued'; once it is started again every mail arrives exactly once and the pages say 'sent'", async () => {
    const runner = await startRunner({ retryLimit: 6, retryDelaySeconds: 1 });
    await fake.stop();
    const email = `${uniqueName("outage")}@example.test`;

    // Both actions succeed while mail is down, and say so.
    expect(await inviteOnPage(email)).toMatch(/queued/);
    const { version, notice } = await requestReviewOnPage();
    expect(notice).toMatch(/queued/);
    const [invitation] = await database().select().from(invitations).where(eq(invitations.email, email));
    const ours = inArray(mailOutbox.targetId, [invitation.id, version.id]);

    // The runner tries, fails and keeps them queued; the pages say so meanwhile.
    const tried = await outboxUntil(ours, (rows) => rows.length === 2 && rows.every((row) => row.attempts >= 1), "tried once");
    expect(tried.map((row) => row.state)).toEqual(["queued", "queued"]);
    expect(tried.every((row) => /ECONNREFUSED/.test(row.lastError ?? ""))).toBe(true);
    expect(await invitationMailOnPage(email)).toMatchObject({ state: "queued" });
    expect(await versionMailsOnPage(version)).toEqual([expect.objectContaining({ topic: "review-request", to: leadEmail, state: "queued" })]);

    // Mail comes back: each arrives, once.
    await fake.start();
    await outboxUntil(ours, (rows) => rows.every((row) => row.state === "sent"), "sent", 60_000);
    expect(await waitForMail(fake.inboxUrl, email)).toHaveLength(1);
    expect(await waitForMail(fake.inboxUrl, leadEmail, { needle: version.message })).toHaveLength(1);
    // Longer than a poll and the next retry would take: nothing comes twice.
    await sleep(3_000);
    expect(await fake.messages(email)).toHaveLength(1);
    expect((await fake.messages(leadEmail)).filter((mail) => mail.text.includes(version.message))).toHaveLength(1);
    expect(await invitationMailOnPage(email)).toMatchObject({ state: "sent" });
    expect(await versionMailsOnPage(version)).toEqual([expect.objectContaining({ topic: "review-request", state: "sent" })]);

    // The invitation's link left in the mail; the stored copy no longer holds it.
    const token = (await fake.messages(email))[0].text.match(/\/invitations\/(\S+)/)![1];
    const [sent] = await mailRows(eq(mailOutbox.targetId, invitation.id));
    expect(sent.body).not.toContain(token);
    expect(sent.sentAt).not.toBeNull();
    await stopRunner(runner);
  }, 90_000);

  test("an action that is refused, and so rolled back, queues no mail", async () => {
    const email = `${uniqueName("once")}@example.test`;
    const first = await invite(owner, email, "viewer");
    expect((await refusal(() => invite(owner, email, "viewer"))).status).toBe(409);
    expect(await mailRows(eq(mailOutbox.to, email))).toHaveLength(1);
    expect((await mailRows(eq(mailOutbox.targetId, first.id)))[0].targetType).toBe("invitation");
  });

  test("a mail that cannot be delivered is marked failed after its last retry, shown as failed to the sender, written to the audit log, and can be sent again", async () => {
    const runner = await startRunner({ retryLimit: 2, retryDelaySeconds: 1 });
    await fake.stop();
    const email = `${uniqueName("bounce")}@example.test`;
    await inviteOnPage(email);
    const { version, params } = await requestReviewOnPage();
    const [invitation] = await database().select().from(invitations).where(eq(invitations.email, email));
    const ours = inArray(mailOutbox.targetId, [invitation.id, version.id]);

    // pg-boss: retryLimit 2 is three tries, 1–2 s and 2–4 s apart.
    const failed = await outboxUntil(ours, (rows) => rows.length === 2 && rows.every((row) => row.state === "failed"), "failed");
    expect(failed.map((row) => row.attempts)).toEqual([3, 3]);
    expect(failed.every((row) => row.failedAt !== null && /ECONNREFUSED/.test(row.lastError ?? ""))).toBe(true);
    expect(await invitationMailOnPage(email)).toMatchObject({ state: "failed" });
    expect(await versionMailsOnPage(version)).toEqual([expect.objectContaining({ topic: "review-request", state: "failed" })]);
    const audit = await database()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, "mail.failed"), inArray(auditLog.targetId, [invitation.id, version.id])));
    expect(
      audit
        .map((entry) => ({ workspaceId: entry.workspaceId, targetType: entry.targetType, targetId: entry.targetId }))
        .sort((a, b) => a.targetType!.localeCompare(b.targetType!)),
    ).toEqual([
      { workspaceId: ids.workspaceId, targetType: "gait_version", targetId: version.id },
      { workspaceId: ids.workspaceId, targetType: "invitation", targetId: invitation.id },
    ]);
    expect(audit.every((entry) => (entry.details as { to?: string }).to !== undefined)).toBe(true);

    // Sent again once mail is back: the invitation with a new link, the review request as it was; each arrives once.
    await fake.start();
    await resendInvitation(owner, invitation.id);
    const request = await requestsAs("animator", ids);
    const failedRequest = failed.find((row) => row.targetId === version.id)!;
    const again = await outcome<{ ok: true; notice: string }>(async () =>
      act(
        versionPage,
        await request("POST", `/gaits/${version.gaitId}/versions/${version.number}`, { form: { intent: "resend-mail", mailId: failedRequest.id } }),
        params,
      ),
    );
    expect(again.status).toBe(200);
    expect(again.body.notice).toMatch(/queued/);
    expect(await waitForMail(fake.inboxUrl, email)).toHaveLength(1);
    expect(await waitForMail(fake.inboxUrl, leadEmail, { needle: version.message })).toHaveLength(1);
    await outboxUntil(ours, (rows) => rows.length === 4 && rows.filter((row) => row.state === "sent").length === 2, "sent again");
    await sleep(2_000);
    expect(await fake.messages(email)).toHaveLength(1);
    expect(await invitationMailOnPage(email)).toMatchObject({ state: "sent" });
    expect(await versionMailsOnPage(version)).toEqual([expect.objectContaining({ topic: "review-request", state: "sent" })]);
    await stopRunner(runner);
  }, 90_000);

  test("only the sender may send a failed mail again, and only a failed one", async () => {
    const { version, params } = await requestReviewOnPage();
    const [row] = await mailRows(eq(mailOutbox.targetId, version.id));
    const post = async (caller: "animator" | "lead") =>
      outcome<{ error: string }>(async () =>
        act(
          versionPage,
          await (
            await requestsAs(caller, ids)
          )("POST", `/gaits/${version.gaitId}/versions/${version.number}`, { form: { intent: "resend-mail", mailId: row.id } }),
          params,
        ),
      );
    expect((await post("animator")).status).toBe(409);
    await database().update(mailOutbox).set({ state: "failed", failedAt: new Date() }).where(eq(mailOutbox.id, row.id));
    expect((await post("lead")).status).toBe(403);
    expect((await post("animator")).status).toBe(200);
  });

  test("two runners deliver twelve mails exactly once between them, and each stops cleanly on SIGTERM", async () => {
    const [one, two] = [await startRunner(), await startRunner()];
    const emails = Array.from({ length: 12 }, () => `${uniqueName("pair")}@example.test`);
    for (const email of emails) await invite(owner, email, "viewer");
    await outboxUntil(inArray(mailOutbox.to, emails), (rows) => rows.length === 12 && rows.every((row) => row.state === "sent"), "all sent");
    await sleep(2_000);
    for (const email of emails) expect(await fake.messages(email), email).toHaveLength(1);
    for (const runner of [one, two]) {
      const ended = await stopRunner(runner);
      expect(ended, runner.output()).toMatchObject({ code: 0 });
      expect((ended as { ms: number }).ms).toBeLessThan(5_000);
    }
  }, 90_000);
});
