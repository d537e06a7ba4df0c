// What the probe aims at, read from the app itself: every route of
// app/routes.ts, and for each its loader, its action and each of the action's
// intents as the module declares them (`permissions`, `actionForm`). A new
// route is probed without a line here; the field hints below only add what a
// module does not say (the fields an action reads past its intent schema, the
// query parameters a page reads).
import routeConfig from "../../app/routes";
import type { Requirement, RoutePermissions } from "../../app/platform/permissions";

/** How a field's hostile values are chosen. */
export type FieldKind =
  | "id"
  | "number"
  | "text"
  | "email"
  | "role"
  | "returnTo"
  | "robot-json"
  | "sequence-json"
  | "calibration-json"
  | "robot-file"
  | "urdf-file"
  | "robot-source"
  | "template"
  | "enum";

export type Field = { name: string; kind: FieldKind; values?: readonly string[] };

export type RouteInfo = {
  /** The framework's route id: the module's file under app/ without its extension. */
  id: string;
  file: string;
  /** The URL pattern, e.g. /robots/:robotId; a layout without a path has its parent's. */
  pattern: string;
  index: boolean;
  api: boolean;
  loader: boolean;
  action: boolean;
  permissions: RoutePermissions;
  intents: string[] | null;
  /** The module's `actionForm`, whose intents name their fields. */
  schema: unknown;
};

export type Target = {
  route: RouteInfo;
  kind: "loader" | "action";
  intent?: string;
  needs: Requirement;
  /** The method the app's own pages or clients use. */
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  /** How its clients send the body. */
  body: "none" | "form" | "multipart" | "json";
  fields: Field[];
  /** Query parameters a loader reads. */
  query: Field[];
  /** It ends the caller's session (sign-out, signing out everywhere): the probe sends it only with a session of its own to lose. */
  endsSession: boolean;
  /** It accepts an invitation (by the link's token, or by id): the set-aside invitation must be refused there. */
  acceptsInvitation: boolean;
};

type ConfigEntry = { file: string; path?: string; index?: boolean; children?: ConfigEntry[] };
type RouteModule = { loader?: unknown; action?: unknown; permissions?: RoutePermissions; actionForm?: unknown };

function flatten(entries: ConfigEntry[], parent: string): { entry: ConfigEntry; pattern: string }[] {
  return entries.flatMap((entry) => {
    const pattern = entry.path ? `${parent.replace(/\/$/, "")}/${entry.path}` : parent;
    return [{ entry, pattern: pattern || "/" }, ...flatten(entry.children ?? [], pattern)];
  });
}

type ZodLike = { _zod?: { def?: { type?: string; shape?: Record<string, unknown>; options?: ZodLike[] }; propValues?: Record<string, Set<unknown>> } };

/** The fields each intent's schema names (zod objects, or a discriminated union of them). */
function schemaFields(schema: unknown): Map<string, string[]> {
  const fields = new Map<string, string[]>();
  const def = (schema as ZodLike | undefined)?._zod?.def;
  const objects = def?.type === "union" ? (def.options ?? []) : def?.type === "object" ? [schema as ZodLike] : [];
  for (const object of objects) {
    const shape = object._zod?.def?.shape ?? {};
    const intents = [...(object._zod?.propValues?.intent ?? [])].map(String);
    for (const intent of intents)
      fields.set(
        intent,
        Object.keys(shape).filter((name) => name !== "intent"),
      );
  }
  return fields;
}

const TEMPLATES = ["tripod", "wave", "ripple", "trot", "walk", "crawl"];
const kindOfName = (name: string): FieldKind =>
  /Id$/.test(name)
    ? "id"
    : /(revision|Revision|number|Ms|Mm|Deg|fps|Factor)$/.test(name)
      ? "number"
      : name === "email"
        ? "email"
        : name === "role"
          ? "role"
          : name === "returnTo"
            ? "returnTo"
            : name === "definition"
              ? "robot-json"
              : name === "sequence"
                ? "sequence-json"
                : name === "json"
                  ? "calibration-json"
                  : "text";

const f = (name: string, kind: FieldKind = kindOfName(name), values?: readonly string[]): Field => ({ name, kind, ...(values ? { values } : {}) });

