// The OpenAPI 3.1 description of every /api/v1 route, served at
// /api/v1/openapi.json and shown on the API page (/api-docs). Request and
// response schemas come from the zod schemas where there are some (robot,
// sequence, calibration profile, table and bench-table queries, draft save);
// the rest are written here. test/lib/openapi checks that every /api/v1 route
// of app/routes.ts is described, so the two cannot drift apart.
import { createHash } from "node:crypto";
import { z } from "zod";
import { EXPORTER_VERSION, TABLE_FORMAT, TABLE_MEDIA_TYPES, calibrationProfileJsonSchema } from "../../export/index";
import { COLUMNS_ENCODING, COLUMNS_LAYOUT, FLAG_KINDS, sequenceJsonSchema } from "../../gait/index";
import { robotJsonSchema } from "../../kinematics/index";
import type { ApiErrorCode } from "../../platform/api-errors.server";
import { config } from "../../platform/config.server";
import { draftSaveBody } from "../gaits/drafts.server";
import { PERMISSIONS, type Action } from "../../platform/permissions";
import { SOLVE_LAYOUTS } from "../solver/solve.server";
import { matchesIfNoneMatch, RELEASE_TABLE, SOLVER_VERSION, benchQuerySchema, tableQuerySchema } from "../tables/tables.server";

type Json = Record<string, unknown>;

export type OpenApiParameter = { name: string; in: "path" | "query" | "header"; required: boolean; description?: string; schema: Json };
export type OpenApiResponse = { description: string; headers?: Record<string, { description: string; schema: Json }>; content?: Record<string, { schema: Json }> };
export type OpenApiOperation = {
  operationId: string;
  summary: string;
  description?: string;
  tags: string[];
  security?: Record<string, string[]>[];
  parameters?: OpenApiParameter[];
  requestBody?: { required: boolean; description?: string; content: Record<string, { schema: Json }> };
  responses: Record<string, OpenApiResponse | { $ref: string }>;
  /** Which permission of app/platform/permissions.ts the route checks, and the roles that hold it; "public" for none. */
  "x-permission": { action: Action | "public"; roles: string[] };
};
export type OpenApiDocument = {
  openapi: "3.1.0";
  jsonSchemaDialect: string;
  info: Json;
  servers: { url: string; description?: string }[];
  security: Record<string, string[]>[];
  tags: { name: string; description: string }[];
  paths: Record<string, Partial<Record<"get" | "put" | "post" | "delete", OpenApiOperation>>>;
  components: { securitySchemes: Json; schemas: Record<string, Json>; responses: Record<string, OpenApiResponse> };
};

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const json = (schema: Json) => ({ "application/json": { schema } });

/** A JSON Schema generated elsewhere, made a resource of its own ($id) so its local `#/$defs` refs resolve inside it. */
function embedded(schema: Json, id: string): Json {
  const { $schema: _dialect, ...rest } = schema;
  return { $id: id, ...rest };
}

/** A zod object's JSON Schema (input side: defaults make parameters optional) as OpenAPI query parameters. */
export function queryParameters(schema: z.ZodType): OpenApiParameter[] {
  const generated = z.toJSONSchema(schema, { io: "input", target: "draft-2020-12" }) as { properties?: Record<string, Json>; required?: string[] };
  return Object.entries(generated.properties ?? {}).map(([name, property]) => {
    const { description, ...rest } = property;
    return { name, in: "query", required: (generated.required ?? []).includes(name), ...(typeof description === "string" ? { description } : {}), schema: rest };
  });
}

const ERROR_CODES: ApiErrorCode[] = ["bad_request", "unauthorized", "forbidden", "not_found", "conflict", "payload_too_large", "invalid", "rate_limited"];

