// Calling the app in-process as the demo people: requests as each role would
// send them from the app's own pages (or with an API token), a route
// module's loader or action called as the framework calls it, and what it
// answered read back, whether returned or thrown. Route tests need the seeded
// demo workspace of the test database.
import { eq } from "drizzle-orm";
import type { Database } from "../../db/client";
import { demoPeople, demoWorkspace } from "../../db/demo/scenario";
import { gaits, robots, users, workspaces, type Role } from "../../db/schema";
import { currentMember, type Member } from "~/platform/access.server";
import { ServiceError, type ApiErrorCode, type DetailRecord, type ErrorDetails, type FormError } from "~/platform/errors.server";
import { commitSession, sessionStorage } from "~/platform/session.server";

/** The origin the app's pages are served from in tests; mutations must name it. */
export const PUBLIC_ORIGIN = "http://127.0.0.1:3000";

export type Caller = Role | "signed-out";

export type DemoIds = {
  workspaceId: string;
  userIds: Record<Role, string>;
  robotIds: Record<string, string>; // by robot name
  gaitIds: Record<string, string>; // by gait name
};

/** The ids of the seeded demo workspace, its people (by role), robots and gaits (by name). */
export async function demoIds(db: Database): Promise<DemoIds> {
  const [workspace] = await db.select().from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));
  const userIds = {} as Record<Role, string>;
  for (const person of demoPeople) {
    const [user] = await db.select({ id: users.id }).from(users).where(eq(users.login, person.login));
    userIds[person.role] = user.id;
  }
  const robotRows = await db.select().from(robots).where(eq(robots.workspaceId, workspace.id));
  const gaitRows = await db.select().from(gaits).where(eq(gaits.workspaceId, workspace.id));
  return {
    workspaceId: workspace.id,
    userIds,
    robotIds: Object.fromEntries(robotRows.map((row) => [row.name, row.id])),
    gaitIds: Object.fromEntries(gaitRows.map((row) => [row.name, row.id])),
  };
}

export type MakeRequest = (method: string, path: string, body?: { form?: Record<string, string>; json?: unknown }) => Promise<Request>;

/** Requests as `caller` would send them from the app's own pages: their session cookie, and the Origin a mutation carries. */
export async function requestsAs(caller: Caller, ids: DemoIds): Promise<MakeRequest> {
  return requestsWith(caller === "signed-out" ? null : await sessionCookieFor(ids.userIds[caller], ids.workspaceId));
}

/** The `name=value` pair of a session cookie for `userId`, as signing in would give (in `workspaceId` when named). */
export async function sessionCookieFor(userId: string, workspaceId?: string): Promise<string> {
  const session = await sessionStorage().getSession();
  session.set("userId", userId);
  if (workspaceId) session.set("workspaceId", workspaceId);
  return (await commitSession(session)).split(";")[0];
}

