// Saving the robot form: each save a new immutable revision, optimistic
// concurrency on the base revision, clear refusals that write nothing.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { robotRevisions, robots, workspaces } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, outcome, requestsAs, type DemoIds, type FormRefusal, type LoaderData } from "../../support/routes";
import { demoRobotJson, robotOf } from "../../support/robots";
import type { SaveRefusalDetails, SavedRevision } from "~/features/robots/results";
import type { Robot } from "~/kinematics";
import { database } from "~/platform/db.server";
import { refusal } from "~/platform/permissions";
import * as robotPage from "~/routes/robots/robot";
import * as revisionPage from "~/routes/robots/revision";
import { revisionCount, revisionsOf } from "./support";

let ids: DemoIds;
let crawlerId: string;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  crawlerId = ids.robotIds["Pier crawler"];
});

async function latestOf(robotId: string) {
  const all = await revisionsOf(robotId);
  return all[all.length - 1];
}

/** The robot form's save; `Answer` is what the test expects back: a SavedRevision or a SaveRefusal. */
async function save<Answer = unknown>(caller: Parameters<typeof requestsAs>[0], robotId: string, fields: Record<string, string>) {
  const request = await requestsAs(caller, ids);
  return outcome<Answer>(async () => act(robotPage, await request("POST", `/robots/${robotId}`, { form: { intent: "save", ...fields } }), { robotId }));
}

type SaveRefusal = FormRefusal<SaveRefusalDetails>;

/** A stored definition with a change made, as the form posts it. */
function edited(definition: unknown, change: (copy: Robot) => void) {
  const copy = robotOf(definition);
  change(copy);
  return JSON.stringify(copy);
}

