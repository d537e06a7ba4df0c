// Access cases for the solver API.
import { act, load } from "../../../support/routes";
import { demoRobotJson, loadDemoRobot } from "../../../support/robots";
import type { RouteCase } from "../support";
import * as solve from "~/routes/api.v1/solver/solve";
import * as ik from "~/routes/api.v1/solver/ik";
import { generateGait } from "~/gait";
import { neutralStance } from "~/kinematics";

const robotJson = demoRobotJson("pier-crawler");
const robot = loadDemoRobot("pier-crawler");
const sequence = generateGait(robot, { template: "tripod", cycleMs: 1000, fps: 25, strideMm: 40 });

export const cases: RouteCase[] = [
  {
    name: "POST /api/v1/solve",
    route: "routes/api.v1/solver/solve.ts",
    kind: "action",
    run: (req) => req("POST", "/api/v1/solve", { json: { robot: robotJson, sequence } }).then((r) => act(solve, r)),
  },
  {
    name: "GET /api/v1/solve (405: it takes a POST)",
    route: "routes/api.v1/solver/solve.ts",
    kind: "loader",
    allowedStatus: 405,
    run: (req) => req("GET", "/api/v1/solve").then((r) => load(solve, r)),
  },
  {
    name: "POST /api/v1/ik",
    route: "routes/api.v1/solver/ik.ts",
    kind: "action",
    run: (req) => req("POST", "/api/v1/ik", { json: { robot: robotJson, feet: neutralStance(robot) } }).then((r) => act(ik, r)),
  },
  {
    name: "GET /api/v1/ik (405: it takes a POST)",
    route: "routes/api.v1/solver/ik.ts",
    kind: "loader",
    allowedStatus: 405,
    run: (req) => req("GET", "/api/v1/ik").then((r) => load(ik, r)),
  },
];
