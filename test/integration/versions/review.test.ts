// The review steps: committed → in-review → sent-back or approved → released
// (retiring the previous release), with their rules, records and e-mails.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, gaitVersions, memberships, reviewEvents, users, type Role } from "../../../db/schema";
import { demoPeople } from "../../../db/demo/scenario";
import { mailStackForFile, sleep } from "../../support/mail";
import { uniqueName } from "../../support/names";
import { act, memberAs, outcome, refusal, requestsAs, type DemoIds } from "../../support/routes";
import type { Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { approveVersion, releaseVersion, requestReview, reviewQueue, sendBackVersion } from "~/features/versions/review.server";
import * as versionPage from "~/routes/gaits/version";
import { mailsTo, setUp, stateOf, versionIn } from "./support";

let ids: DemoIds;
let owner: Member;
let lead: Member;
let animator: Member;
const email = (role: string) => demoPeople.find((person) => person.role === role)!.email;

// The steps' mail goes out through this file's own SMTP fake and job runner.
const mail = mailStackForFile();

/** A new member of the demo workspace with `role` (and the address given, or one of their own). */
async function newMember(role: Role, email?: string) {
  const login = uniqueName(role);
  const [user] = await database()
    .insert(users)
    .values({ login, name: login, email: email ?? `${login}@example.test` })
    .returning();
  await database().insert(memberships).values({ workspaceId: ids.workspaceId, userId: user.id, role });
  return user;
}

/** How many mails about `needle` reached `to` once the runner is done: a wait for the first, then a pause for any second. */
async function countMail(to: string, needle: string, expectAtLeastOne: boolean): Promise<number> {
  if (expectAtLeastOne) await mailsTo(to, needle);
  else await sleep(1_500);
  return (await mail.fake().messages(to)).filter((message) => message.text.includes(needle)).length;
}

beforeAll(async () => {
  ids = await setUp();
  [owner, lead, animator] = await Promise.all([memberAs("owner", ids), memberAs("lead", ids), memberAs("animator", ids)]);
});

const eventsOf = (versionId: string) => database().select().from(reviewEvents).where(eq(reviewEvents.versionId, versionId)).orderBy(reviewEvents.id);
const auditFor = (versionId: string) => database().select().from(auditLog).where(eq(auditLog.targetId, versionId)).orderBy(auditLog.id);

describe("requesting a review", () => {
  test("moves a committed version to in-review, assigns the reviewer, records the step and mails the reviewer a comparison link", async () => {
    const base = await versionIn(ids, "Tripod cruise", "committed", animator);
    const version = await versionIn(ids, "Tripod cruise", "committed", animator);
    const outcome = await requestReview(animator, version.id, { reviewerId: lead.user.id, comment: "Check the front legs", compareWithId: base.id });
    expect(outcome).toMatchObject({ state: "in-review", mails: 1, reviewer: lead.user.name });
    const [row] = await database().select().from(gaitVersions).where(eq(gaitVersions.id, version.id));
    expect(row).toMatchObject({ state: "in-review", reviewerId: lead.user.id });
    expect((await eventsOf(version.id)).at(-1)).toMatchObject({
      fromState: "committed",
      toState: "in-review",
      actorId: animator.user.id,
      comment: "Check the front legs",
    });
    expect((await auditFor(version.id)).map((entry) => entry.action)).toEqual(["version.review-requested"]);
    const [mail] = await mailsTo(email("lead"), version.message);
    expect(mail.subject).toBe(`Review requested: Tripod cruise v${version.number} (Pier crawler)`);
    expect(mail.text).toContain(`/gaits/compare?a=${base.id}&b=${version.id}`);
    expect(mail.text).toContain(`/gaits/${version.gaitId}/versions/${version.number}`);
    expect(mail.text).toContain("Check the front legs");
  });

  test("only from a person who may approve, never the author (unless an owner), and only once", async () => {
    const version = await versionIn(ids, "Tripod cruise", "committed", lead);
    expect((await refusal(() => requestReview(lead, version.id, { reviewerId: lead.user.id }))).field).toBe("reviewerId");
    expect((await refusal(() => requestReview(lead, version.id, { reviewerId: animator.user.id }))).message).toMatch(/cannot approve/);
    await requestReview(lead, version.id, { reviewerId: owner.user.id });
    const twice = await refusal(() => requestReview(lead, version.id, { reviewerId: owner.user.id }));
    expect(twice.status).toBe(409);
  });
});

describe("deciding", () => {
  test("approval mails the author; a double click approves once (the second is a 409) and records one step", async () => {
    const version = await versionIn(ids, "Wave creep", "in-review", animator);
    const results = await Promise.allSettled([approveVersion(lead, version.id, {}), approveVersion(lead, version.id, {})]);
    expect(results.map((result) => result.status).sort()).toEqual(["fulfilled", "rejected"]);
    expect((results.find((result) => result.status === "rejected") as PromiseRejectedResult).reason.status).toBe(409);
    expect(await stateOf(version.id)).toBe("approved");
    expect((await eventsOf(version.id)).filter((event) => event.toState === "approved")).toHaveLength(1);
    const [mail] = await mailsTo(email("animator"), version.message);
    expect(mail.subject).toBe(`Wave creep v${version.number} approved by ${lead.user.name}`);
  });

  test("no one approves their own version: a lead is refused; an owner may override with a reason, which is recorded", async () => {
    const leadOwn = await versionIn(ids, "Wave climb", "in-review", lead, { reviewerId: owner.user.id });
    const refused = await refusal(() => approveVersion(lead, leadOwn.id, { overrideReason: "I am sure" }));
    expect(refused.status).toBe(403);
    expect(await stateOf(leadOwn.id)).toBe("in-review");

    const ownerOwn = await versionIn(ids, "Wave climb", "in-review", owner, { reviewerId: owner.user.id });
    const noReason = await refusal(() => approveVersion(owner, ownerOwn.id, {}));
    expect(noReason).toMatchObject({ status: 422, field: "overrideReason" });
    expect(noReason.message).toMatch(/your own version/);
    const approved = await approveVersion(owner, ownerOwn.id, { overrideReason: "Only owner on call before the harbour trial" });
    expect(approved.override).toEqual(["own-version"]);
    expect((await eventsOf(ownerOwn.id)).at(-1)).toMatchObject({ toState: "approved", overrideReason: "Only owner on call before the harbour trial" });
    const [audit] = (await auditFor(ownerOwn.id)).filter((entry) => entry.action === "version.approved-with-override");
    expect(audit.details).toMatchObject({ override: { reasons: ["own-version"], reason: "Only owner on call before the harbour trial" } });
  });

  test("a version with error-severity flags is approved only with an override reason", async () => {
    // The demo crawl lets the centre of mass leave the support polygon: com-outside errors.
    const version = await versionIn(ids, "Crawl", "in-review", animator);
    const [row] = await database().select({ summary: gaitVersions.summary }).from(gaitVersions).where(eq(gaitVersions.id, version.id));
    expect((row.summary as { errors: number }).errors).toBeGreaterThan(0);
    const refused = await refusal(() => approveVersion(lead, version.id, { comment: "fine" }));
    expect(refused).toMatchObject({ status: 422, field: "overrideReason" });
    expect(refused.message).toMatch(/error flag/);
    expect(await stateOf(version.id)).toBe("in-review");
    await approveVersion(lead, version.id, { overrideReason: "Runs on the tether rig only, body supported" });
    expect((await eventsOf(version.id)).at(-1)).toMatchObject({ overrideReason: "Runs on the tether rig only, body supported" });
    const actions = (await auditFor(version.id)).map((entry) => entry.action);
    expect(actions).toContain("version.approved-with-override");
  });

  test("sending back needs a comment, which reaches the author by mail; the author may ask again", async () => {
    const version = await versionIn(ids, "Ripple turn left", "in-review", animator);
    expect(await refusal(() => sendBackVersion(lead, version.id, { comment: "  " }))).toMatchObject({ status: 422, field: "comment" });
    await sendBackVersion(lead, version.id, { comment: "The rear legs drag at the start of the turn" });
    expect(await stateOf(version.id)).toBe("sent-back");
    const [mail] = await mailsTo(email("animator"), version.message);
    expect(mail.subject).toContain("sent back");
    expect(mail.text).toContain("The rear legs drag at the start of the turn");
    await requestReview(animator, version.id, { reviewerId: lead.user.id });
    expect(await stateOf(version.id)).toBe("in-review");
    expect((await eventsOf(version.id)).map((event) => `${event.fromState}→${event.toState}`)).toEqual([
      "null→committed",
      "in-review→sent-back",
      "sent-back→in-review",
    ]);
  });

  test("animators and viewers cannot decide, even by calling the service", async () => {
    const version = await versionIn(ids, "Wave creep", "in-review", owner);
    expect((await refusal(() => approveVersion(animator, version.id, {}))).status).toBe(403);
    expect((await refusal(() => releaseVersion(animator, version.id))).status).toBe(403);
  });
});

describe("releasing", () => {
  test("only an approved version is released; it retires the gait's previous release in the same step, and the author hears of it", async () => {
    const gaitId = ids.gaitIds["Trot"];
    const [previous] = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.state, "released")));
    const committed = await versionIn(ids, "Trot", "committed", animator);
    expect((await refusal(() => releaseVersion(lead, committed.id))).status).toBe(409);
    const version = await versionIn(ids, "Trot", "approved", animator);
    const released = await releaseVersion(lead, version.id, { comment: "For the apron trials" });
    expect(released).toMatchObject({ state: "released", retired: previous.number });
    expect(await stateOf(version.id)).toBe("released");
    expect(await stateOf(previous.id)).toBe("retired");
    const releasedRows = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.state, "released")));
    expect(releasedRows.map((row) => row.id)).toEqual([version.id]);
    expect((await eventsOf(previous.id)).at(-1)).toMatchObject({ fromState: "released", toState: "retired", actorId: lead.user.id });
    expect((await auditFor(previous.id)).map((entry) => entry.action)).toContain("version.retired");
    const [mail] = await mailsTo(email("animator"), version.message);
    expect(mail.subject).toContain("released");
    expect(mail.text).toContain(`replaces version ${previous.number}`);
  });

  test("a release is mailed to the version's author and to every firmware member of the workspace (they download the table), never to the releaser, once per address", async () => {
    // A second firmware engineer, and a second account of the demo one under the same address (as GitHub may give).
    const firmware = await newMember("firmware");
    const priya = email("firmware");
    await newMember("firmware", priya.toUpperCase());
    const version = await versionIn(ids, "Wave climb", "approved", animator);
    const released = await releaseVersion(lead, version.id, { comment: "For the pier trials" });
    expect(released).toMatchObject({ state: "released", mails: 3 });
    expect(await countMail(email("animator"), version.message, true)).toBe(1);
    expect(await countMail(firmware.email, version.message, true)).toBe(1);
    expect(await countMail(priya, version.message, true)).toBe(1);
    expect(await countMail(email("lead"), version.message, false)).toBe(0);
    const [notice] = await mailsTo(firmware.email, version.message);
    expect(notice.subject).toBe(`Wave climb v${version.number} released by ${lead.user.name}`);
    expect(notice.text).toContain(`/export?gait=${version.gaitId}&version=${version.number}`);
  });

  test("an author who is now a firmware member hears of the release once; an owner releasing their own version is not mailed", async () => {
    const author = await newMember("animator");
    const asAuthor = await memberAs("animator", { ...ids, userIds: { ...ids.userIds, animator: author.id } });
    const version = await versionIn(ids, "Ripple turn left", "approved", asAuthor);
    await database().update(memberships).set({ role: "firmware" }).where(eq(memberships.userId, author.id));
    await releaseVersion(lead, version.id);
    expect(await countMail(author.email, version.message, true)).toBe(1);

    const own = await versionIn(ids, "Tripod cruise", "approved", owner);
    const released = await releaseVersion(owner, own.id);
    expect(await countMail(email("firmware"), own.message, true)).toBe(1);
    expect(await countMail(email("owner"), own.message, false)).toBe(0);
    expect(released.mails).toBeGreaterThanOrEqual(1);
  });

  test("two approved versions released at once: one released version per gait, the other retired, none lost", async () => {
    const gaitId = ids.gaitIds["Alternating tetrapod"];
    const first = await versionIn(ids, "Alternating tetrapod", "approved", animator);
    const second = await versionIn(ids, "Alternating tetrapod", "approved", animator);
    const results = await Promise.allSettled([releaseVersion(lead, first.id), releaseVersion(owner, second.id)]);
    expect(results.every((result) => result.status === "fulfilled")).toBe(true);
    const states = [await stateOf(first.id), await stateOf(second.id)].sort();
    expect(states).toEqual(["released", "retired"]);
    const released = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.state, "released")));
    expect(released).toHaveLength(1);
  });

  test("the partial unique index refuses a second released version however it is written", async () => {
    const gaitId = ids.gaitIds["Wave climb"];
    const version = await versionIn(ids, "Wave climb", "approved", animator);
    const code = await database()
      .update(gaitVersions)
      .set({ state: "released" })
      .where(eq(gaitVersions.id, version.id))
      .then(
        () => "no error",
        (error: { code?: string; cause?: { code?: string } }) => error.code ?? error.cause?.code,
      );
    expect(code).toBe("23505"); // unique_violation of gait_versions_one_released
    const released = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.state, "released")));
    expect(released).toHaveLength(1);
  });
});

