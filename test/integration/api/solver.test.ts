import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, PUBLIC_ORIGIN, requestsAs, responseOf, type ApiRefusal, type DemoIds } from "../../support/routes";
import { demoRobotJson, loadDemoRobot } from "../../support/robots";
import { database } from "~/platform/db.server";
import { COLUMNS_LAYOUT, decodeColumns, generateGait, type Flag, type SolvedSequence, type SolveSummary } from "~/gait";
import { neutralStance } from "~/kinematics";
import type { IkResult } from "~/features/solver/solve.server";
import type { Issue } from "~/platform/errors";
import * as solve from "~/routes/api.v1/solver/solve";
import * as ik from "~/routes/api.v1/solver/ik";

const robotJson = demoRobotJson("pier-crawler");
const robot = loadDemoRobot("pier-crawler");

let ids: DemoIds;
beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

/** The answers of /api/v1/solve in its three layouts, of /api/v1/ik, and a refusal whose details are the issue list. */
type ColumnsAnswer = Parameters<typeof decodeColumns>[0];
type ChecksAnswer = { flags: Flag[]; summary: SolveSummary };
type IkAnswer = { legs: IkResult };
type IssuesRefusal = ApiRefusal<Issue[]>;

async function post<Answer = unknown>(route: typeof solve | typeof ik, path: string, body: BodyInit | object, role: "animator" | "signed-out" = "animator") {
  const make = await requestsAs(role, ids);
  const request =
    typeof body === "string"
      ? new Request(new URL(path, PUBLIC_ORIGIN), { method: "POST", body, headers: (await make("POST", path)).headers })
      : await make("POST", path, { json: body });
  return responseOf<Answer>(() => act(route, request));
}

