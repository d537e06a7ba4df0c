// Committing the working draft, and starting a new draft from any version.
import { and, asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, gaitVersions, gaits, reviewEvents, robotRevisions } from "../../../db/schema";
import { changeDraft } from "../../support/drafts";
import { uniqueName } from "../../support/names";
import { act, outcome, refusal, requestsAs, type DemoIds } from "../../support/routes";
import { parseSequence, solveSequence } from "~/gait/index";
import { parseRobot } from "~/kinematics";
import type { Member } from "~/platform/access.server";
import { versionContentHash } from "~/features/versions/content-hash.server";
import { database } from "~/platform/db.server";
import { commitDraft, restoreDraft, type Committer } from "~/features/versions/versions.server";
import * as gaitPage from "~/routes/gaits/gait";
import { draftRevisionOf, setUpCommitting } from "./support";

let ids: DemoIds;
let animator: Member;
let committer: Committer;

beforeAll(async () => ({ ids, animator, committer } = await setUpCommitting()));

describe("commitDraft", () => {
  test("makes the next numbered version with the message, author, pinned revision, full sequence, solved summary and content hash", async () => {
    const gaitId = ids.gaitIds["Wave creep"];
    await changeDraft(database(), gaitId);
    const [gait] = await database().select().from(gaits).where(eq(gaits.id, gaitId));
    const message = uniqueName("A calmer wave");
    const committed = await commitDraft(committer, gaitId, `  ${message}  `);
    const [row] = await database().select().from(gaitVersions).where(eq(gaitVersions.id, committed.id));
    const [revision] = await database().select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId!));
    const robot = parseRobot(revision.definition);
    const sequence = parseSequence(gait.draftSequence);
    if (!robot.ok || !sequence.ok) throw new Error("demo draft does not parse");
    const solved = solveSequence(robot.robot, sequence.sequence);
    expect(row).toMatchObject({ number: 3, message, authorId: animator.user.id, robotRevisionId: revision.id, state: "committed" });
    expect(row.sequence).toEqual(sequence.sequence);
    expect(row.summary).toEqual({ ...solved.summary, cycleMs: sequence.sequence.cycleMs, loop: true });
    expect(row.summary).toMatchObject({
      flagsByKind: expect.any(Object),
      worstMarginMm: expect.any(Number),
      peakSpeedDegS: expect.any(Object),
      bodySpeedMmS: expect.any(Number),
    });
    expect(row.contentHash).toBe(versionContentHash(sequence.sequence, revision.definition));
    expect(committed).toEqual({ id: row.id, number: 3, contentHash: row.contentHash });
    const events = await database().select().from(reviewEvents).where(eq(reviewEvents.versionId, row.id));
    expect(events).toMatchObject([{ fromState: null, toState: "committed", actorId: animator.user.id }]);
    const [audit] = await database()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, "version.committed"), eq(auditLog.targetId, gaitId)))
      .orderBy(asc(auditLog.id));
    expect(audit).toBeDefined();
  });

  test("commits of one gait, one after another, get consecutive numbers (racing ones: unchanged-commit.test.ts)", async () => {
    const gaitId = ids.gaitIds["Ripple turn left"];
    const messages = [uniqueName("First"), uniqueName("Second"), uniqueName("Third")];
    for (const message of messages) {
      await changeDraft(database(), gaitId);
      await commitDraft(committer, gaitId, message);
    }
    const rows = await database().select().from(gaitVersions).where(eq(gaitVersions.gaitId, gaitId)).orderBy(asc(gaitVersions.number));
    expect(rows.map((row) => row.number)).toEqual([1, 2, 3, 4, 5]);
    expect(rows.slice(2).map((row) => row.message)).toEqual(messages);
  });

  test("refuses an empty message, a gait of another workspace, and a draft that moved on since the page was loaded", async () => {
    const gaitId = ids.gaitIds["Wave creep"];
    await changeDraft(database(), gaitId);
    expect((await refusal(() => commitDraft(committer, gaitId, "   "))).field).toBe("message");
    expect((await refusal(() => commitDraft({ ...committer, workspaceId: "00000000-0000-4000-8000-000000000000" }, gaitId, "x"))).status).toBe(404);
    const current = await draftRevisionOf(gaitId);
    const stale = await refusal(() => commitDraft(committer, gaitId, "stale", undefined, { draftRevision: current - 1 }));
    expect(stale.status).toBe(409);
    expect(stale.message).toMatch(/draft changed/);
    await expect(commitDraft(committer, gaitId, uniqueName("Fresh"), undefined, { draftRevision: current })).resolves.toMatchObject({
      number: expect.any(Number),
    });
  });

  test("the gait page's commit action answers with the new version, or the message field's error", async () => {
    const gaitId = ids.gaitIds["Crawl"];
    await changeDraft(database(), gaitId);
    const request = await requestsAs("animator", ids);
    const done = await outcome(async () =>
      act(gaitPage, await request("POST", `/gaits/${gaitId}`, { form: { intent: "commit", message: uniqueName("From the page") } }), { gaitId }),
    );
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({ ok: true, intent: "commit", version: { number: 3 } });
    const empty = await outcome(async () => act(gaitPage, await request("POST", `/gaits/${gaitId}`, { form: { intent: "commit", message: "" } }), { gaitId }));
    expect(empty).toMatchObject({ status: 422, body: { field: "message" } });
  });
});

