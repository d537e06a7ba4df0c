// The working draft over HTTP: GET makes it the first time, PUT saves with
// optimistic concurrency (one of two saves from the same base wins, the
// other gets 409 naming who saved), invalid sequences get 422 with paths and
// save nothing, and the roles are held to the permission table.
import { randomUUID } from "node:crypto";
import { and, desc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, gaitVersions, gaits, robotRevisions, robots, workspaces } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, outcome, requestsAs, type ApiRefusal, type Caller, type DemoIds, type FormRefusal, type LoaderData } from "../../support/routes";
import { addRobotRevision, newestRobotRevision } from "../../support/robot-revisions";
import { robotOf } from "../../support/robots";
import { sequenceOf } from "./support";
import { generateGait, parseSequence } from "~/gait";
import { parseRobot } from "~/kinematics";
import type { DraftConflictDetails, SavedDraft } from "~/features/gaits/drafts.server";
import type { Issue } from "~/platform/errors";
import { database } from "~/platform/db.server";
import * as draftApi from "~/routes/api.v1/gaits/draft";
import * as editor from "~/routes/gaits/editor";

let ids: DemoIds;
let gaitId: string;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  gaitId = ids.gaitIds["Tripod cruise"];
});

/** GET's answer: the draft as the API shows it. */
type DraftAnswer = ReturnType<typeof draftApi.draftJson>;

async function getDraft<Answer = DraftAnswer>(caller: Caller, id = gaitId) {
  const request = await requestsAs(caller, ids);
  return outcome<Answer>(async () => load(draftApi, await request("GET", `/api/v1/gaits/${id}/draft`), { gaitId: id }));
}

async function putDraft<Answer = SavedDraft>(caller: Caller, body: unknown, id = gaitId) {
  const request = await requestsAs(caller, ids);
  return outcome<Answer>(async () => act(draftApi, await request("PUT", `/api/v1/gaits/${id}/draft`, { json: body }), { gaitId: id }));
}

async function stored(id = gaitId) {
  const [row] = await database().select().from(gaits).where(eq(gaits.id, id));
  return row;
}

/** The stored draft with LF's touch-down moved to t (a hand edit). */
async function editedSequence(t: number, id = gaitId) {
  const sequence = sequenceOf((await stored(id)).draftSequence);
  sequence.legs.LF.keys[1].t = t;
  return sequence;
}

describe("reading the draft", () => {
  test("a demo gait's draft is its newest version's sequence, with the revision and the pinned robot revision", async () => {
    const answer = await getDraft("viewer");
    expect(answer.status).toBe(200);
    expect(answer.headers?.get("Cache-Control")).toBe("no-store");
    const [newest] = await database().select().from(gaitVersions).where(eq(gaitVersions.gaitId, gaitId)).orderBy(desc(gaitVersions.number)).limit(1);
    expect(answer.body.sequence).toEqual(newest.sequence);
    expect(answer.body).toMatchObject({ gaitId, name: "Tripod cruise", robot: { name: "Pier crawler", revision: 1, newestRevision: 1 } });
    expect(answer.body.revision).toBe((await stored()).draftRevision);
  });

  test("a gait without a draft gets one on first read: from its newest version, else from the robot's first suitable template", async () => {
    const db = database();
    const crawler = ids.robotIds["Pier crawler"];
    const [fresh] = await db
      .insert(gaits)
      .values({ workspaceId: ids.workspaceId, robotId: crawler, name: `No draft ${randomUUID()}` })
      .returning();
    const answer = await getDraft("animator", fresh.id);
    expect(answer.status).toBe(200);
    expect(answer.body.revision).toBe(0);
    expect(answer.body.sequence.generator.template).toBe("tripod");
    const row = await stored(fresh.id);
    expect(row.draftSequence).toEqual(answer.body.sequence);
    expect(row.draftRobotRevisionId).not.toBeNull();

    const versioned = await stored(ids.gaitIds["Wave creep"]);
    const [copy] = await db
      .insert(gaits)
      .values({ workspaceId: ids.workspaceId, robotId: crawler, name: `From version ${randomUUID()}` })
      .returning();
    const [version] = await db.select().from(gaitVersions).where(eq(gaitVersions.gaitId, versioned.id)).orderBy(desc(gaitVersions.number)).limit(1);
    await db
      .insert(gaitVersions)
      .values({ ...version, id: undefined, gaitId: copy.id, number: 1, createdAt: undefined, stateChangedAt: undefined, state: "committed" });
    const fromVersion = await getDraft("animator", copy.id);
    expect(fromVersion.body.sequence).toEqual(version.sequence);
  });

  test("unknown, malformed and other workspaces' gait ids: 404, 400, 404", async () => {
    expect((await getDraft("owner", randomUUID())).status).toBe(404);
    const malformed = await getDraft<ApiRefusal>("owner", "not-a-uuid");
    expect(malformed.status).toBe(400);
    expect(malformed.body.error).toMatchObject({ code: "bad_request", message: 'gaitId must be a UUID (got "not-a-uuid")' });

    const db = database();
    const [other] = await db
      .insert(workspaces)
      .values({ slug: `other-${randomUUID()}`, name: "Another lab" })
      .returning();
    const [robot] = await db.insert(robots).values({ workspaceId: other.id, name: "Their crawler" }).returning();
    const [crawlerRevision] = await db.select().from(robotRevisions).where(eq(robotRevisions.robotId, ids.robotIds["Pier crawler"]));
    await db.insert(robotRevisions).values({ robotId: robot.id, number: 1, definition: crawlerRevision.definition });
    const [theirs] = await db.insert(gaits).values({ workspaceId: other.id, robotId: robot.id, name: "Their walk" }).returning();
    const answer = await getDraft<ApiRefusal>("owner", theirs.id);
    expect(answer.status).toBe(404);
    expect(answer.body.error.message).toBe("No such gait in this workspace.");
    expect((await putDraft("owner", { sequence: {}, baseRevision: 0 }, theirs.id)).status).toBe(404);
  });
});

