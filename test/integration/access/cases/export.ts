// Access cases for the export feature: angle and bench tables, calibration
// profiles (pages and API), the export and bring-up pages, the OpenAPI
// document, the public schemas and the API page.
import { type DemoIds, act, load } from "../../../support/routes";
import { uniqueName } from "../../../support/names";
import type { RouteCase } from "../support";
import { createProfile } from "~/features/robots/calibration.server";
import * as benchTable from "~/routes/api.v1/export/bench-table";
import * as calibrationProfiles from "~/routes/api.v1/export/calibration-profiles";
import * as calibrationSchema from "~/routes/api.v1/export/calibration-schema";
import * as openapi from "~/routes/api.v1/export/openapi";
import * as sequenceSchema from "~/routes/api.v1/export/sequence-schema";
import * as table from "~/routes/api.v1/export/table";
import * as apiDocs from "~/routes/export/api-docs";
import * as bringUp from "~/routes/export/bring-up";
import * as calibration from "~/routes/export/calibration";
import * as calibrationList from "~/routes/export/calibration-list";
import * as exportPage from "~/routes/export/page";

const GAIT = "Tripod cruise";
const ROBOT = "Pier crawler";

/** A fresh profile at revision 1 for each caller to update or delete. */
async function profileToChange(db: Parameters<NonNullable<RouteCase["prepare"]>>[0], ids: DemoIds) {
  const actor = { userId: ids.userIds.firmware, workspaceId: ids.workspaceId };
  const created = await createProfile(actor, ids.robotIds[ROBOT], { name: uniqueName("SN matrix change"), joints: {} }, db);
  return { profileId: created.id, name: created.name };
}

export const cases: RouteCase[] = [
  {
    name: "GET /api/v1/gaits/:gaitId/versions/released/table",
    route: "routes/api.v1/export/table.ts",
    kind: "loader",
    run: (req, ids) =>
      req("GET", `/api/v1/gaits/${ids.gaitIds[GAIT]}/versions/released/table?format=csv&units=us`).then((r) =>
        load(table, r, { gaitId: ids.gaitIds[GAIT], number: "released" }),
      ),
  },
  {
    name: "GET /api/v1/robots/:robotId/bench-table (sweep)",
    route: "routes/api.v1/export/bench-table.ts",
    kind: "loader",
    run: (req, ids) =>
      req("GET", `/api/v1/robots/${ids.robotIds[ROBOT]}/bench-table?kind=sweep&leg=LF&joint=femur`).then((r) =>
        load(benchTable, r, { robotId: ids.robotIds[ROBOT] }),
      ),
  },
  {
    name: "GET /api/v1/robots/:robotId/calibration-profiles",
    route: "routes/api.v1/export/calibration-profiles.ts",
    kind: "loader",
    run: (req, ids) =>
      req("GET", `/api/v1/robots/${ids.robotIds[ROBOT]}/calibration-profiles`).then((r) => load(calibrationProfiles, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "GET /api/v1/openapi.json",
    route: "routes/api.v1/export/openapi.ts",
    kind: "loader",
    run: (req) => req("GET", "/api/v1/openapi.json").then((r) => load(openapi, r)),
  },
  {
    name: "GET /api/v1/schema/sequence.json",
    route: "routes/api.v1/export/sequence-schema.ts",
    kind: "loader",
    run: (req) => req("GET", "/api/v1/schema/sequence.json").then((r) => load(sequenceSchema, r)),
  },
  {
    name: "GET /api/v1/schema/calibration.json",
    route: "routes/api.v1/export/calibration-schema.ts",
    kind: "loader",
    run: (req) => req("GET", "/api/v1/schema/calibration.json").then((r) => load(calibrationSchema, r)),
  },
  {
    name: "GET /export",
    route: "routes/export/page.tsx",
    kind: "loader",
    run: (req) => req("GET", "/export").then((r) => load(exportPage, r)),
  },
  {
    name: "GET /export/bring-up",
    route: "routes/export/bring-up.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/export/bring-up?robot=${ids.robotIds[ROBOT]}&kind=sweep&leg=LM&joint=tibia`).then((r) => load(bringUp, r)),
  },
  {
    name: "GET /export/calibration",
    route: "routes/export/calibration-list.tsx",
    kind: "loader",
    run: (req) => req("GET", "/export/calibration").then((r) => load(calibrationList, r)),
  },
  {
    name: "GET /export/calibration/:robotId",
    route: "routes/export/calibration.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/export/calibration/${ids.robotIds[ROBOT]}?edit=new`).then((r) => load(calibration, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "POST /export/calibration/:robotId (create a profile)",
    route: "routes/export/calibration.tsx",
    kind: "action",
    intent: "create",
    run: (req, ids) =>
      req("POST", `/export/calibration/${ids.robotIds[ROBOT]}`, {
        form: { intent: "create", name: uniqueName("SN matrix"), "joints.LF.femur.trimDeg": "1.5" },
      }).then((r) => act(calibration, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "POST /export/calibration/:robotId (import a profile's JSON)",
    route: "routes/export/calibration.tsx",
    kind: "action",
    intent: "import",
    run: (req, ids) =>
      req("POST", `/export/calibration/${ids.robotIds[ROBOT]}`, {
        form: { intent: "import", json: JSON.stringify({ name: uniqueName("SN matrix import"), joints: { LF: { femur: { trimDeg: 1 } } } }) },
      }).then((r) => act(calibration, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "POST /export/calibration/:robotId (update a profile)",
    route: "routes/export/calibration.tsx",
    kind: "action",
    intent: "update",
    prepare: (db, ids) => profileToChange(db, ids),
    run: (req, ids, { profileId, name }) =>
      req("POST", `/export/calibration/${ids.robotIds[ROBOT]}`, {
        form: { intent: "update", profileId, baseRevision: "1", name, "joints.LF.femur.trimDeg": "2" },
      }).then((r) => act(calibration, r, { robotId: ids.robotIds[ROBOT] })),
  },
  {
    name: "POST /export/calibration/:robotId (delete a profile)",
    route: "routes/export/calibration.tsx",
    kind: "action",
    intent: "delete",
    prepare: (db, ids) => profileToChange(db, ids),
    run: (req, ids, { profileId }) =>
      req("POST", `/export/calibration/${ids.robotIds[ROBOT]}`, { form: { intent: "delete", profileId, baseRevision: "1" } }).then((r) =>
        act(calibration, r, { robotId: ids.robotIds[ROBOT] }),
      ),
  },
  {
    name: "GET /api-docs",
    route: "routes/export/api-docs.tsx",
    kind: "loader",
    run: (req) => req("GET", "/api-docs").then((r) => load(apiDocs, r)),
  },
];
