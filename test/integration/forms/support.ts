// Every route action that reads a form, with a form it would take and the
// caller who may send it, for the tests of what every form must survive:
// bodies beyond the limit, other content types, NUL characters, bytes that
// are not UTF-8. Requests are built as the browser sends them (the caller's
// session cookie, our Origin), with any body.
import { type Caller, type DemoIds, requestsAs } from "../../support/routes";
import * as calibration from "~/routes/export/calibration";
import * as editor from "~/routes/gaits/editor";
import * as gait from "~/routes/gaits/gait";
import * as newGait from "~/routes/gaits/new";
import * as version from "~/routes/gaits/version";
import * as gitHubSignIn from "~/routes/auth/github";
import * as robotList from "~/routes/robots/list";
import * as robotPage from "~/routes/robots/robot";
import * as revisionPage from "~/routes/robots/revision";
import * as members from "~/routes/settings/members";
import * as tokens from "~/routes/settings/tokens";
import * as workspaceSettings from "~/routes/settings/workspace";
import * as welcome from "~/routes/welcome";
import * as workspaceSwitch from "~/routes/workspace-switch";

type RouteModule = { action?: (args: never) => unknown };

export type FormAction = {
  name: string;
  module: RouteModule;
  path: (ids: DemoIds) => string;
  params: (ids: DemoIds) => Record<string, string>;
  caller: Caller;
  form: (ids: DemoIds) => Record<string, string>;
  /** A text field of the form, named in refusals about it. */
  textField: string;
};

const ROBOT = "Pier crawler";
const GAIT = "Tripod cruise";

export const FORM_ACTIONS: FormAction[] = [
  {
    name: "POST /welcome (create a workspace)",
    module: welcome,
    path: () => "/welcome",
    params: () => ({}),
    caller: "owner",
    form: () => ({ intent: "create", name: "Quay lab" }),
    textField: "name",
  },
  {
    name: "POST /auth/github",
    module: gitHubSignIn,
    path: () => "/auth/github",
    params: () => ({}),
    caller: "signed-out",
    form: () => ({ returnTo: "/gaits" }),
    textField: "returnTo",
  },
  {
    name: "POST /workspace",
    module: workspaceSwitch,
    path: () => "/workspace",
    params: () => ({}),
    caller: "owner",
    form: (ids) => ({ workspaceId: ids.workspaceId, returnTo: "/gaits" }),
    textField: "returnTo",
  },
  {
    name: "POST /settings (rename the workspace)",
    module: workspaceSettings,
    path: () => "/settings",
    params: () => ({}),
    caller: "owner",
    form: () => ({ name: "Breakwater Lab" }),
    textField: "name",
  },
  {
    name: "POST /settings/tokens (create)",
    module: tokens,
    path: () => "/settings/tokens",
    params: () => ({}),
    caller: "owner",
    form: () => ({ intent: "create", name: "build script" }),
    textField: "name",
  },
  {
    name: "POST /settings/members (invite)",
    module: members,
    path: () => "/settings/members",
    params: () => ({}),
    caller: "owner",
    form: () => ({ intent: "invite", email: "newcomer@breakwater-lab.test", role: "viewer" }),
    textField: "email",
  },
  {
    name: "POST /robots (create)",
    module: robotList,
    path: () => "/robots",
    params: () => ({}),
    caller: "owner",
    form: () => ({ intent: "create", name: "Quay crawler", source: "starter-6" }),
    textField: "name",
  },
  {
    name: "POST /robots/:robotId (save)",
    module: robotPage,
    path: (ids) => `/robots/${ids.robotIds[ROBOT]}`,
    params: (ids) => ({ robotId: ids.robotIds[ROBOT] }),
    caller: "owner",
    form: () => ({ intent: "save", baseRevision: "1", definition: "{}", message: "Longer tibias" }),
    textField: "message",
  },
  {
    name: "POST /robots/:robotId/revisions/:number (restore)",
    module: revisionPage,
    path: (ids) => `/robots/${ids.robotIds[ROBOT]}/revisions/1`,
    params: (ids) => ({ robotId: ids.robotIds[ROBOT], number: "1" }),
    caller: "owner",
    form: () => ({ intent: "restore", baseRevision: "1" }),
    textField: "intent",
  },
  {
    name: "POST /export/calibration/:robotId (create a profile)",
    module: calibration,
    path: (ids) => `/export/calibration/${ids.robotIds[ROBOT]}`,
    params: (ids) => ({ robotId: ids.robotIds[ROBOT] }),
    caller: "owner",
    form: () => ({ intent: "create", name: "Unit 7" }),
    textField: "name",
  },
  {
    name: "POST /gaits/new (create)",
    module: newGait,
    path: () => "/gaits/new",
    params: () => ({}),
    caller: "owner",
    form: (ids) => ({ intent: "create", robotId: ids.robotIds[ROBOT], name: "Quay walk", template: "tripod" }),
    textField: "name",
  },
  {
    name: "POST /gaits/:gaitId/edit (move to the newest robot)",
    module: editor,
    path: (ids) => `/gaits/${ids.gaitIds[GAIT]}/edit`,
    params: (ids) => ({ gaitId: ids.gaitIds[GAIT] }),
    caller: "owner",
    form: () => ({ intent: "move-to-newest-robot", baseRevision: "1" }),
    textField: "baseRevision",
  },
  {
    name: "POST /gaits/:gaitId (commit)",
    module: gait,
    path: (ids) => `/gaits/${ids.gaitIds[GAIT]}`,
    params: (ids) => ({ gaitId: ids.gaitIds[GAIT] }),
    caller: "owner",
    form: () => ({ intent: "commit", message: "Calmer steps" }),
    textField: "message",
  },
  {
    name: "POST /gaits/:gaitId/versions/:number (send back)",
    module: version,
    path: (ids) => `/gaits/${ids.gaitIds[GAIT]}/versions/1`,
    params: (ids) => ({ gaitId: ids.gaitIds[GAIT], number: "1" }),
    caller: "owner",
    form: () => ({ intent: "send-back", comment: "Lift the rear legs higher" }),
    textField: "comment",
  },
];