describe("a new draft from any version (restore / branch)", () => {
  test("copies the version's sequence and robot revision into the draft and bumps the draft revision", async () => {
    const gaitId = ids.gaitIds["Trot"];
    const [first] = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, 1)));
    const before = await draftRevisionOf(gaitId);
    const restored = await restoreDraft(committer, gaitId, first.id, before);
    expect(restored).toEqual({ draftRevision: before + 1, number: 1 });
    const [gait] = await database().select().from(gaits).where(eq(gaits.id, gaitId));
    expect(gait.draftSequence).toEqual(first.sequence);
    expect(gait.draftRobotRevisionId).toBe(first.robotRevisionId);
    expect(gait.draftUpdatedById).toBe(animator.user.id);
    // Committing it gives a new number with the same content (and hash) as version 1.
    const again = await commitDraft(committer, gaitId, uniqueName("Back to the first trot"));
    expect(again.contentHash).toBe(first.contentHash);
    expect(again.number).toBe(3);
    const [audit] = await database()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, "draft.restored"), eq(auditLog.targetId, gaitId)));
    expect(audit.details).toMatchObject({ fromVersion: 1 });
  });

  test("refuses with 409 when the draft changed in between (optimistic concurrency), leaving the draft as it was", async () => {
    const gaitId = ids.gaitIds["Alternating tetrapod"];
    const [first] = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, 1)));
    const seen = await draftRevisionOf(gaitId);
    const [winner, loser] = await Promise.allSettled([restoreDraft(committer, gaitId, first.id, seen), restoreDraft(committer, gaitId, first.id, seen)]);
    const outcomes = [winner, loser].map((result) => result.status);
    expect(outcomes.sort()).toEqual(["fulfilled", "rejected"]);
    const rejected = [winner, loser].find((result) => result.status === "rejected") as PromiseRejectedResult;
    expect(rejected.reason.status).toBe(409);
    expect(await draftRevisionOf(gaitId)).toBe(seen + 1);
  });

  test("the page action branches from an older version; a version of another gait is not found", async () => {
    const gaitId = ids.gaitIds["Wave climb"];
    const [first] = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, 1)));
    const [other] = await database().select().from(gaitVersions).where(eq(gaitVersions.gaitId, ids.gaitIds["Trot"])).limit(1);
    const request = await requestsAs("lead", ids);
    const draftRevision = String(await draftRevisionOf(gaitId));
    const done = await outcome(async () =>
      act(gaitPage, await request("POST", `/gaits/${gaitId}`, { form: { intent: "restore", versionId: first.id, draftRevision } }), { gaitId }),
    );
    expect(done.body).toMatchObject({ ok: true, intent: "restore", draftRevision: Number(draftRevision) + 1 });
    const foreign = await outcome(async () =>
      act(
        gaitPage,
        await request("POST", `/gaits/${gaitId}`, { form: { intent: "restore", versionId: other.id, draftRevision: String(Number(draftRevision) + 1) } }),
        { gaitId },
      ),
    );
    expect(foreign.status).toBe(404);
  });
});