/** Requests carrying `cookie` (null: none), with `extra` headers, as the app's own pages send them. */
export function requestsWith(cookie: string | null, extra: Record<string, string> = {}): MakeRequest {
  return async (method, path, body) => {
    const headers = new Headers(extra);
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

/** A multipart POST as the browser sends a file form, with the caller's session. */
export async function multipart(request: MakeRequest, path: string, fields: Record<string, string | File>): Promise<Request> {
  const base = await request("POST", path);
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  const headers = new Headers(base.headers);
  headers.delete("Content-Type");
  return new Request(base.url, { method: "POST", headers, body: form });
}

/** A GET as a script sends it with an API token: no cookie, no Origin. */
export const bearer = (path: string, token: string, headers: Record<string, string> = {}): Request =>
  new Request(new URL(path, PUBLIC_ORIGIN), { headers: { Authorization: `Bearer ${token}`, ...headers } });

type RouteModule = { loader?: (args: never) => unknown; action?: (args: never) => unknown };

/** Calls a route module's loader as the framework would. */
export function load(module: RouteModule, request: Request, params: Record<string, string> = {}) {
  if (!module.loader) throw new Error("this route module has no loader");
  return Promise.resolve(module.loader({ request, params, context: {} } as never));
}

/**
 * A page's loader data, typed from its route module: the loader called as the
 * framework would, `data()` unwrapped; a Response (a redirect, a refusal) fails the test.
 */
export async function loaderData<M extends { loader: (args: never) => unknown }>(
  module: M,
  request: Request,
  params: Record<string, string> = {},
): Promise<LoaderData<M>> {
  const value = await load(module, request, params);
  if (value instanceof Response) throw new Error(`expected the page's data, got a ${value.status} response`);
  // The loader's own return type, less the Response ruled out above.
  return (isData(value) ? value.data : value) as LoaderData<M>;
}

const isData = (value: unknown): value is { data: unknown; init?: ResponseInit | null } =>
  !!value && typeof value === "object" && "type" in value && value.type === "DataWithResponseInit";

/** Calls a route module's action as the framework would. */
export function act(module: RouteModule, request: Request, params: Record<string, string> = {}) {
  if (!module.action) throw new Error("this route module has no action");
  return Promise.resolve(module.action({ request, params, context: {} } as never));
}

/** The JSON API's refusal, as `apiError` in app/platform/errors.server.ts sends it. */
export type ApiRefusal<Details extends ErrorDetails = DetailRecord> = { error: { code: ApiErrorCode; message: string; details?: Details } };

/** A form action's inline refusal, as `formAction` in app/platform/errors.server.ts returns it. */
export type FormRefusal<Details extends ErrorDetails = DetailRecord> = FormError<Details>;

/** What a route module's loader gives its page, `data()` unwrapped and redirects left out: the body `outcome()` reads back. */
export type LoaderData<M extends { loader: (args: never) => unknown }> = Unwrapped<Awaited<ReturnType<M["loader"]>>>;

type Unwrapped<T> = T extends Response ? never : T extends { data: infer D; init: ResponseInit | null } ? D : T;

/**
 * A route's answer read back. `T` is the body the test expects (an answer type,
 * LoaderData, ApiRefusal, FormRefusal); a test that reads no body leaves it unknown.
 */
export type Outcome<T = unknown> = {
  status: number;
  /** Where a redirect points. */
  location?: string;
  headers: Headers;
  /** A Response's body as sent; "" for data the framework would serialise. */
  text: string;
  /** A JSON body parsed, any other body as its text, or the data itself. */
  body: T;
};

/** What a loader or action produced, returned or thrown: a Response, `data()`, or plain data. */
export function outcome<T = unknown>(run: () => Promise<unknown>): Promise<Outcome<T>> {
  return settle<T>(run, false);
}

/** What a resource route (an API, a download) answered; anything but a Response of its own fails the test. */
export function responseOf<T = unknown>(run: () => Promise<unknown>): Promise<Outcome<T>> {
  return settle<T>(run, true);
}

async function settle<T>(run: () => Promise<unknown>, responseOnly: boolean): Promise<Outcome<T>> {
  let value: unknown;
  let thrown = false;
  try {
    value = await run();
  } catch (error) {
    value = error;
    thrown = true;
  }
  if (value instanceof Response) {
    const text = await value.text();
    const body = /json/.test(value.headers.get("Content-Type") ?? "") && text ? JSON.parse(text) : text;
    return { status: value.status, location: value.headers.get("Location") ?? undefined, headers: value.headers, text, body };
  }
  if (thrown && !isData(value)) throw value;
  if (responseOnly) throw new Error(`expected a Response, got ${isData(value) ? "data()" : JSON.stringify(value)?.slice(0, 200)}`);
  if (isData(value)) {
    const { data, init } = value;
    return { status: init?.status ?? 200, headers: new Headers(init?.headers), text: "", body: data as T };
  }
  return { status: 200, headers: new Headers(), text: "", body: value as T };
}

/** The member a demo person is once signed in, as the services take them. */
export async function memberAs(role: Role, ids: DemoIds): Promise<Member> {
  const member = await currentMember(await (await requestsAs(role, ids))("GET", "/"));
  if (!member) throw new Error(`no member for ${role}`);
  return member;
}

/** The refusal a service call ends in; fails the test if the call succeeds. */
export async function refusal(run: () => Promise<unknown>): Promise<ServiceError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal, but the call succeeded");
}