/** A POST to `path` as `caller` sends it from our pages, with this body and Content-Type (none when null). */
export async function postAs(caller: Caller, ids: DemoIds, path: string, body: BodyInit, contentType: string | null): Promise<Request> {
  const base = await (await requestsAs(caller, ids))("POST", path);
  const headers = new Headers(base.headers);
  if (contentType === null) headers.delete("Content-Type");
  else headers.set("Content-Type", contentType);
  return new Request(base.url, { method: "POST", headers, body, duplex: "half" } as RequestInit);
}

/**
 * A body of `totalBytes` that starts with `prefix` and goes on with "a", made
 * only as it is read, with no declared length (as a chunked upload): `pulled`
 * says how much of it the server asked for.
 */
export function countedBody(prefix: string, totalBytes: number, chunkBytes = 64 * 1024) {
  const counter = { pulled: 0 };
  const start = new TextEncoder().encode(prefix);
  const chunk = new Uint8Array(chunkBytes).fill(0x61);
  let started = false;
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        if (!started) {
          started = true;
          counter.pulled += start.byteLength;
          controller.enqueue(start);
        } else if (counter.pulled >= totalBytes) {
          controller.close();
        } else {
          counter.pulled += chunk.byteLength;
          controller.enqueue(chunk);
        }
      },
    },
    { highWaterMark: 0 },
  );
  return { stream, counter };
}

/** The sentence of a refusal, whichever surface answered: a form error, a page's error data, or the API's JSON error. */
export function refusalText(body: unknown): string {
  if (!body || typeof body !== "object") return String(body);
  const record = body as { error?: unknown; message?: unknown };
  if (typeof record.error === "string") return record.error;
  if (record.error && typeof record.error === "object" && "message" in record.error) return String((record.error as { message: unknown }).message);
  if (typeof record.message === "string") return record.message;
  return JSON.stringify(body);
}

/** The form field a refusal names in its details, if any. */
export function refusalField(body: unknown): string | undefined {
  if (!body || typeof body !== "object") return undefined;
  const record = body as { field?: unknown; error?: { details?: { field?: unknown } } };
  if (typeof record.field === "string") return record.field;
  const field = record.error?.details?.field;
  return typeof field === "string" ? field : undefined;
}