const STATUS_RESPONSES = {
  400: ["BadRequest", "The request is malformed: a parameter or the JSON body; `details.parameter` names a bad query parameter."],
  401: ["Unauthorized", "No session and no bearer token, a malformed Authorization header, or an unknown or revoked token."],
  403: ["Forbidden", "The role cannot do this (the message says which), or a cookie-carrying mutation from another origin."],
  404: ["NotFound", "Nothing by that id in the caller's workspace (another workspace's things are not found either)."],
  409: ["Conflict", "A conflict with the current state: a stale revision, or a table that needs an override reason."],
  413: ["PayloadTooLarge", "The body is larger than the route's limit (the message gives both sizes)."],
  422: ["Unprocessable", "The input is well-formed but invalid: `details` lists the issues as `{ path, message }`."],
  429: ["TooManyRequests", "Too many requests with this token in a minute; the Retry-After header says when to try again."],
} as const;

type Status = keyof typeof STATUS_RESPONSES;

const errorsFor = (...statuses: Status[]) => Object.fromEntries(statuses.map((status) => [String(status), { $ref: `#/components/responses/${STATUS_RESPONSES[status][0]}` }]));

/** The statuses every authenticated route may answer. */
const AUTH: Status[] = [401, 403, 429];

const PUBLIC = [] as Record<string, string[]>[];

const permission = (action: Action | "public"): OpenApiOperation["x-permission"] => ({ action, roles: action === "public" ? ["anyone"] : [...PERMISSIONS[action]] });

const uuidPath = (name: string, what: string): OpenApiParameter => ({ name, in: "path", required: true, description: what, schema: { type: "string", format: "uuid" } });

const etagResponses = (description: string) => ({
  "304": { description: `${description} unchanged: the If-None-Match tag matches.`, headers: { ETag: { description: "The representation's tag.", schema: { type: "string" } } } },
});

/** GET of one of the public JSON Schema documents. */
function schemaOperation(operationId: string, summary: string, schema: string): OpenApiOperation {
  return {
    operationId,
    summary,
    tags: ["Schemas"],
    security: PUBLIC,
    responses: { "200": { description: "JSON Schema (draft 2020-12).", content: { "application/schema+json": { schema: ref(schema) } } }, ...etagResponses("The schema is") },
    "x-permission": permission("public"),
  };
}

const ifNoneMatch: OpenApiParameter = {
  name: "If-None-Match",
  in: "header",
  required: false,
  description: "An ETag from an earlier answer: 304 without a body when it still matches.",
  schema: { type: "string" },
};

// ---------------------------------------------------------------------------
// Schemas written here (the rest are generated)

const vec3 = { type: "array", items: { type: "number" }, minItems: 3, maxItems: 3, description: "[x, y, z] in millimetres." };
const jointAngles = {
  type: "object",
  required: ["coxa", "femur", "tibia"],
  properties: { coxa: { type: "number" }, femur: { type: "number" }, tibia: { type: "number" } },
};
const bodyPose = {
  type: "object",
  additionalProperties: false,
  description: "Body pose offset: translation in mm, roll, pitch and yaw in degrees (R = Rz(yaw)·Ry(pitch)·Rx(roll)).",
  properties: Object.fromEntries(["x", "y", "z", "roll", "pitch", "yaw"].map((key) => [key, { type: "number", default: 0 }])),
};
const column = { type: "string", contentEncoding: "base64", description: "One float32 (little-endian) a frame." };
const columnsOf = (...names: string[]) => ({
  type: "object",
  required: names,
  properties: Object.fromEntries(names.map((name) => [name, column])),
});
const person = { type: ["object", "null"], properties: { login: { type: "string" }, name: { type: "string" } } };

