// Adding robots from the robot list: a new one from a copy or the starter, an
// uploaded definition (size limit, exact `path: message` errors, nothing saved
// when invalid), each refused with the right status.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { robots } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, multipart, outcome, requestsAs, type Caller, type DemoIds, type FormRefusal, type LoaderData } from "../../support/routes";
import { uniqueName } from "../../support/names";
import { demoRobotJson, robotOf } from "../../support/robots";
import type { AddRefusalDetails } from "~/features/robots/results";
import { database } from "~/platform/db.server";
import * as list from "~/routes/robots/list";
import { revisionCount, revisionsOf, robotCount } from "./support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

const jsonFile = (value: unknown, name = "robot.json") =>
  new File([typeof value === "string" ? value : JSON.stringify(value, null, 2)], name, { type: "application/json" });

/** The list's upload: a redirect to the new robot, or a refusal with a status. */
async function upload(fields: Record<string, string | File>, caller: Caller = "animator") {
  const request = await requestsAs(caller, ids);
  return outcome<FormRefusal<AddRefusalDetails>>(async () => act(list, await multipart(request, "/robots?index", { intent: "upload", ...fields })));
}

async function unchanged<T>(run: () => Promise<T>): Promise<T> {
  const [robotsBefore, revisionsBefore] = [await robotCount(), await revisionCount()];
  const result = await run();
  expect(await robotCount(), "robots after a refused add").toBe(robotsBefore);
  expect(await revisionCount(), "revisions after a refused add").toBe(revisionsBefore);
  return result;
}

describe("upload a robot definition", () => {
  test("a valid file creates the robot with revision 1 and opens its page", async () => {
    const name = uniqueName("Uploaded walker");
    const answer = await upload({ file: jsonFile({ ...demoRobotJson("quay-walker"), name }, "walker.json") });
    expect(answer.status).toBe(302);
    const [row] = await database().select().from(robots).where(eq(robots.name, name));
    expect(answer.location).toBe(`/robots/${row.id}`);
    const [revision] = await revisionsOf(row.id);
    expect(revision).toMatchObject({ number: 1, message: "Uploaded from walker.json", authorId: ids.userIds.animator });
    expect(robotOf(revision.definition).legs).toHaveLength(4);
  });

  test("the name field replaces the file's name", async () => {
    const name = uniqueName("Renamed on upload");
    const answer = await upload({ file: jsonFile(demoRobotJson("pier-crawler")), name });
    expect(answer.status).toBe(302);
    expect(await database().select().from(robots).where(eq(robots.name, name))).toHaveLength(1);
  });

  test("an invalid definition: 422 listing each path, the field's name and the message in its words exactly, nothing saved", async () => {
    const broken = demoRobotJson("pier-crawler");
    broken.name = uniqueName("Broken");
    broken.legs[2].joints.femur.minDeg = 40;
    broken.legs[2].joints.femur.maxDeg = 30;
    // A misspelt field and a missing one, which the robot type would not allow: the server must refuse them.
    Object.assign(broken.legs[0], { coxaLength: 3 });
    Reflect.deleteProperty(broken, "standHeight");
    const answer = await unchanged(() => upload({ file: jsonFile(broken) }));
    expect(answer.status).toBe(422);
    expect(answer.body).toMatchObject({ code: "invalid", error: "The definition has 3 problems. Nothing was saved." });
    expect(answer.body.details?.issues).toEqual([
      { path: "standHeight", field: "Stand height", message: "Stand height is required" },
      { path: "legs[0].coxaLength", field: 'Leg LF, "coxaLength"', message: 'Leg LF, "coxaLength" is not a known field (check the spelling)' },
      { path: "legs[2].joints.femur.minDeg", field: "Leg LR, femur minimum", message: "Leg LR, femur minimum must be below the maximum (got 40 ≥ 30)" },
    ]);
  });

  test("rules across fields are reported once the shape is right", async () => {
    const broken = demoRobotJson("pier-crawler");
    broken.name = uniqueName("Broken limits");
    broken.legs[2].joints.femur.minDeg = 40;
    broken.legs[2].joints.femur.maxDeg = 30;
    broken.legs[1].id = "LF";
    const answer = await unchanged(() => upload({ file: jsonFile(broken) }));
    expect(answer.status).toBe(422);
    expect(answer.body.details?.issues).toEqual([
      { path: "legs[2].joints.femur.minDeg", field: "Leg LR, femur minimum", message: "Leg LR, femur minimum must be below the maximum (got 40 ≥ 30)" },
      { path: "legs[1].id", field: "Leg 2, name", message: 'Leg 2, name must be unique (got "LF", also leg 1)' },
      { path: "rest.LM", field: "Rest pose, leg LM", message: 'Rest pose, leg LM must name a leg (no leg "LM")' },
    ]);
  });

  test("not JSON: 400 with the line and column", async () => {
    const answer = await unchanged(() => upload({ file: jsonFile('{\n  "format": "gaitloom.robot/1",\n  "name": oops\n}', "oops.json") }));
    expect(answer.status).toBe(400);
    expect(answer.body.error).toBe(`oops.json is not valid JSON: unexpected "o" at line 3, column 11. Nothing was saved.`);
  });

  test("a file over 256 KB: 413, nothing saved", async () => {
    const big = { ...demoRobotJson("pier-crawler"), name: uniqueName("Big"), description: "x".repeat(1900) };
    const padded = JSON.stringify(big) + " ".repeat(260 * 1024);
    const answer = await unchanged(() => upload({ file: jsonFile(padded, "big.json") }));
    expect(answer.status).toBe(413);
    expect(answer.body.error).toMatch(/^big\.json is [\d.]+ KB; a robot definition \(JSON\) may be up to 256 KB\. Nothing was saved\.$/);
  });

  test("a request body over every limit is refused before it is read: 413", async () => {
    const answer = await unchanged(() => upload({ file: jsonFile(" ".repeat(1200 * 1024), "huge.json") }));
    expect(answer.status).toBe(413);
    expect(answer.body).toMatchObject({ code: "too-large" });
  });

  test("no file, an empty file: 400", async () => {
    const none = await unchanged(() => upload({}));
    expect(none.status).toBe(400);
    expect(none.body.error).toBe("Choose a robot definition (JSON) to upload.");
    const empty = await unchanged(() => upload({ file: new File([], "empty.json") }));
    expect(empty.status).toBe(400);
  });

  test("a name another robot has: 409, nothing saved", async () => {
    const answer = await unchanged(() => upload({ file: jsonFile(demoRobotJson("pier-crawler")) }));
    expect(answer.status).toBe(409);
    expect(answer.body.error).toBe('Another robot in this workspace is already called "Pier crawler": give this one another name. Nothing was saved.');
  });

  test.each(["firmware", "viewer"] as const)("%s may not upload: 403, nothing saved", async (caller) => {
    const answer = await unchanged(() => upload({ file: jsonFile({ ...demoRobotJson("quay-walker"), name: uniqueName("Refused") }) }, caller));
    expect(answer.status).toBe(403);
  });
});

