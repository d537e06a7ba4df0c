// What each /api/v1 route module declares it needs, by the path app/routes.ts
// serves it under (written as the OpenAPI document writes paths). The
// openapi.json route and the API page hand it to the document for each
// operation's x-permission, so the document repeats the routes' own
// declarations; test/features/api/openapi.test.ts checks these paths and
// modules against app/routes.ts.
import type { ApiPermissions } from "~/features/api/openapi.server";
import * as benchTable from "./export/bench-table";
import * as calibrationProfiles from "./export/calibration-profiles";
import * as calibrationSchema from "./export/calibration-schema";
import * as openapi from "./export/openapi";
import * as sequenceSchema from "./export/sequence-schema";
import * as table from "./export/table";
import * as draft from "./gaits/draft";
import * as gaitArchive from "./gaits/archive";
import * as gait from "./gaits/gait";
import * as versions from "./gaits/versions";
import * as robotArchive from "./robots/archive";
import * as robotList from "./robots/list";
import * as robotRevision from "./robots/revision";
import * as robot from "./robots/robot";
import * as robotSchema from "./robots/schema";
import * as ik from "./solver/ik";
import * as solve from "./solver/solve";
import * as workspace from "./workspace";

// A function, not a constant: the openapi.json route imports this module and is one of the modules it reads.
export function apiPermissions(): ApiPermissions {
  return {
    "/api/v1/workspace": workspace.permissions,
    "/api/v1/solve": solve.permissions,
    "/api/v1/ik": ik.permissions,
    "/api/v1/robots": robotList.permissions,
    "/api/v1/robots/{robotId}": robot.permissions,
    "/api/v1/robots/{robotId}/archive": robotArchive.permissions,
    "/api/v1/robots/{robotId}/revisions/{number}": robotRevision.permissions,
    "/api/v1/schema/robot.json": robotSchema.permissions,
    "/api/v1/gaits/{gaitId}": gait.permissions,
    "/api/v1/gaits/{gaitId}/archive": gaitArchive.permissions,
    "/api/v1/gaits/{gaitId}/draft": draft.permissions,
    "/api/v1/gaits/{gaitId}/versions": versions.permissions,
    "/api/v1/gaits/{gaitId}/versions/{number}/table": table.permissions,
    "/api/v1/robots/{robotId}/bench-table": benchTable.permissions,
    "/api/v1/robots/{robotId}/calibration-profiles": calibrationProfiles.permissions,
    "/api/v1/openapi.json": openapi.permissions,
    "/api/v1/schema/sequence.json": sequenceSchema.permissions,
    "/api/v1/schema/calibration.json": calibrationSchema.permissions,
  };
}