function writtenSchemas(): Record<string, Json> {
  return {
    Error: {
      type: "object",
      required: ["error"],
      description: "Every refusal of /api/v1.",
      properties: {
        error: {
          type: "object",
          required: ["code", "message"],
          properties: {
            code: { type: "string", enum: ERROR_CODES },
            message: { type: "string", description: "A sentence a person can act on." },
            details: { description: "Issues `[{ path, message }]`, the bad `parameter`, or the state a conflict is with." },
          },
        },
      },
    },
    Workspace: {
      type: "object",
      required: ["workspace", "role", "user", "via"],
      properties: {
        workspace: { type: "object", properties: { id: { type: "string", format: "uuid" }, slug: { type: "string" }, name: { type: "string" } } },
        role: { type: "string", enum: ["owner", "lead", "animator", "firmware", "viewer"] },
        user: { type: "object", properties: { login: { type: "string" }, name: { type: "string" } } },
        via: { type: "string", enum: ["token", "session"] },
      },
    },
    IkRequest: {
      type: "object",
      required: ["robot", "feet"],
      additionalProperties: false,
      properties: { robot: ref("Robot"), feet: { type: "object", additionalProperties: vec3, description: "Per leg id, the foot target in the neutral body frame." }, bodyPose },
    },
    IkResult: {
      type: "object",
      required: ["legs"],
      properties: {
        legs: {
          type: "object",
          additionalProperties: {
            type: "object",
            required: ["reachable", "angles", "pulses", "violations"],
            properties: {
              reachable: { type: "boolean" },
              reason: { type: "string", description: "Why the target is unreachable." },
              angles: { ...jointAngles, description: "Servo degrees (zero offsets applied)." },
              pulses: { ...jointAngles, description: "Pulse widths, µs." },
              violations: { type: "array", items: { type: "object" }, description: "Joint limits the solution breaks." },
            },
          },
        },
      },
    },
    SolveRequest: {
      type: "object",
      required: ["robot", "sequence"],
      additionalProperties: false,
      properties: {
        robot: ref("Robot"),
        sequence: ref("Sequence"),
        options: {
          type: "object",
          additionalProperties: false,
          properties: {
            marginThresholdMm: { type: "number", minimum: 0, maximum: 1000 },
            slipToleranceMm: { type: "number", minimum: 0, maximum: 1000 },
            clearanceMm: { type: "number", minimum: 0, maximum: 1000 },
            fps: { type: "integer", minimum: 1, maximum: 1000, description: "Solve at another frame rate than the sequence's." },
            layout: {
              type: "string",
              enum: [...SOLVE_LAYOUTS],
              default: "frames",
              description: "frames: one object a frame; columns: the compact column layout; checks: flags and summary only.",
            },
          },
        },
      },
    },
    Flag: {
      type: "object",
      required: ["frame", "kind", "value", "limit", "severity", "message"],
      properties: {
        frame: { type: "integer" },
        leg: { type: "string" },
        joint: { type: "string", enum: ["coxa", "femur", "tibia"] },
        kind: { type: "string", enum: [...FLAG_KINDS] },
        value: { type: "number" },
        limit: { type: "number" },
        severity: { type: "string", enum: ["error", "warning"] },
        message: { type: "string" },
      },
    },
    SolveResult: {
      type: "object",
      description: "options.layout \"frames\" (the default).",
      required: ["frames", "flags", "summary"],
      properties: {
        frames: {
          type: "array",
          items: {
            type: "object",
            properties: {
              index: { type: "integer" },
              timeMs: { type: "number" },
              body: bodyPose,
              legs: {
                type: "object",
                additionalProperties: {
                  type: "object",
                  properties: { contact: { type: "string", enum: ["stance", "swing"] }, foot: vec3, reachable: { type: "boolean" }, angles: jointAngles, pulses: jointAngles },
                },
              },
              support: { type: "array", items: { type: "array", items: { type: "number" } } },
              com: { type: "array", items: { type: "number" } },
              marginMm: { type: ["number", "null"] },
            },
          },
        },
        flags: { type: "array", items: ref("Flag") },
        summary: ref("SolveSummary"),
      },
    },
    SolveSummary: {
      type: "object",
      description: "frames, fps, flagsByKind, errors, warnings, worstMarginMm, peakSpeedDegS, dutyFactor, strideMm, bodySpeedMmS, …",
    },
    SolveColumns: {
      type: "object",
      description: `options.layout "columns": every per-frame quantity as one column, the base64 of ${COLUMNS_ENCODING} values (one a frame; marginMm is NaN where fewer than three feet are down).`,
      required: ["layout", "encoding", "frames", "fps", "legs", "joints", "body", "leg", "supportPolygons", "supportIndex", "com", "marginMm", "flags", "summary"],
      properties: {
        layout: { const: COLUMNS_LAYOUT },
        encoding: { const: COLUMNS_ENCODING },
        frames: { type: "integer" },
        fps: { type: "number" },
        legs: { type: "array", items: { type: "string" } },
        joints: { type: "array", items: { type: "string" } },
        body: columnsOf("x", "y", "z", "roll", "pitch", "yaw"),
        leg: {
          type: "object",
          additionalProperties: {
            type: "object",
            properties: {
              contact: { type: "string", description: "One character a frame: s stance, w swing." },
              foot: columnsOf("x", "y", "z"),
              unreachableFrames: { type: "array", items: { type: "integer" } },
              angles: columnsOf("coxa", "femur", "tibia"),
              pulses: columnsOf("coxa", "femur", "tibia"),
            },
          },
        },
        supportPolygons: { type: "array", items: { type: "array", items: { type: "number" } }, description: "Distinct polygons as flat [x0, y0, x1, y1, …]." },
        supportIndex: { type: "array", items: { type: "integer" }, description: "Per frame, which of supportPolygons." },
        com: columnsOf("x", "y"),
        marginMm: column,
        flags: { type: "array", items: ref("Flag") },
        summary: ref("SolveSummary"),
      },
    },
    SolveChecks: {
      type: "object",
      description: "options.layout \"checks\": the flags and summary without the frames.",
      required: ["flags", "summary"],
      properties: { flags: { type: "array", items: ref("Flag") }, summary: ref("SolveSummary") },
    },
    RobotList: {
      type: "object",
      properties: {
        robots: {
          type: "array",
          items: {
            type: "object",
            properties: {
              id: { type: "string", format: "uuid" },
              name: { type: "string" },
              legCount: { type: "integer" },
              latestRevision: { type: "integer" },
              updatedAt: { type: "string", format: "date-time" },
              url: { type: "string" },
            },
          },
        },
      },
    },
    RevisionSummary: {
      type: "object",
      properties: { number: { type: "integer" }, message: { type: "string" }, author: person, createdAt: { type: "string", format: "date-time" } },
    },
    RobotDetail: {
      type: "object",
      properties: {
        id: { type: "string", format: "uuid" },
        name: { type: "string" },
        createdAt: { type: "string", format: "date-time" },
        latest: { allOf: [ref("RevisionSummary"), { type: "object", properties: { definition: ref("Robot") } }] },
        revisions: { type: "array", items: ref("RevisionSummary") },
      },
    },
    RobotRevision: {
      type: "object",
      properties: {
        robot: { type: "object", properties: { id: { type: "string" }, name: { type: "string" } } },
        latestRevision: { type: "integer" },
        revision: { allOf: [ref("RevisionSummary"), { type: "object", properties: { definition: ref("Robot") } }] },
      },
    },
    VersionList: {
      type: "object",
      properties: {
        gait: {
          type: "object",
          properties: {
            id: { type: "string", format: "uuid" },
            name: { type: "string" },
            robotId: { type: "string", format: "uuid" },
            robotName: { type: "string" },
            releasedVersion: { type: ["integer", "null"] },
          },
        },
        versions: {
          type: "array",
          items: {
            type: "object",
            properties: {
              id: { type: "string", format: "uuid" },
              number: { type: "integer" },
              state: { type: "string", enum: ["committed", "in-review", "sent-back", "approved", "released", "retired"] },
              message: { type: "string" },
              author: person,
              createdAt: { type: "string", format: "date-time" },
              stateChangedAt: { type: "string", format: "date-time" },
              robotRevision: { type: "integer" },
              contentHash: { type: "string", description: "SHA-256 of the sequence and the robot definition it was solved with." },
              summary: { type: "object", description: "The solve's summary: frames, fps, flagsByKind, errors, warnings, worstMarginMm, …" },
            },
          },
        },
      },
    },
    Draft: {
      type: "object",
      properties: {
        gaitId: { type: "string", format: "uuid" },
        name: { type: "string" },
        revision: { type: "integer", description: "Send it back as baseRevision when saving." },
        updatedAt: { type: "string" },
        updatedBy: person,
        robot: { type: "object", properties: { id: { type: "string" }, name: { type: "string" }, revision: { type: "integer" }, newestRevision: { type: "integer" } } },
        sequence: ref("Sequence"),
      },
    },
    DraftSaved: { type: "object", properties: { revision: { type: "integer" }, updatedAt: { type: "string" } } },
    AngleTable: {
      type: "object",
      description: `The JSON table (${TABLE_FORMAT}): one integer per cell in fixed point, printed with meta.decimals decimals; channels in servo-channel order.`,
      required: ["format", "meta", "channels", "frames"],
      properties: {
        format: { const: TABLE_FORMAT },
        meta: {
          type: "object",
          properties: {
            exporterVersion: { type: "string" },
            solverVersion: { type: ["string", "null"] },
            robot: { type: "object", properties: { name: { type: "string" }, revision: { type: ["integer", "string"] } } },
            gait: { type: "object", properties: { name: { type: "string" }, version: { type: ["integer", "string"] }, contentHash: { type: "string" }, loop: { type: ["boolean", "null"] } } },
            units: { type: "string", enum: ["deg", "rad", "us"] },
            rateHz: { type: "number" },
            framePeriodMs: { type: "number" },
            frameCount: { type: "integer" },
            channelCount: { type: "integer" },
            calibrationProfile: { type: ["string", "null"] },
            overrideReason: { type: ["string", "null"] },
            flags: { type: "object" },
            clamped: { type: "array", items: { type: "object" } },
            safety: { type: "array", items: { type: "string" } },
          },
        },
        channels: { type: "array", items: { type: "object", properties: { column: { type: "integer" }, channel: { type: "integer" }, leg: { type: "string" }, joint: { type: "string" }, name: { type: "string" } } } },
        frames: { type: "array", items: { type: "object", properties: { index: { type: "integer" }, timeMs: { type: "number" }, values: { type: "array", items: { type: "number" } } } } },
      },
    },
    CalibrationProfiles: {
      type: "object",
      properties: {
        robot: { type: "object", properties: { id: { type: "string" }, name: { type: "string" }, revision: { type: "integer" } } },
        profiles: {
          type: "array",
          items: {
            type: "object",
            properties: {
              id: { type: "string", format: "uuid" },
              name: { type: "string" },
              revision: { type: "integer", description: "Goes up with every save; the table header names it." },
              updatedAt: { type: "string", format: "date-time" },
              updatedBy: person,
              profile: ref("CalibrationProfile"),
            },
          },
        },
      },
    },
  };
}

