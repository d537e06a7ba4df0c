// Downloads of any revision's JSON, and the robot API: list, one robot with its
// revisions, one revision, the public schema; 404 JSON for robots not in the workspace.
import { beforeAll, describe, expect, test } from "vitest";
import { apiTokens, robotRevisions, robots, workspaces } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, bearer, demoIds, load, outcome, requestsAs, type ApiRefusal, type DemoIds } from "../../support/routes";
import { demoRobotJson, robotOf } from "../../support/robots";
import { robotJsonSchema } from "~/kinematics";
import { hashToken } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import * as apiList from "~/routes/api.v1/robots/list";
import * as apiRevision from "~/routes/api.v1/robots/revision";
import * as apiRobot from "~/routes/api.v1/robots/robot";
import * as apiSchema from "~/routes/api.v1/robots/schema";
import * as download from "~/routes/robots/download";
import * as robotPage from "~/routes/robots/robot";
import { revisionsOf } from "./support";

/** The robot API's answers, as far as these tests read them; definitions are read back with robotOf. */
type RevisionJson = ReturnType<typeof apiRobot.revisionJson>;
type RobotListAnswer = { robots: { id: string; name: string; updatedAt: string }[] };
type RobotAnswer = { latest: RevisionJson & { definition: unknown }; revisions: RevisionJson[] };
type RevisionAnswer = { revision: RevisionJson & { definition: unknown } };

let ids: DemoIds;
let walkerId: string;
let foreignId: string;
const TOKEN = "gl_robots_test_token_0123456789";

beforeAll(async () => {
  const db = database();
  await seedDemo(db);
  ids = await demoIds(db);
  walkerId = ids.robotIds["Quay walker"];
  const [other] = await db.insert(workspaces).values({ slug: "other-lab-api", name: "Other lab" }).returning();
  const [foreign] = await db.insert(robots).values({ workspaceId: other.id, name: "Their walker" }).returning();
  await db.insert(robotRevisions).values({ robotId: foreign.id, number: 1, definition: demoRobotJson("quay-walker") });
  foreignId = foreign.id;
  await db
    .insert(apiTokens)
    .values({ workspaceId: ids.workspaceId, userId: ids.userIds.firmware, name: "build script", tokenHash: hashToken(TOKEN), prefix: TOKEN.slice(0, 8) });

  // A second revision of the walker, saved through the form.
  const [first] = await revisionsOf(walkerId);
  const edited = robotOf(first.definition);
  edited.legs[0].joints.coxa.zeroOffsetDeg = 1.5;
  const request = await requestsAs("firmware", ids);
  const saved = await outcome(async () =>
    act(
      robotPage,
      await request("POST", `/robots/${walkerId}`, { form: { intent: "save", baseRevision: "1", definition: JSON.stringify(edited), message: "Coxa trim" } }),
      {
        robotId: walkerId,
      },
    ),
  );
  expect(saved.status).toBe(200);
});

describe("download a revision's JSON", () => {
  test.each([1, 2])("revision %i comes as a file named after the robot and revision, the definition as stored", async (number) => {
    const request = await requestsAs("viewer", ids);
    const answer = await outcome(async () =>
      load(download, await request("GET", `/robots/${walkerId}/revisions/${number}/download`), { robotId: walkerId, number: String(number) }),
    );
    expect(answer.status).toBe(200);
    expect(answer.headers?.get("Content-Disposition")).toBe(`attachment; filename="quay-walker-r${number}.robot.json"`);
    expect(answer.headers?.get("Content-Type")).toBe("application/json; charset=utf-8");
    const revisions = await revisionsOf(walkerId);
    expect(answer.body).toEqual(revisions[number - 1].definition);
  });

  test("a revision that does not exist, a malformed number, another workspace's robot: 404", async () => {
    const request = await requestsAs("owner", ids);
    for (const [robotId, number] of [
      [walkerId, "3"],
      [walkerId, "one"],
      [walkerId, "0"],
      [foreignId, "1"],
      ["nope", "1"],
    ]) {
      const answer = await outcome(async () => load(download, await request("GET", `/robots/${robotId}/revisions/${number}/download`), { robotId, number }));
      expect(answer.status, `${robotId} ${number}`).toBe(404);
    }
  });

  test("signed out: sent to sign in", async () => {
    const request = await requestsAs("signed-out", ids);
    const answer = await outcome(async () =>
      load(download, await request("GET", `/robots/${walkerId}/revisions/1/download`), { robotId: walkerId, number: "1" }),
    );
    expect(answer.status).toBe(302);
    expect(answer.location).toMatch(/^\/sign-in\?returnTo=/);
  });
});