const CALIBRATION_FIELDS = [
  f("name"),
  f("description"),
  f("joints.LF.coxa.trimDeg", "number"),
  f("joints.LF.coxa.channel", "number"),
  f("joints.LF.coxa.reversed", "enum", ["true", "false", ""]),
];
const NEW_GAIT_NUMBERS = ["cycleMs", "fps", "strideMm", "stepHeightMm", "directionDeg", "turnDegPerCycle", "bodyHeightMm", "dutyFactor"];

/** Fields an action reads beyond its intent schema, by module and intent ("" for an action without intents). */
const FIELD_HINTS: Record<string, Record<string, Field[]>> = {
  "routes/robots/list.tsx": {
    create: [f("name"), f("source", "robot-source")],
    upload: [f("file", "robot-file"), f("name")],
    "import-urdf": [f("file", "urdf-file"), f("name")],
  },
  "routes/export/calibration.tsx": {
    create: CALIBRATION_FIELDS,
    update: CALIBRATION_FIELDS,
  },
  "routes/gaits/new.tsx": {
    create: [f("robotId"), f("name"), f("description"), f("template", "template", TEMPLATES), ...NEW_GAIT_NUMBERS.map((name) => f(name, "number"))],
    copy: [f("sourceGaitId"), f("name"), f("sequence", "sequence-json")],
  },
  "routes/settings/workspace.tsx": { "": [f("name")] },
  "routes/workspace-switch.ts": { "": [f("workspaceId"), f("returnTo")] },
  "routes/auth/github.ts": { "": [f("returnTo")] },
  "routes/api.v1/solver/solve.ts": { "": [f("robot", "robot-json"), f("sequence", "sequence-json"), f("options", "text")] },
  "routes/api.v1/solver/ik.ts": { "": [f("robot", "robot-json"), f("feet", "text"), f("bodyPose", "text")] },
  "routes/api.v1/gaits/draft.ts": { "": [f("sequence", "sequence-json"), f("baseRevision", "number")] },
};

/** An angle table's query, as the export page and the table API read it. */
const TABLE_QUERY = [f("format", "enum", ["csv", "json", "c"]), f("units", "enum", ["deg", "rad", "us"]), f("rate", "number"), f("profile"), f("override")];

/** Query parameters a page or API route reads (the API's also come from its OpenAPI document at run time). */
const QUERY_HINTS: Record<string, Field[]> = {
  "routes/auth/sign-in.tsx": [f("returnTo")],
  "routes/auth/github-callback.ts": [f("code"), f("state"), f("error")],
  "routes/gaits/list.tsx": [f("robot", "id")],
  "routes/gaits/compare.tsx": [f("a", "id"), f("b", "id")],
  "routes/gaits/gait.tsx": [
    f("sort", "enum", ["number", "createdAt", "state"]),
    f("dir", "enum", ["asc", "desc"]),
    f("state"),
    f("author", "id"),
    f("q"),
    f("flags"),
  ],
  "routes/export/page.tsx": [f("gait", "id"), f("version", "number"), ...TABLE_QUERY],
  "routes/export/bring-up.tsx": [
    f("robot", "id"),
    f("kind", "enum", ["centre", "sweep"]),
    f("leg", "enum", ["LF", "RF", "LH", "RH"]),
    f("joint", "enum", ["coxa", "femur", "tibia"]),
    f("speed", "number"),
    f("dwell", "number"),
    f("seconds", "number"),
    f("fps", "number"),
    f("format", "enum", ["csv", "json", "c"]),
  ],
  "routes/export/calibration.tsx": [f("edit", "id"), f("saved", "number"), f("deleted")],
  "routes/api.v1/export/table.ts": [...TABLE_QUERY],
  "routes/api.v1/export/bench-table.ts": [
    f("kind", "enum", ["centre", "sweep"]),
    f("leg", "enum", ["LF", "RF"]),
    f("joint", "enum", ["coxa", "femur", "tibia"]),
    f("speed", "number"),
    f("dwell", "number"),
    f("seconds", "number"),
    f("fps", "number"),
    f("hold", "enum", ["stance", "centre"]),
    f("format", "enum", ["csv", "json", "c"]),
    f("units", "enum", ["deg", "rad", "us"]),
  ],
};

const MULTIPART_INTENTS = new Set(["upload", "import-urdf"]);

/** Actions that end the caller's session, by module and intent ("" for an action without intents). */
const SESSION_ENDING: Record<string, string[]> = {
  "routes/auth/sign-out.ts": [""],
  "routes/account/sessions.tsx": ["end-all"],
};
const endsSession = (file: string, intent = "") => SESSION_ENDING[file]?.includes(intent) ?? false;

