// The shapes of the OpenAPI document and the pieces every operations file
// builds with: references, error answers, permissions, path parameters, ETags.
import { z } from "zod";
import type { ApiErrorCode } from "../../../platform/errors";
import { PERMISSIONS, type Action, type Requirement } from "../../../platform/permissions";

export type Json = Record<string, unknown>;

export type OpenApiParameter = { name: string; in: "path" | "query" | "header"; required: boolean; description?: string; schema: Json };
export type OpenApiResponse = {
  description: string;
  headers?: Record<string, { description: string; schema: Json }>;
  content?: Record<string, { schema: Json }>;
};
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
type Method = "get" | "put" | "post" | "delete";
/** An operation as an operations file describes it: the document adds `x-permission` from the route module's own declaration. */
export type OperationDescription = Omit<OpenApiOperation, "x-permission">;
export type OpenApiPaths = Record<string, Partial<Record<Method, OperationDescription>>>;
export type OpenApiDocument = {
  openapi: "3.1.0";
  jsonSchemaDialect: string;
  info: Json;
  servers: { url: string; description?: string }[];
  security: Record<string, string[]>[];
  tags: { name: string; description: string }[];
  paths: Record<string, Partial<Record<Method, OpenApiOperation>>>;
  components: { securitySchemes: Json; schemas: Record<string, Json>; responses: Record<string, OpenApiResponse> };
};

/** An id, as every uuid column is written. */
export const uuid = { type: "string", format: "uuid" };

/** A moment, as every timestamp is written. */
export const dateTime = { type: "string", format: "date-time" };

/** A list of objects with these properties. */
export const listOf = (properties: Json) => ({ type: "array", items: { type: "object", properties } });

export const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
export const json = (schema: Json) => ({ "application/json": { schema } });

/** A JSON Schema generated elsewhere, made a resource of its own ($id) so its local `#/$defs` refs resolve inside it. */
export function embedded(schema: Json, id: string): Json {
  const { $schema: _dialect, ...rest } = schema;
  return { $id: id, ...rest };
}

/** A zod object's JSON Schema (input side: defaults make parameters optional) as OpenAPI query parameters. */
export function queryParameters(schema: z.ZodType): OpenApiParameter[] {
  const generated = z.toJSONSchema(schema, { io: "input", target: "draft-2020-12" }) as { properties?: Record<string, Json>; required?: string[] };
  return Object.entries(generated.properties ?? {}).map(([name, property]) => {
    const { description, ...rest } = property;
    return {
      name,
      in: "query",
      required: (generated.required ?? []).includes(name),
      ...(typeof description === "string" ? { description } : {}),
      schema: rest,
    };
  });
}

const ERROR_CODES: ApiErrorCode[] = [
  "bad_request",
  "unauthorized",
  "forbidden",
  "not_found",
  "conflict",
  "method_not_allowed",
  "payload_too_large",
  "unsupported_media_type",
  "invalid",
  "rate_limited",
  "internal_error",
  "unavailable",
];

const STATUS_RESPONSES = {
  400: ["BadRequest", "The request is malformed: a parameter or the JSON body; `details.parameter` names a bad query parameter."],
  401: ["Unauthorized", "No session and no bearer token, a malformed Authorization header, or an unknown, revoked or expired token (the message says which)."],
  403: ["Forbidden", "The role cannot do this (the message says which), or a cookie-carrying mutation from another origin."],
  404: ["NotFound", "Nothing by that id in the caller's workspace (another workspace's things are not found either)."],
  409: [
    "Conflict",
    "A conflict with the current state: a stale revision, a table that needs an override reason, or a delete refused while the object is not archived or something still references it (`details.reason`, and `details.references` lists what).",
  ],
  413: ["PayloadTooLarge", "The body is larger than the route's limit (the message gives both sizes)."],
  422: [
    "Unprocessable",
    "The input is well-formed but invalid: `details` lists the issues as `{ path, message }`; a robot definition's issues also give `field`, the field's name in words, which the message starts with.",
  ],
  429: [
    "TooManyRequests",
    "Too many requests in a minute with this token or this person's session, or too many unknown or revoked tokens from this address; the Retry-After header says when to try again.",
  ],
  503: [
    "ServiceUnavailable",
    "The workers that solve and print tables are busy: the request would wait for one longer than the server allows (`details.reason` busy). The Retry-After header says when to try again.",
  ],
} as const;

type Status = keyof typeof STATUS_RESPONSES;

export const errorsFor = (...statuses: Status[]) =>
  Object.fromEntries(statuses.map((status) => [String(status), { $ref: `#/components/responses/${STATUS_RESPONSES[status][0]}` }]));

/** The statuses every authenticated route may answer. */
export const AUTH: Status[] = [401, 403, 429];

/** The refusals of a read of one thing its path names by id: a malformed id, access, no such thing. */
export const BY_ID: Status[] = [400, ...AUTH, 404];

/** An operation's responses: one JSON document, the `schema` component, or the refusals `statuses` name. */
export const answers = (description: string, schema: string, ...statuses: Status[]) => ({
  "200": { description, content: json(ref(schema)) },
  ...errorsFor(...statuses),
});

/** The shared refusals that errorsFor refers to, each an Error body. */
export function errorResponses(): Record<string, OpenApiResponse> {
  const responses: Record<string, OpenApiResponse> = Object.fromEntries(
    Object.values(STATUS_RESPONSES).map(([name, description]) => [name, { description, content: json(ref("Error")) }]),
  );
  responses.TooManyRequests = {
    ...responses.TooManyRequests,
    headers: { "Retry-After": { description: "Seconds until the minute's count starts again.", schema: { type: "integer" } } },
  };
  responses.ServiceUnavailable = {
    ...responses.ServiceUnavailable,
    headers: { "Retry-After": { description: "Seconds until the queue is expected to have room.", schema: { type: "integer" } } },
  };
  return responses;
}

export function errorSchemas(): Record<string, Json> {
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
  };
}

export const PUBLIC = [] as Record<string, string[]>[];

/** An operation's x-permission from what its route module declares; `where` names the operation when there is nothing an API route can declare. */
export function permission(requirement: Requirement | undefined, where: string): OpenApiOperation["x-permission"] {
  if (requirement === undefined || requirement === "signed-in") {
    throw new Error(`${where}: an /api/v1 route is public or needs a permission, and its route module must say which (got ${requirement ?? "nothing"})`);
  }
  return { action: requirement, roles: requirement === "public" ? ["anyone"] : [...PERMISSIONS[requirement]] };
}

export const uuidPath = (name: string, what: string): OpenApiParameter => ({
  name,
  in: "path",
  required: true,
  description: what,
  schema: uuid,
});

export const etagResponses = (description: string) => ({
  "304": {
    description: `${description} unchanged: the If-None-Match tag matches.`,
    headers: { ETag: { description: "The representation's tag.", schema: { type: "string" } } },
  },
});

export const ifNoneMatch: OpenApiParameter = {
  name: "If-None-Match",
  in: "header",
  required: false,
  description: "An ETag from an earlier answer: 304 without a body when it still matches.",
  schema: { type: "string" },
};

/** Who wrote or saved something, as the list answers name them. */
export const person = { type: ["object", "null"], properties: { login: { type: "string" }, name: { type: "string" } } };
