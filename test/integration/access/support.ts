// The role × route matrix: each feature lists its loaders, actions and API
// routes as cases in test/integration/access/cases/<feature>.ts;
// test/integration/access/matrix.test.ts runs every case as every demo role and
// signed out, in-process against the test database, and expects what the route
// module declares (its `permissions` export) and the one permission table
// (app/platform/permissions.ts) say together.
import type { Database } from "../../../db/client";
import type { Caller, DemoIds, MakeRequest } from "../../support/routes";

export type RouteCase = {
  /** e.g. "POST /robots/:robotId (save geometry)" */
  name: string;
  /** The route module as app/routes.ts names it, e.g. "routes/robots/list.tsx". */
  route: string;
  /** Which export the case calls. */
  kind: "loader" | "action";
  /** The intent the case posts, for an action told apart by one: what it needs is the module's declaration for that intent. */
  intent?: string;
  /** A status an allowed caller gets besides 2xx/3xx (the 404 page answers 404 to everyone). */
  allowedStatus?: number;
  /** Runs before each caller, for cases that use up what they act on (a member to remove). */
  prepare?: (db: Database, ids: DemoIds, caller: Caller) => Promise<Record<string, string>>;
  /** Calls the route's loader or action; may return or throw a Response or `data()`. */
  run: (request: MakeRequest, ids: DemoIds, prepared: Record<string, string>) => Promise<unknown>;
};