describe("GET /api/v1/robots", () => {
  test("lists the workspace's robots, not another's, with a bearer token", async () => {
    const answer = await outcome<RobotListAnswer>(async () => load(apiList, bearer("/api/v1/robots", TOKEN)));
    expect(answer.status).toBe(200);
    const names = answer.body.robots.map((robot) => robot.name);
    expect(names).toEqual(["Hull climber", "Pier crawler", "Quay walker"]);
    const walker = answer.body.robots.find((robot) => robot.id === walkerId);
    expect(walker).toMatchObject({ legCount: 4, latestRevision: 2, url: `/api/v1/robots/${walkerId}` });
    expect(new Date(walker?.updatedAt ?? "").toISOString()).toBe(walker?.updatedAt);
  });

  test("with the browser session, too; signed out is 401 JSON; a bad token is 401", async () => {
    const request = await requestsAs("viewer", ids);
    expect((await outcome(async () => load(apiList, await request("GET", "/api/v1/robots")))).status).toBe(200);
    const signedOut = await outcome<ApiRefusal>(async () => load(apiList, new Request("http://127.0.0.1:3000/api/v1/robots")));
    expect(signedOut.status).toBe(401);
    expect(signedOut.body.error.code).toBe("unauthorized");
    expect((await outcome(async () => load(apiList, bearer("/api/v1/robots", "gl_wrong")))).status).toBe(401);
  });
});

describe("GET /api/v1/robots/:robotId", () => {
  test("the newest definition and every revision, newest first", async () => {
    const answer = await outcome<RobotAnswer>(async () => load(apiRobot, bearer(`/api/v1/robots/${walkerId}`, TOKEN), { robotId: walkerId }));
    expect(answer.status).toBe(200);
    const revisions = await revisionsOf(walkerId);
    expect(answer.body).toMatchObject({
      id: walkerId,
      name: "Quay walker",
      latest: { number: 2, message: "Coxa trim", author: { login: "priya-sandoval", name: "Priya Sandoval" } },
    });
    expect(answer.body.latest.definition).toEqual(revisions[1].definition);
    expect(answer.body.revisions.map((revision) => revision.number)).toEqual([2, 1]);
    expect(answer.body.revisions[1]).toEqual({
      number: 1,
      message: "Four-legged quay walker, links from the CAD model",
      author: { login: "theo-brandt", name: "Theo Brandt" },
      createdAt: revisions[0].createdAt.toISOString(),
    });
  });

  test("unknown or another workspace's robot: 404 JSON; a malformed id: 400 JSON", async () => {
    for (const robotId of [foreignId, "00000000-0000-4000-8000-000000000000"]) {
      const answer = await outcome(async () => load(apiRobot, bearer(`/api/v1/robots/${robotId}`, TOKEN), { robotId }));
      expect(answer.status).toBe(404);
      expect(answer.body).toEqual({ error: { code: "not_found", message: `No robot ${robotId} in this workspace.` } });
    }
    const malformed = await outcome(async () => load(apiRobot, bearer("/api/v1/robots/walker", TOKEN), { robotId: "walker" }));
    expect(malformed.status).toBe(400);
    expect(malformed.body).toEqual({ error: { code: "bad_request", message: 'robotId must be a UUID (got "walker")' } });
  });
});

describe("GET /api/v1/robots/:robotId/revisions/:number", () => {
  test("one revision's definition; 404 for a number the robot does not have, 400 for one that is not a number", async () => {
    const answer = await outcome<RevisionAnswer>(async () =>
      load(apiRevision, bearer(`/api/v1/robots/${walkerId}/revisions/1`, TOKEN), { robotId: walkerId, number: "1" }),
    );
    expect(answer.status).toBe(200);
    expect(answer.body).toMatchObject({ robot: { id: walkerId, name: "Quay walker" }, latestRevision: 2, revision: { number: 1 } });
    expect(robotOf(answer.body.revision.definition).legs[0].joints.coxa.zeroOffsetDeg).toBe(demoRobotJson("quay-walker").legs[0].joints.coxa.zeroOffsetDeg);
    const missing = await outcome<ApiRefusal>(async () =>
      load(apiRevision, bearer(`/api/v1/robots/${walkerId}/revisions/9`, TOKEN), { robotId: walkerId, number: "9" }),
    );
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe("not_found");
    const bad = await outcome<ApiRefusal>(async () =>
      load(apiRevision, bearer(`/api/v1/robots/${walkerId}/revisions/x`, TOKEN), { robotId: walkerId, number: "x" }),
    );
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toBe('the revision number must be a whole number from 1 (got "x")');
  });
});

describe("GET /api/v1/schema/robot.json", () => {
  test("public, cacheable, generated from the zod schema", async () => {
    const answer = await outcome<Record<string, unknown>>(async () => load(apiSchema, new Request("http://127.0.0.1:3000/api/v1/schema/robot.json")));
    expect(answer.status).toBe(200);
    expect(answer.headers?.get("Cache-Control")).toBe("public, max-age=3600");
    expect(answer.headers?.get("Content-Type")).toBe("application/schema+json; charset=utf-8");
    const { $id, ...schema } = answer.body;
    expect($id).toMatch(/\/api\/v1\/schema\/robot\.json$/);
    expect(schema).toEqual(robotJsonSchema());
    const etag = answer.headers!.get("ETag")!;
    const again = await outcome(async () =>
      load(apiSchema, new Request("http://127.0.0.1:3000/api/v1/schema/robot.json", { headers: { "If-None-Match": etag } })),
    );
    expect(again.status).toBe(304);
  });
});