describe("POST /api/v1/solve", () => {
  test("solves a tripod for the demo hexapod: frames, flags and summary as DESIGN.md lays them out", async () => {
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40 });
    const response = await post<SolvedSequence>(solve, "/api/v1/solve", { robot: robotJson, sequence });
    expect(response.status).toBe(200);
    const body = response.body;
    expect(body.frames).toHaveLength(60);
    expect(Object.keys(body.frames[0].legs).sort()).toEqual(["LF", "LM", "LR", "RF", "RM", "RR"]);
    expect(body.frames[0]).toMatchObject({ index: 0, timeMs: 0 });
    expect(body.summary).toMatchObject({ frames: 60, strideMm: 40 });
    expect(JSON.stringify(body)).not.toContain("null,null"); // no NaN turned null in angle arrays
  });

  test("the column layout carries the same solve, and a repeated request is answered from the cache", async () => {
    const sequence = generateGait(robot, { template: "wave", cycleMs: 1200, fps: 50, strideMm: 30 });
    const body = { robot: robotJson, sequence, options: { layout: "columns" } };
    const first = await post<ColumnsAnswer>(solve, "/api/v1/solve", body);
    const second = await post<ColumnsAnswer>(solve, "/api/v1/solve", body);
    expect([first.headers.get("X-Solve-Cache"), second.headers.get("X-Solve-Cache")]).toEqual(["miss", "hit"]);
    const [a, b] = [first.body, second.body];
    expect(b).toEqual(a);
    expect(a).toMatchObject({ layout: COLUMNS_LAYOUT, frames: 60, legs: ["LF", "LM", "LR", "RF", "RM", "RR"] });
    // The same numbers as the frame layout, to float32.
    const frames = (await post<SolvedSequence>(solve, "/api/v1/solve", { robot: robotJson, sequence })).body;
    const columns = decodeColumns(a);
    frames.frames.forEach((frame, i) => expect(columns.leg.RM.angles.coxa[i]).toBe(Math.fround(frame.legs.RM.angles.coxa)));
    expect(a.flags).toEqual(frames.flags);
  });

  test("the checks layout answers flags and summary only, the same as the full solve's", async () => {
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 400 });
    const full = (await post<SolvedSequence>(solve, "/api/v1/solve", { robot: robotJson, sequence })).body;
    const checks = (await post<ChecksAnswer>(solve, "/api/v1/solve", { robot: robotJson, sequence, options: { layout: "checks" } })).body;
    expect(Object.keys(checks).sort()).toEqual(["flags", "summary"]);
    expect(checks.flags.length).toBeGreaterThan(0);
    expect(checks).toEqual({ flags: full.flags, summary: full.summary });
  });

  test("an unknown layout: 422 naming options.layout", async () => {
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50 });
    const response = await post<IssuesRefusal>(solve, "/api/v1/solve", { robot: robotJson, sequence, options: { layout: "rows" } });
    expect(response.status).toBe(422);
    expect(response.body.error.details?.[0].path).toBe("options.layout");
  });

  test("signed out: 401 JSON error", async () => {
    const response = await post(solve, "/api/v1/solve", { robot: robotJson, sequence: {} }, "signed-out");
    expect(response.status).toBe(401);
    expect(response.body).toMatchObject({ error: { code: "unauthorized" } });
  });

  test("a body that is not JSON: 400 saying so", async () => {
    const response = await post<ApiRefusal>(solve, "/api/v1/solve", "{not json");
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/not valid JSON/);
  });

  test("a body over the limit: 413 with both sizes", async () => {
    const response = await post<ApiRefusal>(solve, "/api/v1/solve", JSON.stringify({ robot: robotJson, padding: "x".repeat(2 * 1024 * 1024 + 10) }));
    expect(response.status).toBe(413);
    expect(response.body.error.message).toMatch(/limit is 2097152/);
  });

  test("an invalid robot: 422 with the path of every problem", async () => {
    const broken = structuredClone(robotJson);
    broken.legs[2].joints.femur.minDeg = 40;
    broken.legs[2].joints.femur.maxDeg = 30;
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50 });
    const response = await post<IssuesRefusal>(solve, "/api/v1/solve", { robot: broken, sequence });
    expect(response.status).toBe(422);
    const body = response.body;
    expect(body.error.code).toBe("invalid");
    expect(body.error.details).toContainEqual({
      path: "robot.legs[2].joints.femur.minDeg",
      message: "Leg LR, femur minimum must be below the maximum (got 40 ≥ 30)",
    });
  });

  test("an invalid sequence: 422 with paths under sequence.", async () => {
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50 }) as unknown as Record<string, unknown>;
    const response = await post<IssuesRefusal>(solve, "/api/v1/solve", { robot: robotJson, sequence: { ...sequence, fps: -5 } });
    expect(response.status).toBe(422);
    const body = response.body;
    expect(body.error.details?.some((issue) => issue.path === "sequence.fps")).toBe(true);
  });

  test("unknown fields are refused rather than ignored", async () => {
    const response = await post(solve, "/api/v1/solve", { robot: robotJson, sequence: {}, extra: 1 });
    expect(response.status).toBe(422);
  });
});

describe("POST /api/v1/ik", () => {
  test("the neutral stance solves within limits for every leg, with pulses", async () => {
    const response = await post<IkAnswer>(ik, "/api/v1/ik", { robot: robotJson, feet: neutralStance(robot) });
    expect(response.status).toBe(200);
    const { legs } = response.body;
    for (const leg of robot.legs) {
      expect(legs[leg.id].reachable, `${leg.id} reachable`).toBe(true);
      expect(legs[leg.id].violations).toEqual([]);
      expect(legs[leg.id].pulses.coxa).toBeGreaterThanOrEqual(leg.joints.coxa.servo.minUs);
    }
  });

  test("a foot far out of reach is reported with a reason, never NaN", async () => {
    const response = await post<IkAnswer>(ik, "/api/v1/ik", { robot: robotJson, feet: { LF: [900, 900, -90] } });
    const { legs } = response.body;
    expect(legs.LF.reachable).toBe(false);
    expect(legs.LF.reason).toMatch(/LF/);
    expect(Object.values(legs.LF.angles).every((value) => Number.isFinite(value))).toBe(true);
  });

  test("a foot for a leg the robot does not have: 422 naming it", async () => {
    const response = await post<IssuesRefusal>(ik, "/api/v1/ik", { robot: robotJson, feet: { XX: [0, 0, 0] } });
    expect(response.status).toBe(422);
    expect(response.body.error.details?.[0].path).toBe("feet.XX");
  });
});

