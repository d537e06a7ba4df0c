// Starting a gait: the robots and the templates that suit each, creating the
// gait with its first draft on the robot's newest revision, and the copy that
// keeps someone's edits after a stale save.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, gaits, robotRevisions } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, outcome, requestsAs, type Caller, type DemoIds, type FormRefusal, type LoaderData } from "../../support/routes";
import { uniqueName } from "../../support/names";
import { sequenceOf } from "./support";
import { parseSequence } from "~/gait";
import { database } from "~/platform/db.server";
import * as newGait from "~/routes/gaits/new";

let ids: DemoIds;
beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function post<Answer = unknown>(caller: Caller, form: Record<string, string>) {
  const request = await requestsAs(caller, ids);
  return outcome<Answer>(async () => act(newGait, await request("POST", "/gaits/new", { form })));
}

describe("the new-gait page", () => {
  test("offers each robot with the templates its legs suit (six legs: tripod, tetrapod, ripple, wave; four: wave, trot; eight: wave, alternating tetrapod)", async () => {
    const answer = await outcome<LoaderData<typeof newGait>>(async () => load(newGait, await (await requestsAs("animator", ids))("GET", "/gaits/new")));
    expect(answer.status).toBe(200);
    const byName = Object.fromEntries(answer.body.robots.map((robot) => [robot.name, robot.templates.map((template) => template.name)]));
    expect(byName["Pier crawler"]).toEqual(["tripod", "tetrapod", "ripple", "wave"]);
    expect(byName["Quay walker"]).toEqual(["wave", "trot"]);
    expect(byName["Hull climber"]).toEqual(["wave", "alternating-tetrapod"]);
    const crawler = answer.body.robots.find((robot) => robot.name === "Pier crawler");
    expect(crawler?.templates.find((template) => template.name === "wave")?.dutyFactor).toBeCloseTo(5 / 6, 9);
  });

  test("creates the gait with a generated draft on the newest robot revision and opens the editor", async () => {
    const name = uniqueName("Quick tripod");
    const answer = await post("animator", {
      intent: "create",
      robotId: ids.robotIds["Pier crawler"],
      name,
      template: "tripod",
      cycleMs: "1000",
      fps: "50",
      strideMm: "50",
      stepHeightMm: "30",
    });
    expect(answer.status).toBe(302);
    const gaitId = answer.location!.match(/^\/gaits\/([0-9a-f-]{36})\/edit$/)![1];
    const [row] = await database().select().from(gaits).where(eq(gaits.id, gaitId));
    expect(row).toMatchObject({
      name,
      workspaceId: ids.workspaceId,
      robotId: ids.robotIds["Pier crawler"],
      createdById: ids.userIds.animator,
      draftRevision: 1,
    });
    const sequence = parseSequence(row.draftSequence);
    if (!sequence.ok) throw new Error("stored draft invalid");
    expect(sequence.sequence).toMatchObject({
      name,
      cycleMs: 1000,
      fps: 50,
      generator: { template: "tripod", strideMm: 50, stepHeightMm: 30, dutyFactor: 0.5 },
    });
    const [revision] = await database().select().from(robotRevisions).where(eq(robotRevisions.id, row.draftRobotRevisionId!));
    expect(revision.robotId).toBe(ids.robotIds["Pier crawler"]);
    const [entry] = await database().select().from(auditLog).where(eq(auditLog.targetId, gaitId));
    expect(entry).toMatchObject({ action: "gait.created", actorId: ids.userIds.animator, details: { name, template: "tripod", robot: "Pier crawler" } });
  });

  test("refusals name the field: a taken name (409), a template the robot does not suit (422), a bad number (422)", async () => {
    const taken = await post("lead", { intent: "create", robotId: ids.robotIds["Pier crawler"], name: "Tripod cruise", template: "tripod" });
    expect(taken.status).toBe(409);
    expect(taken.body).toMatchObject({ error: "This robot already has a gait named “Tripod cruise”; choose another name.", code: "name-taken", field: "name" });

    const unsuited = await post<FormRefusal>("lead", { intent: "create", robotId: ids.robotIds["Pier crawler"], name: uniqueName("Trot"), template: "trot" });
    expect(unsuited.status).toBe(422);
    expect(unsuited.body.field).toBe("template");
    expect(unsuited.body.error).toMatch(/^template: trot needs 4 legs/);

    const badNumber = await post("lead", {
      intent: "create",
      robotId: ids.robotIds["Pier crawler"],
      name: uniqueName("Odd"),
      template: "wave",
      cycleMs: "fast",
    });
    expect(badNumber.status).toBe(422);
    expect(badNumber.body).toMatchObject({ error: "Cycle time (ms): must be a number", code: "invalid", field: "cycleMs" });
  });

  test("keep mine as a copy: a new gait on the same robot revision holding the posted sequence", async () => {
    const [source] = await database().select().from(gaits).where(eq(gaits.id, ids.gaitIds["Wave creep"]));
    const sequence = sequenceOf(source.draftSequence);
    sequence.legs.LF.keys[0].apexMm = 44;
    const name = uniqueName("Wave creep (my copy)");
    const answer = await post("animator", { intent: "copy", sourceGaitId: source.id, name, sequence: JSON.stringify(sequence) });
    expect(answer.status).toBe(302);
    const copyId = answer.location!.split("/")[2];
    const [copy] = await database().select().from(gaits).where(eq(gaits.id, copyId));
    expect(copy).toMatchObject({ name, robotId: source.robotId, draftRobotRevisionId: source.draftRobotRevisionId, description: source.description });
    expect(sequenceOf(copy.draftSequence).legs.LF.keys[0].apexMm).toBe(44);
    expect(sequenceOf(copy.draftSequence).name).toBe(name);

    const broken = await post<FormRefusal>("animator", { intent: "copy", sourceGaitId: source.id, name: uniqueName("Broken"), sequence: "{not json" });
    expect(broken.status).toBe(400);
    expect(broken.body.field).toBe("sequence");
  });

  test("viewers and firmware cannot open or post the page", async () => {
    for (const caller of ["viewer", "firmware"] as const) {
      const page = await outcome(async () => load(newGait, await (await requestsAs(caller, ids))("GET", "/gaits/new")));
      expect(page.status).toBe(403);
      const created = await post(caller, { intent: "create", robotId: ids.robotIds["Pier crawler"], name: uniqueName("Nope"), template: "tripod" });
      expect(created.status).toBe(403);
    }
  });
});