// ---------------------------------------------------------------------------
// The document

const tableHeadersDoc = {
  ETag: { description: "The representation's tag: version content hash, format, units, rate, calibration profile and revision, override, exporter and solver versions.", schema: { type: "string" } },
  "Content-Disposition": { description: "attachment; filename=\"<gait>_v<version>_<units>_<rate>hz.<csv|json|h>\"", schema: { type: "string" } },
  "Repr-Digest": { description: "RFC 9530: sha-256 of the bytes (a release record stores the same hash in hex).", schema: { type: "string" } },
  "Gaitloom-Gait": { description: "Gait name (percent-encoded), version and content hash: the metadata a CSV cannot hold.", schema: { type: "string" } },
  "Gaitloom-Flags": { description: "errors=…; warnings=…; clamped=…", schema: { type: "string" } },
};

const tableContent = {
  "text/csv": { schema: { type: "string", description: `${TABLE_MEDIA_TYPES.csv}: header record frame,time_ms,<leg>.<joint>… in channel order, CRLF line ends.` } },
  "application/json": { schema: ref("AngleTable") },
  "text/x-c": { schema: { type: "string", description: "A C99 header: the frame count, frame period, channel map and a static const fixed-point array, with a comment block naming robot, revision, gait version and content hash." } },
};