// Found by a probe: nothing capped link lengths, and a robot with 1e7 mm legs
// kept a solve busy for 40 s (1e300: for ever) while /healthz waited behind it;
// 1e200 mm legs made /api/v1/ik answer reachable with null angles. The parse
// now refuses such a robot before any work, naming the field.
describe("hostile robots are refused before any work", () => {
  type Refusal = { error: { code: string; message: string; details: { path: string; message: string }[] } };
  const withLinks = (lengthMm: number) => {
    const json = demoRobotJson("pier-crawler");
    for (const leg of json.legs) [leg.femur, leg.tibia] = [lengthMm, lengthMm];
    return json;
  };

  test("POST /api/v1/solve with 1e7 mm femur and tibia: 422 naming the fields, well under a second (asserted < 5 s)", async () => {
    // Keys without a foot take the neutral stance, the reach scan that took 40 s for such a robot.
    const sequence = structuredClone(generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40 }));
    for (const track of Object.values(sequence.legs)) for (const key of track.keys) delete key.foot;
    const started = performance.now();
    const response = await post(solve, "/api/v1/solve", { robot: withLinks(1e7), sequence });
    const elapsedMs = performance.now() - started;
    console.info(`POST /api/v1/solve with 1e7 mm links answered ${response.status} in ${elapsedMs.toFixed(1)} ms`);
    expect(response.status).toBe(422);
    const { error } = response.body as Refusal;
    expect(error.code).toBe("invalid");
    expect(error.details).toContainEqual({ path: "robot.legs[0].femur", message: "Leg LF, femur length must be at most 2000 (got 10000000)" });
    expect(error.details).toContainEqual({ path: "robot.legs[5].tibia", message: "Leg RR, tibia length must be at most 2000 (got 10000000)" });
    expect(elapsedMs).toBeLessThan(5000);
  });

  test("POST /api/v1/ik with 1e200 mm femur and tibia: 422 naming the fields, no reachable answer with null angles", async () => {
    const started = performance.now();
    const response = await post(ik, "/api/v1/ik", { robot: withLinks(1e200), feet: { LF: [150, 120, -90] } });
    const elapsedMs = performance.now() - started;
    console.info(`POST /api/v1/ik with 1e200 mm links answered ${response.status} in ${elapsedMs.toFixed(1)} ms`);
    expect(response.status).toBe(422);
    const { error } = response.body as Refusal;
    expect(error.details).toContainEqual({ path: "robot.legs[0].femur", message: "Leg LF, femur length must be at most 2000 (got 1e+200)" });
    expect(elapsedMs).toBeLessThan(5000);
  });

  test("POST /api/v1/solve with a 1e300 mm tibia and a 1e7 mm stride: 422 naming both", async () => {
    const json = demoRobotJson("pier-crawler");
    json.legs[3].tibia = 1e300;
    const sequence = { ...generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40 }) };
    sequence.generator = { ...sequence.generator, strideMm: 1e7 };
    const response = await post(solve, "/api/v1/solve", { robot: json, sequence });
    expect(response.status).toBe(422);
    const { error } = response.body as Refusal;
    expect(error.details).toEqual([{ path: "robot.legs[3].tibia", message: "Leg RF, tibia length must be at most 2000 (got 1e+300)" }]);
  });
});
