// Access cases for the gait editor: the new-gait page, the editor page and
// its move-to-newest-robot action, and the draft API.
import { eq } from "drizzle-orm";
import { gaits } from "../../../../db/schema";
import { act, load } from "../../../support/routes";
import { uniqueName } from "../../../support/names";
import { addRobotRevision } from "../../../support/robot-revisions";
import type { RouteCase } from "../support";
import * as draftApi from "~/routes/api.v1/gaits/draft";
import * as editor from "~/routes/gaits/editor";
import * as newGait from "~/routes/gaits/new";

const EDITED = "Wave climb"; // on the hull climber: no other case touches that robot
const CRAWLER = "Pier crawler";

type Db = Parameters<NonNullable<RouteCase["prepare"]>>[0];

async function draftOf(db: Db, gaitId: string) {
  const [gait] = await db.select().from(gaits).where(eq(gaits.id, gaitId));
  return gait;
}

export const cases: RouteCase[] = [
  {
    name: "GET /gaits/new",
    route: "routes/gaits/new.tsx",
    kind: "loader",
    run: (req) => req("GET", "/gaits/new").then((r) => load(newGait, r)),
  },
  {
    name: "POST /gaits/new (create from a template)",
    route: "routes/gaits/new.tsx",
    kind: "action",
    intent: "create",
    run: (req, ids) =>
      req("POST", "/gaits/new", { form: { intent: "create", robotId: ids.robotIds[CRAWLER], name: uniqueName("Matrix tripod"), template: "tripod" } }).then(
        (r) => act(newGait, r),
      ),
  },
  {
    name: "POST /gaits/new (keep edits as a copy)",
    route: "routes/gaits/new.tsx",
    kind: "action",
    intent: "copy",
    prepare: async (db, ids) => ({ sequence: JSON.stringify((await draftOf(db, ids.gaitIds["Tripod cruise"])).draftSequence) }),
    run: (req, ids, prepared) =>
      req("POST", "/gaits/new", {
        form: { intent: "copy", sourceGaitId: ids.gaitIds["Tripod cruise"], name: uniqueName("Matrix copy"), sequence: prepared.sequence },
      }).then((r) => act(newGait, r)),
  },
  {
    name: "GET /gaits/:gaitId/edit",
    route: "routes/gaits/editor.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/gaits/${ids.gaitIds[EDITED]}/edit`).then((r) => load(editor, r, { gaitId: ids.gaitIds[EDITED] })),
  },
  {
    name: "POST /gaits/:gaitId/edit (move the draft to the robot's newest revision)",
    route: "routes/gaits/editor.tsx",
    kind: "action",
    intent: "move-to-newest-robot",
    // A newer robot revision for every caller, so that an allowed move has somewhere to go.
    prepare: async (db, ids) => {
      const gait = await draftOf(db, ids.gaitIds[EDITED]);
      await addRobotRevision(db, gait.robotId, { message: "matrix: same robot again" });
      return { baseRevision: String(gait.draftRevision) };
    },
    run: (req, ids, prepared) =>
      req("POST", `/gaits/${ids.gaitIds[EDITED]}/edit`, { form: { intent: "move-to-newest-robot", baseRevision: prepared.baseRevision } }).then((r) =>
        act(editor, r, { gaitId: ids.gaitIds[EDITED] }),
      ),
  },
  {
    name: "GET /api/v1/gaits/:gaitId/draft",
    route: "routes/api.v1/gaits/draft.ts",
    kind: "loader",
    run: (req, ids) => req("GET", `/api/v1/gaits/${ids.gaitIds[EDITED]}/draft`).then((r) => load(draftApi, r, { gaitId: ids.gaitIds[EDITED] })),
  },
  {
    name: "PUT /api/v1/gaits/:gaitId/draft",
    route: "routes/api.v1/gaits/draft.ts",
    kind: "action",
    prepare: async (db, ids) => {
      const gait = await draftOf(db, ids.gaitIds[EDITED]);
      return { baseRevision: String(gait.draftRevision), sequence: JSON.stringify(gait.draftSequence) };
    },
    run: (req, ids, prepared) =>
      req("PUT", `/api/v1/gaits/${ids.gaitIds[EDITED]}/draft`, {
        json: { sequence: JSON.parse(prepared.sequence), baseRevision: Number(prepared.baseRevision) },
      }).then((r) => act(draftApi, r, { gaitId: ids.gaitIds[EDITED] })),
  },
];
