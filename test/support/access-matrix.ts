// The role × route matrix: each feature lists its loaders, actions and API
// routes as cases in test/integration/access/cases/<feature>.ts, naming the
// permission each needs; test/integration/access/matrix.test.ts runs every
// case as every demo role and signed out, in-process against the test
// database, and expects what the one permission table (app/platform/permissions.ts) says.
import { and, eq } from "drizzle-orm";
import { gaits, robots, users, workspaces, type Role } from "../../db/schema";
import { demoPeople, demoWorkspace } from "../../db/demo/scenario";
import type { Database } from "../../db/client";
import type { Action } from "~/platform/permissions";
import { commitSession, sessionStorage } from "~/platform/session.server";

export type Caller = Role | "signed-out";

/** What a route needs: a permission, just a signed-in person, or nothing. */
export type Requirement = Action | "signed-in" | "public";

export type DemoIds = {
  workspaceId: string;
  userIds: Record<Role, string>;
  robotIds: Record<string, string>; // by robot name
  gaitIds: Record<string, string>; // by gait name
};

export type MakeRequest = (
  method: string,
  path: string,
  body?: { form?: Record<string, string>; json?: unknown },
) => Promise<Request>;

export type RouteCase = {
  /** e.g. "POST /robots/:robotId (save geometry)" */
  name: string;
  /** The route module as app/routes.ts names it, e.g. "routes/robots/list.tsx". */
  route: string;
  /** Which export the case calls. */
  kind: "loader" | "action";
  needs: Requirement;
  /** A status an allowed caller gets besides 2xx/3xx (the 404 page answers 404 to everyone). */
  allowedStatus?: number;
  /** Runs before each caller, for cases that use up what they act on (a member to remove). */
  prepare?: (db: Database, ids: DemoIds, caller: Caller) => Promise<Record<string, string>>;
  /** Calls the route's loader or action; may return or throw a Response or `data()`. */
  run: (request: MakeRequest, ids: DemoIds, prepared: Record<string, string>) => Promise<unknown>;
};

export const PUBLIC_ORIGIN = "http://127.0.0.1:3000";

export async function demoIds(db: Database): Promise<DemoIds> {
  const [workspace] = await db.select().from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));
  const userIds = {} as Record<Role, string>;
  for (const person of demoPeople) {
    const [user] = await db.select({ id: users.id }).from(users).where(eq(users.login, person.login));
    userIds[person.role] = user.id;
  }
  const robotRows = await db.select().from(robots).where(eq(robots.workspaceId, workspace.id));
  const gaitRows = await db.select().from(gaits).where(and(eq(gaits.workspaceId, workspace.id)));
  return {
    workspaceId: workspace.id,
    userIds,
    robotIds: Object.fromEntries(robotRows.map((row) => [row.name, row.id])),
    gaitIds: Object.fromEntries(gaitRows.map((row) => [row.name, row.id])),
  };
}

/** Requests as `caller` would send them from the app's own pages. */
export async function requestsAs(caller: Caller, ids: DemoIds): Promise<MakeRequest> {
  let cookie: string | null = null;
  if (caller !== "signed-out") {
    const session = await sessionStorage().getSession();
    session.set("userId", ids.userIds[caller]);
    session.set("workspaceId", ids.workspaceId);
    cookie = (await commitSession(session)).split(";")[0];
  }
  return async (method, path, body) => {
    const headers = new Headers();
    if (cookie) headers.set("Cookie", cookie);
    let payload: BodyInit | undefined;
    if (body?.form) {
      payload = new URLSearchParams(body.form);
      headers.set("Content-Type", "application/x-www-form-urlencoded");
    } else if (body?.json !== undefined) {
      payload = JSON.stringify(body.json);
      headers.set("Content-Type", "application/json");
    }
    if (method !== "GET" && method !== "HEAD") headers.set("Origin", PUBLIC_ORIGIN);
    return new Request(new URL(path, PUBLIC_ORIGIN), { method, headers, body: payload });
  };
}

/** The HTTP status a loader or action produced, whether returned or thrown. */
export async function statusOf(run: () => Promise<unknown>): Promise<{ status: number; location?: string }> {
  const read = (outcome: unknown, thrown: boolean): { status: number; location?: string } => {
    if (outcome instanceof Response) {
      return { status: outcome.status, location: outcome.headers.get("Location") ?? undefined };
    }
    if (outcome && typeof outcome === "object" && "type" in outcome && outcome.type === "DataWithResponseInit") {
      const init = (outcome as { init?: ResponseInit | null }).init;
      return { status: init?.status ?? 200 };
    }
    if (thrown) throw outcome;
    return { status: 200 };
  };
  try {
    return read(await run(), false);
  } catch (error) {
    return read(error, true);
  }
}

type RouteModule = { loader?: (args: never) => unknown; action?: (args: never) => unknown };

/** Calls a route module's loader as the framework would. */
export function load(module: RouteModule, request: Request, params: Record<string, string> = {}) {
  if (!module.loader) throw new Error("this route module has no loader");
  return Promise.resolve(module.loader({ request, params, context: {} } as never));
}

/** Calls a route module's action as the framework would. */
export function act(module: RouteModule, request: Request, params: Record<string, string> = {}) {
  if (!module.action) throw new Error("this route module has no action");
  return Promise.resolve(module.action({ request, params, context: {} } as never));
}