describe("saving the draft", () => {
  test("a save from the current revision stores the sequence, bumps the revision and records who saved", async () => {
    const before = await stored();
    const sequence = await editedSequence(0.55);
    const answer = await putDraft("animator", { sequence, baseRevision: before.draftRevision });
    expect(answer.status).toBe(200);
    expect(answer.body.revision).toBe(before.draftRevision + 1);
    const after = await stored();
    expect(sequenceOf(after.draftSequence).legs.LF.keys[1].t).toBe(0.55);
    expect(after.draftRevision).toBe(before.draftRevision + 1);
    expect(after.draftUpdatedById).toBe(ids.userIds.animator);
    expect(new Date(answer.body.updatedAt).getTime()).toBe(after.draftUpdatedAt.getTime());
    const read = await getDraft("lead");
    expect(read.body.updatedBy).toEqual({ login: "theo-brandt", name: "Theo Brandt" });
  });

  test("two saves from the same base: one wins, the other gets 409 with the current revision and who saved it; nothing of the loser is stored", async () => {
    const base = (await stored()).draftRevision;
    // Either may win, so the answers are read by their status.
    const [a, b] = await Promise.all([
      putDraft<unknown>("animator", { sequence: await editedSequence(0.6), baseRevision: base }),
      putDraft<unknown>("lead", { sequence: await editedSequence(0.65), baseRevision: base }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [won, lost] = a.status === 200 ? [a, b] : [b, a];
    const winner = a.status === 200 ? { login: "theo-brandt", name: "Theo Brandt", t: 0.6 } : { login: "mara-lindqvist", name: "Mara Lindqvist", t: 0.65 };
    expect(won.body).toMatchObject({ revision: base + 1 });
    expect(lost.body).toMatchObject({
      error: {
        code: "conflict",
        details: { baseRevision: base, currentRevision: base + 1, updatedBy: { login: winner.login, name: winner.name } },
        message: expect.stringMatching(
          new RegExp(
            `^Revision ${base + 1} of the draft was saved by ${winner.name} at \\d{4}-\\d\\d-\\d\\d \\d\\d:\\d\\d UTC while you were editing revision ${base}\\. Nothing was saved\\.$`,
          ),
        ),
      },
    });
    const after = await stored();
    expect(after.draftRevision).toBe(base + 1);
    expect(sequenceOf(after.draftSequence).legs.LF.keys[1].t).toBe(winner.t);
  });

  test("a stale base (an older revision) is refused with 409 even when nobody saves at the same moment", async () => {
    const current = (await stored()).draftRevision;
    const answer = await putDraft<ApiRefusal<DraftConflictDetails>>("animator", { sequence: await editedSequence(0.52), baseRevision: current - 1 });
    expect(answer.status).toBe(409);
    expect(answer.body.error.details?.currentRevision).toBe(current);
    expect((await stored()).draftRevision).toBe(current);
  });

  test("an invalid sequence gets 422 with the path of each problem, and nothing is saved", async () => {
    const before = await stored();
    const sequence = await editedSequence(1.2);
    Object.assign(sequence.legs.RM.keys[0], { contact: "hover" }); // not a contact the type allows
    const answer = await putDraft<ApiRefusal<Issue[]>>("animator", { sequence, baseRevision: before.draftRevision });
    expect(answer.status).toBe(422);
    expect(answer.body.error.code).toBe("invalid");
    expect(answer.body.error.message).toBe("The sequence is invalid (2 problems); nothing was saved.");
    expect(answer.body.error.details).toEqual(
      expect.arrayContaining([
        { path: "sequence.legs.LF.keys[1].t", message: "must be at most 1 (got 1.2)" },
        { path: "sequence.legs.RM.keys[0].contact", message: 'must be one of "stance", "swing" (got "hover")' },
      ]),
    );
    const after = await stored();
    expect(after.draftRevision).toBe(before.draftRevision);
    expect(after.draftSequence).toEqual(before.draftSequence);
  });

  test("a sequence for another robot gets 422 naming the missing and the unknown legs", async () => {
    const before = await stored();
    const walker = parseRobot((await database().select().from(robotRevisions).where(eq(robotRevisions.robotId, ids.robotIds["Quay walker"])))[0].definition);
    if (!walker.ok) throw new Error("demo walker invalid");
    const sequence = generateGait(walker.robot, { template: "trot" });
    const answer = await putDraft<ApiRefusal<Issue[]>>("animator", { sequence, baseRevision: before.draftRevision });
    expect(answer.status).toBe(422);
    const paths = answer.body.error.details?.map((issue) => issue.path);
    expect(paths).toContain("sequence.legs.LM");
    expect(answer.body.error.message).toBe('The sequence does not fit robot "Pier crawler"; nothing was saved.');
    expect((await stored()).draftRevision).toBe(before.draftRevision);
  });

  test("a body without baseRevision gets 422 naming it; bad JSON 400; a body over the limit 413; a POST 405", async () => {
    const missing = await putDraft<ApiRefusal<Issue[]>>("animator", { sequence: (await stored()).draftSequence });
    expect(missing.status).toBe(422);
    expect(missing.body.error.details).toEqual([{ path: "baseRevision", message: "must be the draft revision the edits started from (a whole number)" }]);

    const request = await requestsAs("animator", ids);
    const base = await request("PUT", `/api/v1/gaits/${gaitId}/draft`);
    const badJson = await outcome<ApiRefusal>(async () =>
      act(draftApi, new Request(base.url, { method: "PUT", headers: base.headers, body: "{not json" }), { gaitId }),
    );
    expect(badJson.status).toBe(400);
    expect(badJson.body.error.code).toBe("bad_request");

    const huge = await outcome<ApiRefusal>(async () =>
      act(draftApi, new Request(base.url, { method: "PUT", headers: base.headers, body: JSON.stringify({ pad: "x".repeat(1024 * 1024 + 10) }) }), { gaitId }),
    );
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe("payload_too_large");

    const post = await outcome<ApiRefusal>(async () => act(draftApi, await request("POST", `/api/v1/gaits/${gaitId}/draft`, { json: {} }), { gaitId }));
    expect(post.status).toBe(405);
    expect(post.headers.get("Allow")).toBe("GET, HEAD, PUT");
    expect(post.body.error.code).toBe("method_not_allowed");
  });

  test("viewers and firmware read the draft but cannot save it (403, nothing stored); signed out gets 401", async () => {
    const before = await stored();
    for (const caller of ["viewer", "firmware"] as const) {
      expect((await getDraft(caller)).status).toBe(200);
      const answer = await putDraft<ApiRefusal>(caller, { sequence: await editedSequence(0.51), baseRevision: before.draftRevision });
      expect(answer.status).toBe(403);
      expect(answer.body.error.message).toBe(`The ${caller} role cannot edit gaits.`);
    }
    expect((await putDraft("signed-out", { sequence: {}, baseRevision: 0 })).status).toBe(401);
    expect((await stored()).draftRevision).toBe(before.draftRevision);
  });
});

describe("moving the draft to the robot's newest revision", () => {
  async function move<Answer = unknown>(caller: Caller, baseRevision: number, id: string) {
    const request = await requestsAs(caller, ids);
    return outcome<Answer>(async () =>
      act(editor, await request("POST", `/gaits/${id}/edit`, { form: { intent: "move-to-newest-robot", baseRevision: String(baseRevision) } }), { gaitId: id }),
    );
  }

  test("pins the newest revision, bumps the draft revision, writes the audit log; a second move is refused as already done", async () => {
    const id = ids.gaitIds["Crawl"];
    const before = await stored(id);
    const { latest, newer } = await addRobotRevision(database(), before.robotId, { message: "re-measured" });
    const answer = await move("animator", before.draftRevision, id);
    expect(answer.status).toBe(200);
    expect(answer.body).toMatchObject({ ok: true, from: latest.number, to: newer.number, revision: before.draftRevision + 1 });
    const after = await stored(id);
    expect(after.draftRobotRevisionId).toBe(newer.id);
    expect(after.draftSequence).toEqual(before.draftSequence);
    const [entry] = await database()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, "gait.draft.robot-moved"), eq(auditLog.targetId, id)));
    expect(entry.details).toEqual({ fromRobotRevision: latest.number, toRobotRevision: newer.number });

    const again = await move<FormRefusal>("animator", after.draftRevision, id);
    expect(again.status).toBe(409);
    expect(again.body.error).toBe(`The draft already uses robot revision ${newer.number}, the newest.`);
    const page = await outcome<LoaderData<typeof editor>>(async () =>
      load(editor, await (await requestsAs("viewer", ids))("GET", `/gaits/${id}/edit`), { gaitId: id }),
    );
    expect(page.body.robotRevision.number).toBe(newer.number);
    expect(page.body.can).toEqual({ edit: false, commit: false });
  });

  test("a newest revision the draft does not fit (a leg renamed) is refused with 422 and nothing moves; a stale base gets 409", async () => {
    const id = ids.gaitIds["Trot"];
    const before = await stored(id);
    const latest = await newestRobotRevision(database(), before.robotId);
    const renamed = robotOf(latest.definition);
    const oldId = renamed.legs[0].id;
    renamed.legs[0].id = "XF";
    if (renamed.rest) {
      renamed.rest.XF = renamed.rest[oldId];
      delete renamed.rest[oldId];
    }
    await addRobotRevision(database(), before.robotId, { definition: renamed });
    const refused = await move<FormRefusal>("lead", before.draftRevision, id);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatch(/^The draft does not fit robot revision \d+: legs\.XF is missing/);
    expect((await stored(id)).draftRobotRevisionId).toBe(before.draftRobotRevisionId);

    await addRobotRevision(database(), before.robotId, { definition: latest.definition });
    const stale = await move("lead", before.draftRevision - 1, id);
    expect(stale.status).toBe(409);
    expect((await stored(id)).draftRobotRevisionId).toBe(before.draftRobotRevisionId);
  });
});

describe("the editor page", () => {
  test("loads the draft, the pinned robot and what the role may do", async () => {
    const answer = await outcome<LoaderData<typeof editor>>(async () =>
      load(editor, await (await requestsAs("animator", ids))("GET", `/gaits/${gaitId}/edit`), { gaitId }),
    );
    expect(answer.status).toBe(200);
    expect(answer.body.can).toEqual({ edit: true, commit: true });
    expect(answer.body.gait.name).toBe("Tripod cruise");
    expect(parseSequence(answer.body.sequence).ok).toBe(true);
    expect(answer.body.robot.legs).toHaveLength(6);
    const missing = await outcome(async () =>
      load(editor, await (await requestsAs("animator", ids))("GET", `/gaits/${randomUUID()}/edit`), { gaitId: randomUUID() }),
    );
    expect(missing.status).toBe(404);
  });
});