function buildDocument(publicUrl: string): OpenApiDocument {
  const schemaUrl = (file: string) => `${publicUrl}/api/v1/schema/${file}`;
  const responses: Record<string, OpenApiResponse> = Object.fromEntries(
    Object.values(STATUS_RESPONSES).map(([name, description]) => [name, { description, content: json(ref("Error")) }]),
  );
  responses.TooManyRequests = { ...responses.TooManyRequests, headers: { "Retry-After": { description: "Seconds until the next minute's allowance.", schema: { type: "integer" } } } };
  const draftSave = z.toJSONSchema(draftSaveBody, { io: "input", target: "draft-2020-12" }) as Json & { properties: Json };
  const { $schema: _dialect, ...draftSaveSchema } = draftSave;

  const paths: OpenApiDocument["paths"] = {
    "/api/v1/workspace": {
      get: {
        operationId: "getWorkspace",
        summary: "Which workspace and role a token or session acts with",
        description: "Build scripts call it first to check their token.",
        tags: ["Account"],
        responses: { "200": { description: "The workspace, role and person.", content: json(ref("Workspace")) }, ...errorsFor(...AUTH) },
        "x-permission": permission("workspace.read"),
      },
    },
    "/api/v1/solve": {
      post: {
        operationId: "solveSequence",
        summary: "Solve a gait sequence for a robot",
        description: "Every frame's foot positions, joint angles and pulses, the flags of every check, and a summary. Bodies up to 2 MiB; recent answers are cached (send `Cache-Control: no-cache` for a fresh solve).",
        tags: ["Solver"],
        requestBody: { required: true, content: json(ref("SolveRequest")) },
        responses: {
          "200": { description: "The solved sequence in the layout asked for.", content: json({ oneOf: [ref("SolveResult"), ref("SolveColumns"), ref("SolveChecks")] }) },
          ...errorsFor(400, ...AUTH, 413, 422),
        },
        "x-permission": permission("solver.use"),
      },
    },
    "/api/v1/ik": {
      post: {
        operationId: "solveFeet",
        summary: "Inverse kinematics for foot targets",
        description: "Closed-form leg IK per foot, with reachability, limit violations and pulse widths. Bodies up to 256 KiB.",
        tags: ["Solver"],
        requestBody: { required: true, content: json(ref("IkRequest")) },
        responses: { "200": { description: "Angles per leg.", content: json(ref("IkResult")) }, ...errorsFor(400, ...AUTH, 413, 422) },
        "x-permission": permission("solver.use"),
      },
    },
    "/api/v1/robots": {
      get: {
        operationId: "listRobots",
        summary: "The workspace's robots",
        tags: ["Robots"],
        responses: { "200": { description: "Robots with their newest revision.", content: json(ref("RobotList")) }, ...errorsFor(...AUTH) },
        "x-permission": permission("robots.read"),
      },
    },
    "/api/v1/robots/{robotId}": {
      get: {
        operationId: "getRobot",
        summary: "One robot: its newest definition and the list of revisions",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: { "200": { description: "The robot.", content: json(ref("RobotDetail")) }, ...errorsFor(400, ...AUTH, 404) },
        "x-permission": permission("robots.read"),
      },
    },
    "/api/v1/robots/{robotId}/revisions/{number}": {
      get: {
        operationId: "getRobotRevision",
        summary: "One revision's definition, for build scripts that pin one",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot."), { name: "number", in: "path", required: true, description: "The revision number.", schema: { type: "integer", minimum: 1 } }],
        responses: { "200": { description: "The revision.", content: json(ref("RobotRevision")) }, ...errorsFor(400, ...AUTH, 404) },
        "x-permission": permission("robots.read"),
      },
    },
    "/api/v1/robots/{robotId}/calibration-profiles": {
      get: {
        operationId: "listCalibrationProfiles",
        summary: "The robot's calibration profiles (one per physical unit)",
        description: "Names to give as `profile=` when downloading a table; each profile's revision goes up with every save.",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: { "200": { description: "The profiles by name.", content: json(ref("CalibrationProfiles")) }, ...errorsFor(400, ...AUTH, 404) },
        "x-permission": permission("robots.read"),
      },
    },
    "/api/v1/robots/{robotId}/bench-table": {
      get: {
        operationId: "getBenchTable",
        summary: "A bring-up table: every servo centred, or a slow sweep of one joint",
        description:
          "Made from the robot's newest revision for a robot on a stand with its legs free. The sweep is checked for joint speed like any gait; error flags or clamped pulses need `override`. Audited like every download.",
        tags: ["Tables"],
        parameters: [uuidPath("robotId", "The robot."), ...queryParameters(benchQuerySchema), ifNoneMatch],
        responses: {
          "200": { description: "The table as a file.", headers: tableHeadersDoc, content: tableContent },
          ...etagResponses("The table is"),
          ...errorsFor(400, ...AUTH, 404, 409, 422),
        },
        "x-permission": permission("tables.download"),
      },
    },
    "/api/v1/schema/robot.json": {
      get: schemaOperation("getRobotSchema", "The robot definition's JSON Schema", "Robot"),
    },
    "/api/v1/schema/sequence.json": {
      get: schemaOperation("getSequenceSchema", "The gait sequence's JSON Schema", "Sequence"),
    },
    "/api/v1/schema/calibration.json": {
      get: schemaOperation("getCalibrationSchema", "The calibration profile's JSON Schema", "CalibrationProfile"),
    },
    "/api/v1/gaits/{gaitId}/versions": {
      get: {
        operationId: "listVersions",
        summary: "A gait's committed versions",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: { "200": { description: "The versions, newest first.", content: json(ref("VersionList")) }, ...errorsFor(400, ...AUTH, 404) },
        "x-permission": permission("gaits.read"),
      },
    },
    "/api/v1/gaits/{gaitId}/draft": {
      get: {
        operationId: "getDraft",
        summary: "The gait's working draft and its revision",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: { "200": { description: "The draft.", content: json(ref("Draft")) }, ...errorsFor(400, ...AUTH, 404) },
        "x-permission": permission("gaits.read"),
      },
      put: {
        operationId: "saveDraft",
        summary: "Save the working draft",
        description: "Refused with 409 when someone saved since `baseRevision`, and with 422 (issues in details) when the sequence is invalid or does not fit the robot; nothing is saved on either refusal.",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        requestBody: { required: true, content: json({ ...draftSaveSchema, properties: { ...draftSave.properties, sequence: ref("Sequence") } }) },
        responses: { "200": { description: "The new draft revision.", content: json(ref("DraftSaved")) }, ...errorsFor(400, ...AUTH, 404, 409, 413, 422) },
        "x-permission": permission("gaits.edit"),
      },
    },
    "/api/v1/gaits/{gaitId}/versions/{number}/table": {
      get: {
        operationId: "getAngleTable",
        summary: "A version's per-frame joint-angle table, for firmware",
        description: [
          "One row per frame, one column per joint in servo-channel order, as CSV, JSON or a C header, in degrees, radians or pulse widths.",
          "The version's sequence is solved with the robot revision it pins; another `rate` solves it again at that rate (never an interpolation).",
          "A `profile` applies a calibration profile of the robot and is named, with its revision, in the header.",
          "A version with error flags, or pulses clamped to the servo range, is exported only with an `override` reason (409 without it), written into the header.",
          `Tables are reproducible byte for byte; a release stores the SHA-256 of its canonical table (format=${RELEASE_TABLE.format}&units=${RELEASE_TABLE.units}) with the solver and exporter versions.`,
          "Every download (not a 304) is recorded in the workspace's audit log.",
        ].join(" "),
        tags: ["Tables"],
        parameters: [
          uuidPath("gaitId", "The gait."),
          {
            name: "number",
            in: "path",
            required: true,
            description: "The version number, or `released` for the gait's released version.",
            schema: { anyOf: [{ type: "string", pattern: "^[1-9][0-9]{0,8}$" }, { const: "released" }] },
          },
          ...queryParameters(tableQuerySchema),
          ifNoneMatch,
        ],
        responses: {
          "200": { description: "The table as a file.", headers: tableHeadersDoc, content: tableContent },
          ...etagResponses("The table is"),
          ...errorsFor(400, ...AUTH, 404, 409, 422),
        },
        "x-permission": permission("tables.download"),
      },
    },
    "/api/v1/openapi.json": {
      get: {
        operationId: "getOpenApi",
        summary: "This document",
        tags: ["Schemas"],
        security: PUBLIC,
        responses: { "200": { description: "OpenAPI 3.1.", content: json({ type: "object" }) }, ...etagResponses("The document is") },
        "x-permission": permission("public"),
      },
    },
  };

  return {
    openapi: "3.1.0",
    jsonSchemaDialect: "https://json-schema.org/draft/2020-12/schema",
    info: {
      title: "Gaitloom API",
      version: "1",
      summary: "Robots, gaits, the solver and firmware angle tables of a Gaitloom workspace.",
      description: [
        "Send `Authorization: Bearer <token>` (Settings → API tokens; owner, lead and firmware may hold one, and it acts with the holder's role in one workspace), or use the browser session.",
        "Requests carrying a session cookie that change something must come from the app's own origin; bearer-token requests need no Origin.",
        `A token may make ${config().tokenRequestsPerMinute} requests a minute; more answer 429.`,
        "Every refusal is JSON `{ error: { code, message, details? } }`. Millimetres and degrees at every interface.",
        "Angle tables drive real motors: test with the robot on a stand and its legs free, with a current-limited supply and a power cut-off within reach.",
      ].join(" "),
      "x-exporter-version": EXPORTER_VERSION,
      "x-solver-version": SOLVER_VERSION,
    },
    servers: [{ url: publicUrl }],
    security: [{ bearerToken: [] }, { sessionCookie: [] }],
    tags: [
      { name: "Account", description: "Who the caller is." },
      { name: "Solver", description: "The gait engine, stateless." },
      { name: "Robots", description: "Robot definitions, revisions and calibration profiles." },
      { name: "Gaits", description: "Gaits, their working drafts and versions." },
      { name: "Tables", description: "Firmware angle tables and bring-up tables." },
      { name: "Schemas", description: "Public JSON Schemas and this document." },
    ],
    paths,
    components: {
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", description: "A personal API token from Settings → API tokens." },
        sessionCookie: { type: "apiKey", in: "cookie", name: "gaitloom_session", description: "The browser session of the app." },
      },
      schemas: {
        Robot: embedded(robotJsonSchema(), schemaUrl("robot.json")),
        Sequence: embedded(sequenceJsonSchema(), schemaUrl("sequence.json")),
        CalibrationProfile: embedded(calibrationProfileJsonSchema(), schemaUrl("calibration.json")),
        ...writtenSchemas(),
      },
      responses,
    },
  };
}

