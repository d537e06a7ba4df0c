// Access cases for archiving, restoring and deleting robots and gaits: the
// pages' form actions and the API. Each case that changes something acts on
// a robot or gait of its own, made for each caller.
import { robotRevisions, robots, gaits } from "../../../../db/schema";
import { act, load } from "../../../support/routes";
import { uniqueName } from "../../../support/names";
import { demoRobotJson } from "../../../support/robots";
import type { RouteCase } from "../support";
import * as robotArchive from "~/routes/robots/archive";
import * as gaitArchive from "~/routes/gaits/archive";
import * as apiRobot from "~/routes/api.v1/robots/robot";
import * as apiRobotArchive from "~/routes/api.v1/robots/archive";
import * as apiGait from "~/routes/api.v1/gaits/gait";
import * as apiGaitArchive from "~/routes/api.v1/gaits/archive";

type Db = Parameters<NonNullable<RouteCase["prepare"]>>[0];

/** A robot with one revision and no gaits; archived when asked. */
async function throwawayRobot(db: Db, workspaceId: string, archived: boolean) {
  const name = uniqueName("Matrix shelf robot");
  const [robot] = await db
    .insert(robots)
    .values({ workspaceId, name, archivedAt: archived ? new Date() : null })
    .returning({ id: robots.id });
  await db.insert(robotRevisions).values({ robotId: robot.id, number: 1, definition: { ...demoRobotJson("quay-walker"), name } });
  return { robotId: robot.id };
}

/** A gait with no versions on a demo robot; archived when asked. */
async function throwawayGait(db: Db, workspaceId: string, robotId: string, archived: boolean) {
  const [gait] = await db
    .insert(gaits)
    .values({ workspaceId, robotId, name: uniqueName("Matrix shelf gait"), archivedAt: archived ? new Date() : null })
    .returning({ id: gaits.id });
  return { gaitId: gait.id };
}

const ROBOT = "Quay walker";

const robotIntent = (intent: "archive" | "restore" | "delete"): RouteCase => ({
  name: `POST /robots/:robotId/archive (${intent})`,
  route: "routes/robots/archive.ts",
  kind: "action",
  intent,
  prepare: (db, ids) => throwawayRobot(db, ids.workspaceId, intent !== "archive"),
  run: (req, _ids, { robotId }) => req("POST", `/robots/${robotId}/archive`, { form: { intent } }).then((r) => act(robotArchive, r, { robotId })),
});

const gaitIntent = (intent: "archive" | "restore" | "delete"): RouteCase => ({
  name: `POST /gaits/:gaitId/archive (${intent})`,
  route: "routes/gaits/archive.ts",
  kind: "action",
  intent,
  prepare: (db, ids) => throwawayGait(db, ids.workspaceId, ids.robotIds[ROBOT], intent !== "archive"),
  run: (req, _ids, { gaitId }) => req("POST", `/gaits/${gaitId}/archive`, { form: { intent } }).then((r) => act(gaitArchive, r, { gaitId })),
});

export const cases: RouteCase[] = [
  {
    name: "GET /robots/:robotId/archive (to the robot's page)",
    route: "routes/robots/archive.ts",
    kind: "loader",
    run: (req, ids) => req("GET", `/robots/${ids.robotIds[ROBOT]}/archive`).then((r) => load(robotArchive, r, { robotId: ids.robotIds[ROBOT] })),
  },
  robotIntent("archive"),
  robotIntent("restore"),
  robotIntent("delete"),
  {
    name: "GET /gaits/:gaitId/archive (to the gait's page)",
    route: "routes/gaits/archive.ts",
    kind: "loader",
    run: (req, ids) => req("GET", `/gaits/${ids.gaitIds["Tripod cruise"]}/archive`).then((r) => load(gaitArchive, r, { gaitId: ids.gaitIds["Tripod cruise"] })),
  },
  gaitIntent("archive"),
  gaitIntent("restore"),
  gaitIntent("delete"),
  {
    name: "DELETE /api/v1/robots/:robotId",
    route: "routes/api.v1/robots/robot.ts",
    kind: "action",
    prepare: (db, ids) => throwawayRobot(db, ids.workspaceId, true),
    run: (req, _ids, { robotId }) => req("DELETE", `/api/v1/robots/${robotId}`).then((r) => act(apiRobot, r, { robotId })),
  },
  {
    name: "GET /api/v1/robots/:robotId/archive (405: it archives and restores)",
    route: "routes/api.v1/robots/archive.ts",
    kind: "loader",
    allowedStatus: 405,
    run: (req, ids) => req("GET", `/api/v1/robots/${ids.robotIds[ROBOT]}/archive`).then((r) => load(apiRobotArchive, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "POST /api/v1/robots/:robotId/archive",
    route: "routes/api.v1/robots/archive.ts",
    kind: "action",
    prepare: (db, ids) => throwawayRobot(db, ids.workspaceId, false),
    run: (req, _ids, { robotId }) => req("POST", `/api/v1/robots/${robotId}/archive`).then((r) => act(apiRobotArchive, r, { robotId })),
  },
  {
    name: "GET /api/v1/gaits/:gaitId (405: it only deletes)",
    route: "routes/api.v1/gaits/gait.ts",
    kind: "loader",
    allowedStatus: 405,
    run: (req, ids) => req("GET", `/api/v1/gaits/${ids.gaitIds["Tripod cruise"]}`).then((r) => load(apiGait, r, { gaitId: ids.gaitIds["Tripod cruise"] })),
  },
  {
    name: "DELETE /api/v1/gaits/:gaitId",
    route: "routes/api.v1/gaits/gait.ts",
    kind: "action",
    prepare: (db, ids) => throwawayGait(db, ids.workspaceId, ids.robotIds[ROBOT], true),
    run: (req, _ids, { gaitId }) => req("DELETE", `/api/v1/gaits/${gaitId}`).then((r) => act(apiGait, r, { gaitId })),
  },
  {
    name: "GET /api/v1/gaits/:gaitId/archive (405: it archives and restores)",
    route: "routes/api.v1/gaits/archive.ts",
    kind: "loader",
    allowedStatus: 405,
    run: (req, ids) =>
      req("GET", `/api/v1/gaits/${ids.gaitIds["Tripod cruise"]}/archive`).then((r) => load(apiGaitArchive, r, { gaitId: ids.gaitIds["Tripod cruise"] })),
  },
  {
    name: "DELETE /api/v1/gaits/:gaitId/archive (restore)",
    route: "routes/api.v1/gaits/archive.ts",
    kind: "action",
    prepare: (db, ids) => throwawayGait(db, ids.workspaceId, ids.robotIds[ROBOT], true),
    run: (req, _ids, { gaitId }) => req("DELETE", `/api/v1/gaits/${gaitId}/archive`).then((r) => act(apiGaitArchive, r, { gaitId })),
  },
];
