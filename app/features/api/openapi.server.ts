// The OpenAPI 3.1 description of every /api/v1 route, served at
// /api/v1/openapi.json and shown on the API page (/api-docs). Each feature
// describes its routes in operations/<feature>.ts; this file puts them
// together and serves the result. Request and response schemas come from the
// zod schemas where there are some (robot, sequence, calibration profile,
// table and bench-table queries, draft save); the rest are written beside
// their routes. Each operation's x-permission is what its route module
// declares (the openapi.json route and the API page pass those declarations in,
// by path: app/routes/api.v1/permissions.server.ts). test/features/api/openapi.test.ts
// checks that every /api/v1 route of app/routes.ts is described, so the two cannot drift apart.
import { createHash } from "node:crypto";
import { EXPORTER_VERSION, calibrationProfileJsonSchema } from "../../export/index";
import { SOLVER_VERSION, sequenceJsonSchema } from "../../gait/index";
import { config } from "../../platform/config.server";
import { requirementOf, type RoutePermissions } from "../../platform/permissions";
import { matchesIfNoneMatch } from "../tables/index.server";
import { accountPaths, accountSchemas } from "./operations/account";
import { calibrationPaths, calibrationSchemas } from "./operations/calibration";
import { errorResponses, errorSchemas, permission, type OpenApiDocument, type OpenApiOperation, type OpenApiPaths } from "./operations/common";
import { draftPaths, draftSchemas, gaitArchivePaths } from "./operations/gaits";
import { robotPaths, robotSchemas } from "./operations/robots";
import { documentPaths, generatedSchemas, schemaPaths } from "./operations/schemas";
import { solverPaths, solverSchemas } from "./operations/solver";
import { angleTablePaths, benchTablePaths, tableSchemas } from "./operations/tables";
import { versionPaths, versionSchemas } from "./operations/versions";

export type { OpenApiDocument, OpenApiOperation, OpenApiParameter, OpenApiResponse } from "./operations/common";

/** What each /api/v1 route module declares it needs, by the route's path as the document writes it (`/api/v1/robots/{robotId}`). */
export type ApiPermissions = Record<string, RoutePermissions>;

/** Each operation with its x-permission: a GET is its route's loader, any other method its action. */
function withPermissions(paths: OpenApiPaths, permissions: ApiPermissions): OpenApiDocument["paths"] {
  return Object.fromEntries(
    Object.entries(paths).map(([path, methods]) => [
      path,
      Object.fromEntries(
        Object.entries(methods).map(([method, operation]): [string, OpenApiOperation] => {
          const needs = requirementOf(permissions[path], method === "get" ? "loader" : "action");
          return [method, { ...operation, "x-permission": permission(needs, `${method.toUpperCase()} ${path}`) }];
        }),
      ),
    ]),
  );
}

function rateLimitText(limits: ReturnType<typeof config>["rateLimits"]): string {
  return (
    `A token may make ${limits.tokenRequestsPerMinute} requests a minute and a person ${limits.sessionRequestsPerMinute} with the browser session, counted across all of the app's servers; more answer 429 with Retry-After. ` +
    `After ${limits.failedTokenAttemptsPerMinute} unknown or revoked tokens from one address in a minute, token requests from that address answer 429 until the minute is over.`
  );
}

function buildDocument(publicUrl: string, permissions: ApiPermissions): OpenApiDocument {
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
        rateLimitText(config().rateLimits),
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
    // Paths and schemas keep the order the document has always had: a new order
    // would be new bytes, a new ETag and a changed file for everyone who pins it.
    paths: withPermissions(
      {
        ...accountPaths(),
        ...solverPaths(),
        ...robotPaths(),
        ...calibrationPaths(),
        ...benchTablePaths(),
        ...schemaPaths(),
        ...versionPaths(),
        ...draftPaths(),
        ...gaitArchivePaths(),
        ...angleTablePaths(),
        ...documentPaths(),
      },
      permissions,
    ),
    components: {
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", description: "A personal API token from Settings → API tokens." },
        sessionCookie: { type: "apiKey", in: "cookie", name: "gaitloom_session", description: "The browser session of the app." },
      },
      schemas: {
        ...generatedSchemas(publicUrl),
        ...errorSchemas(),
        ...accountSchemas(),
        ...solverSchemas(),
        ...robotSchemas(),
        ...versionSchemas(),
        ...draftSchemas(),
        ...tableSchemas(),
        ...calibrationSchemas(),
      },
      responses: errorResponses(),
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
export function openApiDocument(permissions: ApiPermissions): OpenApiDocument {
  return openApiPublicDocument(permissions).value as OpenApiDocument;
}

export function openApiPublicDocument(permissions: ApiPermissions): PublicDocument {
  cachedOpenApi ??= publicDocument(buildDocument(config().publicUrl, permissions));
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