describe("the version page's review actions and the Reviews page", () => {
  test("the lead approves and releases through the page; the queue shows what waits for whom", async () => {
    const version = await versionIn(ids, "Wave creep", "committed", animator);
    const params = { gaitId: version.gaitId, number: String(version.number) };
    const path = `/gaits/${version.gaitId}/versions/${version.number}`;
    const asAnimator = await requestsAs("animator", ids);
    const asLead = await requestsAs("lead", ids);
    const requested = await outcome(async () =>
      act(versionPage, await asAnimator("POST", path, { form: { intent: "request-review", reviewerId: lead.user.id, compareWithId: "" } }), params),
    );
    expect(requested.body).toMatchObject({ ok: true, intent: "request-review" });

    const leadQueue = await reviewQueue(lead);
    expect(leadQueue.assigned.map((item) => item.versionId)).toContain(version.id);
    const animatorQueue = await reviewQueue(animator);
    expect(animatorQueue.mine.find((item) => item.versionId === version.id)).toMatchObject({ state: "in-review", reviewer: { name: lead.user.name } });
    expect(animatorQueue.assigned).toEqual([]);

    const sentBackEmpty = await outcome(async () => act(versionPage, await asLead("POST", path, { form: { intent: "send-back", comment: "" } }), params));
    expect(sentBackEmpty).toMatchObject({ status: 422, body: { field: "comment" } });
    const approved = await outcome(async () => act(versionPage, await asLead("POST", path, { form: { intent: "approve", comment: "Smooth" } }), params));
    expect(approved.body).toMatchObject({ ok: true, intent: "approve" });
    expect((await reviewQueue(lead)).toRelease.map((item) => item.versionId)).toContain(version.id);
    const decided = (await reviewQueue(animator)).mine.find((item) => item.versionId === version.id);
    expect(decided).toMatchObject({ state: "approved", lastStep: { toState: "approved", comment: "Smooth", actor: { name: lead.user.name } } });

    const released = await outcome(async () => act(versionPage, await asLead("POST", path, { form: { intent: "release" } }), params));
    expect(released.body).toMatchObject({ ok: true, intent: "release" });
    const again = await outcome(async () => act(versionPage, await asLead("POST", path, { form: { intent: "release" } }), params));
    expect(again.status).toBe(409);
  });
});