/** Actions that accept an invitation, likewise. */
const INVITATION_ACCEPTING: Record<string, string[]> = {
  "routes/invitations/accept.tsx": [""],
  "routes/welcome.tsx": ["accept"],
};
const acceptsInvitation = (file: string, intent = "") => INVITATION_ACCEPTING[file]?.includes(intent) ?? false;

/** Every route of app/routes.ts with what its module exports and declares. */
export async function loadRoutes(): Promise<RouteInfo[]> {
  const flat = flatten(routeConfig as ConfigEntry[], "");
  return Promise.all(
    flat.map(async ({ entry, pattern }) => {
      const module = (await import(`../../app/${entry.file}`)) as RouteModule;
      const declared = module.permissions ?? {};
      const intents = typeof declared.action === "object" ? Object.keys(declared.action) : null;
      return {
        id: entry.file.replace(/\.[jt]sx?$/, ""),
        file: entry.file,
        pattern,
        index: entry.index === true,
        api: pattern.startsWith("/api/"),
        loader: typeof module.loader === "function",
        action: typeof module.action === "function",
        permissions: declared,
        intents,
        schema: module.actionForm,
      };
    }),
  );
}

/** A target for each loader, each action without intents, and each intent of an action. */
export function targetsOf(routes: RouteInfo[]): Target[] {
  const targets: Target[] = [];
  for (const route of routes) {
    const declared = route.permissions;
    if (route.loader) {
      const query = QUERY_HINTS[route.file] ?? [];
      targets.push({
        route,
        kind: "loader",
        needs: (declared.loader as Requirement) ?? "public",
        method: "GET",
        body: "none",
        fields: [],
        query,
        endsSession: false,
        acceptsInvitation: false,
      });
    }
    if (!route.action) continue;
    const bySchema = schemaFields(route.schema);
    const hints = FIELD_HINTS[route.file] ?? {};
    const body = route.api ? "json" : "form";
    if (route.intents === null) {
      const needs = (typeof declared.action === "string" ? declared.action : "public") as Requirement;
      targets.push({
        route,
        kind: "action",
        needs,
        method: "POST",
        body,
        fields: hints[""] ?? [],
        query: [],
        endsSession: endsSession(route.file),
        acceptsInvitation: acceptsInvitation(route.file),
      });
      continue;
    }
    for (const intent of route.intents) {
      const needs = (declared.action as Record<string, Requirement>)[intent];
      const named = (bySchema.get(intent) ?? []).map((name) => f(name));
      const extra = (hints[intent] ?? []).filter((hint) => !named.some((field) => field.name === hint.name));
      const fields = [...named.map((field) => hints[intent]?.find((hint) => hint.name === field.name) ?? field), ...extra];
      targets.push({
        route,
        kind: "action",
        intent,
        needs,
        method: "POST",
        body: MULTIPART_INTENTS.has(intent) ? "multipart" : body,
        fields,
        query: [],
        endsSession: endsSession(route.file, intent),
        acceptsInvitation: acceptsInvitation(route.file, intent),
      });
    }
  }
  return targets;
}

/**
 * What the app's OpenAPI document says of each /api/v1 path: the method of
 * its write (PUT for a draft), and the query parameters of its GET.
 */
export function addOpenApiDetails(targets: Target[], document: unknown): void {
  type Operation = { parameters?: { name: string; in: string; schema?: { enum?: string[]; type?: string } }[] };
  const paths = (document as { paths?: Record<string, Record<string, Operation>> })?.paths;
  if (!paths) return;
  for (const target of targets) {
    if (!target.route.api) continue;
    const openApiPath = target.route.pattern.replace(/:([A-Za-z]+)/g, "{$1}");
    if (target.kind === "action") {
      const write = Object.keys(paths[openApiPath] ?? {}).find((method) => ["post", "put", "patch", "delete"].includes(method));
      if (write) target.method = write.toUpperCase() as Target["method"];
      continue;
    }
    const operation = paths[openApiPath]?.get;
    for (const parameter of operation?.parameters ?? []) {
      if (parameter.in !== "query" || target.query.some((field) => field.name === parameter.name)) continue;
      const values = parameter.schema?.enum;
      const kind: FieldKind = values ? "enum" : parameter.schema?.type === "number" || parameter.schema?.type === "integer" ? "number" : "text";
      target.query.push(f(parameter.name, kind, values));
    }
  }
}