describe("saving a robot", () => {
  test("a save makes revision 2 with its author, time and message; revision 1 stays as it was", async () => {
    const before = await latestOf(crawlerId);
    expect(before.number).toBe(1);
    const started = Date.now();
    const answer = await save("animator", crawlerId, {
      baseRevision: "1",
      message: "Femur measured again",
      definition: edited(before.definition, (copy) => (copy.legs[0].femur = 63.5)),
    });
    expect(answer.status).toBe(200);
    expect(answer.body).toEqual({ ok: true, number: 2, message: "Femur measured again" });
    const [first, second] = await revisionsOf(crawlerId);
    expect(first.definition).toEqual(before.definition);
    expect(second).toMatchObject({ number: 2, message: "Femur measured again", authorId: ids.userIds.animator });
    expect(robotOf(second.definition).legs[0].femur).toBe(63.5);
    expect(second.createdAt.getTime()).toBeGreaterThanOrEqual(started - 5_000);

    const page = await outcome<LoaderData<typeof robotPage>>(async () =>
      load(robotPage, await (await requestsAs("viewer", ids))("GET", `/robots/${crawlerId}`), { robotId: crawlerId }),
    );
    expect(page.status).toBe(200);
    expect(page.body.robot.latest.number).toBe(2);
    expect(page.body.robot.revisions.map((revision) => [revision.number, revision.author?.login, revision.message])).toEqual([
      [2, "theo-brandt", "Femur measured again"],
      [1, "theo-brandt", "First measured build of the six-legged pier crawler"],
    ]);
    expect(page.body.mode).toBe("read");
  });

  test("two saves from the same base: one wins, the other gets 409 naming the newer revision, and only one revision is added", async () => {
    const base = await latestOf(crawlerId);
    const count = await revisionCount();
    // Either may win, so the answers are read by their status.
    const [a, b] = await Promise.all([
      save("animator", crawlerId, { baseRevision: String(base.number), definition: edited(base.definition, (copy) => (copy.legs[1].tibia = 101)) }),
      save("lead", crawlerId, { baseRevision: String(base.number), definition: edited(base.definition, (copy) => (copy.legs[2].tibia = 102)) }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const lost = a.status === 409 ? a : b;
    const winner = a.status === 409 ? "Mara Lindqvist" : "Theo Brandt";
    expect(lost.body).toMatchObject({
      code: "stale",
      details: { baseRevision: base.number, latest: { number: base.number + 1, authorName: winner } },
      error: expect.stringMatching(
        new RegExp(
          `^Revision ${base.number + 1} was saved by ${winner} at \\d{4}-\\d\\d-\\d\\d \\d\\d:\\d\\d UTC while you were editing revision ${base.number}\\. Nothing was saved\\.$`,
        ),
      ),
    });
    expect(await revisionCount()).toBe(count + 1);
  });

  test("a stale save can be made on top once the person names the newer base", async () => {
    const latest = await latestOf(crawlerId);
    const answer = await save("animator", crawlerId, {
      baseRevision: String(latest.number),
      definition: edited(latest.definition, (copy) => (copy.standHeight = 92)),
    });
    expect(answer.body).toMatchObject({ ok: true, number: latest.number + 1 });
  });

  test("without a message, the revision says what changed", async () => {
    const latest = await latestOf(crawlerId);
    const answer = await save<SavedRevision>("owner", crawlerId, {
      baseRevision: String(latest.number),
      definition: edited(latest.definition, (copy) => (copy.legs[0].coxa = 31)),
    });
    expect(answer.body.message).toBe(`Changed legs[0].coxa (${robotOf(latest.definition).legs[0].coxa} → 31)`);
  });

  test("renaming the robot renames it in the list; a name another robot has is 409", async () => {
    const latest = await latestOf(crawlerId);
    const renamed = await save("animator", crawlerId, {
      baseRevision: String(latest.number),
      definition: edited(latest.definition, (copy) => (copy.name = "Pier crawler Mk2")),
    });
    expect(renamed.status).toBe(200);
    const [row] = await database().select().from(robots).where(eq(robots.id, crawlerId));
    expect(row.name).toBe("Pier crawler Mk2");
    const next = await latestOf(crawlerId);
    const count = await revisionCount();
    const taken = await save("animator", crawlerId, {
      baseRevision: String(next.number),
      definition: edited(next.definition, (copy) => (copy.name = "Quay walker")),
    });
    expect(taken.status).toBe(409);
    expect(taken.body).toMatchObject({
      code: "name-taken",
      error: 'Another robot in this workspace is already called "Quay walker": give this one another name. Nothing was saved.',
    });
    expect(await revisionCount()).toBe(count);
  });
});

describe("bad saves are refused with what and where, and write nothing", () => {
  test("an invalid definition: 422 with parseRobot's path and message", async () => {
    const latest = await latestOf(crawlerId);
    const count = await revisionCount();
    const answer = await save<SaveRefusal>("animator", crawlerId, {
      baseRevision: String(latest.number),
      definition: edited(latest.definition, (copy) => {
        copy.legs[2].joints.femur.minDeg = 40;
        copy.legs[2].joints.femur.maxDeg = 30;
        copy.legs[0].tibia = -1;
      }),
    });
    expect(answer.status).toBe(422);
    expect(answer.body).toMatchObject({ code: "invalid", error: "The definition has 2 problems. Nothing was saved." });
    expect(answer.body.details?.issues).toEqual(
      expect.arrayContaining([
        { path: "legs[0].tibia", field: "Leg LF, tibia length", message: "Leg LF, tibia length must be at least 1 (got -1)" },
        { path: "legs[2].joints.femur.minDeg", field: "Leg LR, femur minimum", message: "Leg LR, femur minimum must be below the maximum (got 40 ≥ 30)" },
      ]),
    );
    expect(await revisionCount()).toBe(count);
  });

  test("not JSON: 400; a missing base revision: 400; nothing changed: 422", async () => {
    const latest = await latestOf(crawlerId);
    const notJson = await save<SaveRefusal>("animator", crawlerId, { baseRevision: String(latest.number), definition: "{ legs: " });
    expect(notJson.status).toBe(400);
    expect(notJson.body.error).toBe('Cannot save: the definition is not valid JSON: unexpected "l" at line 1, column 3.');
    const noBase = await save<SaveRefusal>("animator", crawlerId, { definition: JSON.stringify(latest.definition) });
    expect(noBase.status).toBe(400);
    expect(noBase.body.error).toBe("Cannot save: baseRevision is required: the revision the edits started from.");
    const same = await save<SaveRefusal>("animator", crawlerId, { baseRevision: String(latest.number), definition: JSON.stringify(latest.definition) });
    expect(same.status).toBe(422);
    expect(same.body.error).toBe(`Nothing changed since revision ${latest.number}, so nothing was saved.`);
  });

  test("a body over the limit: 413", async () => {
    const latest = await latestOf(crawlerId);
    const answer = await save<SaveRefusal>("animator", crawlerId, {
      baseRevision: String(latest.number),
      definition: edited(latest.definition, (copy) => (copy.description = "x".repeat(300 * 1024))),
    });
    expect(answer.status).toBe(413);
    expect(answer.body.error).toMatch(/^The save is [\d.]+ KB; a robot definition may be up to 256 KB\. Nothing was saved\.$/);
  });

  test("an unknown robot, a malformed id and another workspace's robot are all 404", async () => {
    const [other] = await database().insert(workspaces).values({ slug: "other-lab-save", name: "Other lab" }).returning();
    const [foreign] = await database().insert(robots).values({ workspaceId: other.id, name: "Theirs" }).returning();
    await database()
      .insert(robotRevisions)
      .values({ robotId: foreign.id, number: 1, definition: demoRobotJson("quay-walker") });
    const definition = JSON.stringify(demoRobotJson("quay-walker"));
    for (const robotId of [foreign.id, "00000000-0000-4000-8000-000000000000", "not-a-uuid"]) {
      const answer = await save("owner", robotId, { baseRevision: "1", definition });
      expect(answer.status, robotId).toBe(404);
      const page = await outcome(async () => load(robotPage, await (await requestsAs("owner", ids))("GET", `/robots/${robotId}`), { robotId }));
      expect(page.status, robotId).toBe(404);
    }
    expect(await revisionsOf(foreign.id)).toHaveLength(1);
  });

  test("a viewer is refused with 403 before anything is read", async () => {
    const latest = await latestOf(crawlerId);
    const answer = await save("viewer", crawlerId, {
      baseRevision: String(latest.number),
      definition: edited(latest.definition, (copy) => (copy.legs[0].femur = 70)),
    });
    expect(answer.status).toBe(403);
    expect(answer.body).toEqual({ message: refusal("viewer", "robots.calibrate") });
  });
});

describe("old revisions", () => {
  test("an old revision can be viewed and restored as a new revision", async () => {
    const request = await requestsAs("lead", ids);
    const first = await outcome<LoaderData<typeof revisionPage>>(async () =>
      load(revisionPage, await request("GET", `/robots/${crawlerId}/revisions/1`), { robotId: crawlerId, number: "1" }),
    );
    expect(first.status).toBe(200);
    expect(first.body.revision.number).toBe(1);
    const [original] = await revisionsOf(crawlerId);
    expect(first.body.revision.definition).toEqual(original.definition);

    const latest = await latestOf(crawlerId);
    const restored = await outcome(async () =>
      act(revisionPage, await request("POST", `/robots/${crawlerId}/revisions/1`, { form: { intent: "restore", baseRevision: String(latest.number) } }), {
        robotId: crawlerId,
        number: "1",
      }),
    );
    expect(restored).toMatchObject({ status: 302, location: `/robots/${crawlerId}` });
    const now = await latestOf(crawlerId);
    expect(now).toMatchObject({ number: latest.number + 1, message: "Restored revision 1", authorId: ids.userIds.lead });
    expect(now.definition).toEqual(original.definition);
    const [row] = await database().select().from(robots).where(eq(robots.id, crawlerId));
    expect(row.name).toBe("Pier crawler");

    const missing = await outcome(async () =>
      load(revisionPage, await request("GET", `/robots/${crawlerId}/revisions/999`), { robotId: crawlerId, number: "999" }),
    );
    expect(missing.status).toBe(404);
    const zero = await outcome(async () => load(revisionPage, await request("GET", `/robots/${crawlerId}/revisions/0`), { robotId: crawlerId, number: "0" }));
    expect(zero.status).toBe(404);
  });
});
