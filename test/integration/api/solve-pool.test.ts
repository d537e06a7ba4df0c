// Heavy work off the request thread: a large solve runs on the worker pool
// while the app keeps answering, a solve that would wait longer than the queue
// budget is refused with 503 and Retry-After, and solves larger than the limits
// are refused with 422 before any work is done. The route calls share this
// process's event loop, so "the small request finished first" shows the large
// solve was not on it.
import { setTimeout as delay } from "node:timers/promises";
import { afterEach, beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, requestsAs, responseOf, type ApiRefusal, type DemoIds } from "../../support/routes";
import { demoRobotJson, loadDemoRobot, type DemoRobotFile } from "../../support/robots";
import { database } from "~/platform/db.server";
import { corePoolStats } from "~/platform/worker-pool.server";
import { generateGait, type TemplateName } from "~/gait";
import * as healthz from "~/routes/healthz";
import * as solve from "~/routes/api.v1/solver/solve";

let ids: DemoIds;
beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

afterEach(() => {
  delete process.env.GAITLOOM_SOLVE_QUEUE_BUDGET_MS;
});

/** A solve request body: `frames` frames of a looped gait (at 1000 frames per second) for a demo robot, in a layout. */
function solveBody(file: DemoRobotFile, template: TemplateName, frames: number, layout: "frames" | "columns" | "checks") {
  const sequence = generateGait(loadDemoRobot(file), { template, cycleMs: frames, fps: 1000, strideMm: 40 });
  return { robot: demoRobotJson(file), sequence, options: { layout } };
}

/** The largest solve the API takes: 100 000 frames of the demo hexapod (600 000 leg-frames), flags and summary only. */
const largest = () => solveBody("pier-crawler", "tripod", 100_000, "checks");
const small = () => solveBody("pier-crawler", "tripod", 60, "frames");

async function post<Answer = unknown>(body: object, headers: Record<string, string> = {}) {
  const make = await requestsAs("animator", ids);
  const request = await make("POST", "/api/v1/solve", { json: body });
  for (const [name, value] of Object.entries(headers)) request.headers.set(name, value);
  return responseOf<Answer>(() => act(solve, request));
}

const fresh = { "Cache-Control": "no-cache" };

/** Until the large solve has reached the pool (checked every 10 ms, on this thread's timers: they fire only while it is free). */
async function untilInFlight() {
  for (let waited = 0; corePoolStats().inFlight === 0; waited += 10) {
    if (waited > 10_000) throw new Error("the large solve did not reach the pool within 10 s");
    await delay(10);
  }
}

describe("POST /api/v1/solve on the worker pool", () => {
  test("the largest allowed solve in flight holds up neither GET /healthz nor an answer from the cache", async () => {
    const cachedBody = small();
    expect((await post(cachedBody)).status).toBe(200);
    const finished: string[] = [];
    const large = post(largest(), fresh).then((answer) => {
      finished.push("large solve");
      return answer;
    });
    await untilInFlight();
    const health = healthz.loader().then((answer) => {
      finished.push("healthz");
      return answer;
    });
    const cached = post(cachedBody).then((answer) => {
      finished.push("cached solve");
      return answer;
    });
    const [largeAnswer, healthAnswer, cachedAnswer] = await Promise.all([large, health, cached]);
    expect(finished).toEqual(["healthz", "cached solve", "large solve"]);
    expect(largeAnswer.status).toBe(200);
    expect(healthAnswer.status).toBe(200);
    expect(cachedAnswer.headers.get("X-Solve-Cache")).toBe("hit");
  });

  test("a solve that would wait longer than the queue budget: 503 with Retry-After, and the solve in flight still answers", async () => {
    process.env.GAITLOOM_SOLVE_QUEUE_BUDGET_MS = "1";
    // A solve of some milliseconds first, so the pool knows how long its tasks take.
    expect((await post(solveBody("pier-crawler", "tripod", 5000, "checks"), fresh)).status).toBe(200);
    const large = post(largest(), fresh);
    await untilInFlight();
    const refused = await post<ApiRefusal>(small(), fresh);
    expect(refused.status).toBe(503);
    expect(Number(refused.headers.get("Retry-After"))).toBeGreaterThanOrEqual(1);
    expect(refused.body.error.code).toBe("unavailable");
    expect(refused.body.error.message).toMatch(/busy/);
    expect((await large).status).toBe(200);
  });

  test("frames × legs over the solve limit: 422 naming the limit, before any solving", async () => {
    // The demo octopod at 100 000 frames: 800 000 leg-frames.
    const response = await post<ApiRefusal>(solveBody("hull-climber", "wave", 100_000, "checks"), fresh);
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/800000 leg-frames/);
    expect(response.body.error.message).toMatch(/600000/);
    expect(response.body.error.details).toMatchObject({ reason: "too-many-frames", limit: 600_000, legFrames: 800_000 });
  });

  test("an answer in the frames layout larger than its limit: 422 naming the limit and the compact layouts", async () => {
    // 20 000 frames of the hexapod are 120 000 leg-frames: about 40 MB as frame objects.
    const response = await post<ApiRefusal>(solveBody("pier-crawler", "tripod", 20_000, "frames"), fresh);
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/60000/);
    expect(response.body.error.message).toMatch(/columns/);
    expect(response.body.error.details).toMatchObject({ reason: "too-many-frames", limit: 60_000, legFrames: 120_000 });
    // The same solve in the column layout is within its limit.
    const columns = await post(solveBody("pier-crawler", "tripod", 20_000, "columns"), fresh);
    expect(columns.status).toBe(200);
  });
});
