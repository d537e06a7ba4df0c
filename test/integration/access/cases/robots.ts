// Access cases for the robot pages, downloads and the robot API.
import { act, load, multipart } from "../../../support/routes";
import { uniqueName } from "../../../support/names";
import { addRobotRevision, newestRobotRevision } from "../../../support/robot-revisions";
import { demoRobotJson, fixtureText } from "../../../support/robots";
import type { RouteCase } from "../support";
import * as apiList from "~/routes/api.v1/robots/list";
import * as apiRevision from "~/routes/api.v1/robots/revision";
import * as apiRobot from "~/routes/api.v1/robots/robot";
import * as apiSchema from "~/routes/api.v1/robots/schema";
import * as download from "~/routes/robots/download";
import * as list from "~/routes/robots/list";
import * as revision from "~/routes/robots/revision";
import * as robot from "~/routes/robots/robot";

const ROBOT = "Quay walker";
const demoJson = demoRobotJson("quay-walker");
const urdf = fixtureText("test-crab.urdf");

let counter = 0;

type Db = Parameters<NonNullable<RouteCase["prepare"]>>[0];

/** The robot's newest revision, with a calibration-only change (allowed to firmware too) ready to save on top of it. */
async function calibrationEdit(db: Db, robotId: string) {
  const latest = await newestRobotRevision(db, robotId);
  const definition = structuredClone(latest.definition) as typeof demoJson;
  definition.legs[0].joints.coxa.zeroOffsetDeg = (++counter % 40) / 10 + 0.05;
  return { baseRevision: String(latest.number), definition: JSON.stringify(definition) };
}

export const cases: RouteCase[] = [
  {
    name: "GET /robots",
    route: "routes/robots/list.tsx",
    kind: "loader",
    run: (req) => req("GET", "/robots").then((r) => load(list, r)),
  },
  {
    name: "POST /robots (create from the starter)",
    route: "routes/robots/list.tsx",
    kind: "action",
    intent: "create",
    run: (req) =>
      req("POST", "/robots?index", { form: { intent: "create", name: uniqueName("Matrix starter"), source: "starter-4" } }).then((r) => act(list, r)),
  },
  {
    name: "POST /robots (upload a definition)",
    route: "routes/robots/list.tsx",
    kind: "action",
    intent: "upload",
    run: async (req) => {
      const file = new File([JSON.stringify({ ...demoJson, name: uniqueName("Matrix upload") })], "walker.json", { type: "application/json" });
      return act(list, await multipart(req, "/robots?index", { intent: "upload", file }));
    },
  },
  {
    name: "POST /robots (import URDF)",
    route: "routes/robots/list.tsx",
    kind: "action",
    intent: "import-urdf",
    run: async (req) => {
      const file = new File([urdf], "test-crab.urdf", { type: "application/xml" });
      return act(list, await multipart(req, "/robots?index", { intent: "import-urdf", file, name: uniqueName("Matrix crab") }));
    },
  },
  {
    name: "GET /robots/:robotId",
    route: "routes/robots/robot.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/robots/${ids.robotIds[ROBOT]}`).then((r) => load(robot, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "POST /robots/:robotId (save a calibration change)",
    route: "routes/robots/robot.tsx",
    kind: "action",
    intent: "save",
    prepare: (db, ids) => calibrationEdit(db, ids.robotIds[ROBOT]),
    run: (req, ids, prepared) =>
      req("POST", `/robots/${ids.robotIds[ROBOT]}`, { form: { intent: "save", message: "matrix", ...prepared } }).then((r) =>
        act(robot, r, { robotId: ids.robotIds[ROBOT] }),
      ),
  },
  {
    name: "GET /robots/:robotId/revisions/:number",
    route: "routes/robots/revision.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/robots/${ids.robotIds[ROBOT]}/revisions/1`).then((r) => load(revision, r, { robotId: ids.robotIds[ROBOT], number: "1" })),
  },
  {
    name: "POST /robots/:robotId/revisions/:number (restore)",
    route: "routes/robots/revision.tsx",
    kind: "action",
    intent: "restore",
    // Revision 1 differs from the newest only in calibration, so firmware may restore it too.
    prepare: async (db, ids) => {
      const { definition } = await calibrationEdit(db, ids.robotIds[ROBOT]);
      const { newer } = await addRobotRevision(db, ids.robotIds[ROBOT], { definition: JSON.parse(definition), message: "matrix prepare" });
      return { baseRevision: String(newer.number) };
    },
    run: (req, ids, prepared) =>
      req("POST", `/robots/${ids.robotIds[ROBOT]}/revisions/1`, { form: { intent: "restore", baseRevision: prepared.baseRevision } }).then((r) =>
        act(revision, r, { robotId: ids.robotIds[ROBOT], number: "1" }),
      ),
  },
  {
    name: "GET /robots/:robotId/revisions/:number/download",
    route: "routes/robots/download.ts",
    kind: "loader",
    run: (req, ids) =>
      req("GET", `/robots/${ids.robotIds[ROBOT]}/revisions/1/download`).then((r) => load(download, r, { robotId: ids.robotIds[ROBOT], number: "1" })),
  },
  {
    name: "GET /api/v1/robots",
    route: "routes/api.v1/robots/list.ts",
    kind: "loader",
    run: (req) => req("GET", "/api/v1/robots").then((r) => load(apiList, r)),
  },
  {
    name: "GET /api/v1/robots/:robotId",
    route: "routes/api.v1/robots/robot.ts",
    kind: "loader",
    run: (req, ids) => req("GET", `/api/v1/robots/${ids.robotIds[ROBOT]}`).then((r) => load(apiRobot, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "GET /api/v1/robots/:robotId/revisions/:number",
    route: "routes/api.v1/robots/revision.ts",
    kind: "loader",
    run: (req, ids) =>
      req("GET", `/api/v1/robots/${ids.robotIds[ROBOT]}/revisions/1`).then((r) => load(apiRevision, r, { robotId: ids.robotIds[ROBOT], number: "1" })),
  },
  {
    name: "GET /api/v1/schema/robot.json",
    route: "routes/api.v1/robots/schema.ts",
    kind: "loader",
    run: (req) => req("GET", "/api/v1/schema/robot.json").then((r) => load(apiSchema, r)),
  },
];