// ---------------------------------------------------------------------------
// Serving

export type PublicDocument = { body: string; etag: string; value: unknown };

function publicDocument(value: unknown): PublicDocument {
  const body = `${JSON.stringify(value, null, 2)}\n`;
  return { body, etag: `"${createHashHex(body).slice(0, 32)}"`, value };
}

const createHashHex = (text: string) => createHash("sha256").update(text).digest("hex");

let cachedOpenApi: PublicDocument | undefined;
let cachedSequence: PublicDocument | undefined;
let cachedCalibration: PublicDocument | undefined;

/** The OpenAPI document for this server's public address. */
export function openApiDocument(): OpenApiDocument {
  return openApiPublicDocument().value as OpenApiDocument;
}

export function openApiPublicDocument(): PublicDocument {
  cachedOpenApi ??= publicDocument(buildDocument(config().publicUrl));
  return cachedOpenApi;
}

export function sequenceSchemaDocument(): PublicDocument {
  cachedSequence ??= publicDocument({ $id: `${config().publicUrl}/api/v1/schema/sequence.json`, ...sequenceJsonSchema() });
  return cachedSequence;
}

export function calibrationSchemaDocument(): PublicDocument {
  cachedCalibration ??= publicDocument({ $id: `${config().publicUrl}/api/v1/schema/calibration.json`, ...calibrationProfileJsonSchema() });
  return cachedCalibration;
}

/** A public JSON document with a strong ETag and 304 on If-None-Match, cacheable by anyone. */
export function servePublicDocument(request: Request, document: PublicDocument, contentType: string): Response {
  const headers = {
    "Content-Type": contentType,
    "Cache-Control": "public, max-age=3600",
    ETag: document.etag,
    "Access-Control-Allow-Origin": "*",
  };
  if (matchesIfNoneMatch(request.headers.get("If-None-Match"), document.etag)) return new Response(null, { status: 304, headers });
  return new Response(document.body, { headers });
}