describe("new robot", () => {
  /** The list's new-robot form: a redirect to the new robot, or a refusal with a status. */
  async function create(form: Record<string, string>, caller: Caller = "lead") {
    const request = await requestsAs(caller, ids);
    return outcome<FormRefusal<AddRefusalDetails>>(async () => act(list, await request("POST", "/robots?index", { form: { intent: "create", ...form } })));
  }

  test("a copy of a demo robot starts at revision 1 with the same legs", async () => {
    const name = uniqueName("Crawler copy");
    const answer = await create({ name, source: `robot-${ids.robotIds["Pier crawler"]}` });
    expect(answer.status).toBe(302);
    const [row] = await database().select().from(robots).where(eq(robots.name, name));
    const [revision] = await revisionsOf(row.id);
    const [original] = await revisionsOf(ids.robotIds["Pier crawler"]);
    expect(revision.definition).toEqual({ ...(original.definition as object), name });
    expect(revision.message).toBe("Copied from Pier crawler, revision 1");
  });

  test.each(["4", "6", "8"])("the %s-leg starter template", async (legs) => {
    const name = uniqueName(`Starter ${legs}`);
    const answer = await create({ name, source: `starter-${legs}` });
    expect(answer.status).toBe(302);
    const [row] = await database().select().from(robots).where(eq(robots.name, name));
    const [revision] = await revisionsOf(row.id);
    expect(robotOf(revision.definition).legs).toHaveLength(Number(legs));
  });

  test("no name, an unknown source, another workspace's robot: refused, nothing saved", async () => {
    const noName = await unchanged(() => create({ name: "  ", source: "starter-6" }));
    expect(noName.status).toBe(400);
    expect(noName.body.error).toBe("Cannot create the robot: give the robot a name.");
    const badSource = await unchanged(() => create({ name: uniqueName("X"), source: "starter-5" }));
    expect(badSource.status).toBe(400);
    expect(badSource.body.error).toBe("Cannot create the robot: choose what the new robot starts from.");
    const missing = await unchanged(() => create({ name: uniqueName("X"), source: "robot-00000000-0000-4000-8000-000000000000" }));
    expect(missing.status).toBe(404);
    const unknownIntent = await unchanged(() => create({ intent: "explode", name: "x" }));
    expect(unknownIntent.status).toBe(400);
  });

  test("the list links every robot and says who may add one", async () => {
    const asViewer = await outcome<LoaderData<typeof list>>(async () => load(list, await (await requestsAs("viewer", ids))("GET", "/robots")));
    expect(asViewer.body.canEdit).toBe(false);
    expect(asViewer.body.robots.map((robot) => robot.name)).toEqual(expect.arrayContaining(["Pier crawler", "Quay walker", "Hull climber"]));
    const asAnimator = await outcome<LoaderData<typeof list>>(async () => load(list, await (await requestsAs("animator", ids))("GET", "/robots")));
    expect(asAnimator.body.canEdit).toBe(true);
  });
});
