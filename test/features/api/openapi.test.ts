// The OpenAPI document against the route table: every /api/v1 route of
// app/routes.ts is described (with a write operation where the module has an
// action), every reference resolves, every path parameter is declared, and the
// generated schemas are the zod schemas' own. OpenAPI 3.1 (spec.openapis.org/oas/v3.1.0).
// Then the public documents as their routes serve them (servePublicDocument):
// /api/v1/openapi.json, /api/v1/schema/sequence.json and
// /api/v1/schema/calibration.json — no sign-in, a strong ETag, 304 on If-None-Match.
import { describe, expect, test } from "vitest";
import routeConfig from "~/routes";
import { calibrationProfileJsonSchema } from "~/export";
import { sequenceJsonSchema } from "~/gait";
import { robotJsonSchema } from "~/kinematics";
import { openApiDocument, type OpenApiOperation } from "~/features/api/openapi.server";
import { PERMISSIONS } from "~/platform/permissions";
import { apiPermissions } from "~/routes/api.v1/permissions.server";
import { loader as calibrationSchema } from "~/routes/api.v1/export/calibration-schema";
import { loader as openapi } from "~/routes/api.v1/export/openapi";
import { loader as sequenceSchema } from "~/routes/api.v1/export/sequence-schema";
import { isBounded, numberSchemas } from "../../support/numbers";

type ConfigEntry = { path?: string; file: string; children?: ConfigEntry[] };

/** Every route with its full path (the config's paths are already prefixed). */
function routesOf(entries: ConfigEntry[], parent = ""): { path: string; file: string }[] {
  return entries.flatMap((entry) => {
    const path = [parent, entry.path ?? ""].filter(Boolean).join("/");
    return [{ path, file: entry.file }, ...routesOf(entry.children ?? [], path)];
  });
}

// The splat under /api/v1 answers addresses that have no route: not an operation.
const apiRoutes = routesOf(routeConfig as ConfigEntry[]).filter((route) => route.path.startsWith("api/v1/") && !route.path.endsWith("*"));
const toOpenApiPath = (path: string) => `/${path.replace(/:([A-Za-z0-9_]+)/g, "{$1}")}`;
const document = openApiDocument(apiPermissions());
const operations = Object.entries(document.paths).flatMap(([path, methods]) =>
  Object.entries(methods).map(([method, operation]) => ({ path, method, operation: operation as OpenApiOperation })),
);

describe("every /api/v1 route of app/routes.ts is in the OpenAPI document", () => {
  test("the route table has /api/v1 routes to check", () => {
    expect(apiRoutes.length).toBeGreaterThanOrEqual(10);
  });

  test.each(apiRoutes.map((route) => [toOpenApiPath(route.path), route.file]))("%s (%s)", async (path, file) => {
    expect(Object.keys(document.paths), `${path} is routed to ${file} but not described in app/features/api/operations/`).toContain(path);
    const module = await import(/* @vite-ignore */ `../../../app/${file}`);
    const methods = Object.keys(document.paths[path]);
    if (typeof module.action === "function") {
      expect(
        methods.some((method) => method !== "get"),
        `${file} has an action; describe its POST/PUT/DELETE`,
      ).toBe(true);
    }
    if (typeof module.loader === "function" && typeof module.action !== "function") expect(methods).toContain("get");
  });

  test.each(apiRoutes.map((route) => [toOpenApiPath(route.path), route.file]))("%s takes its x-permission from %s's own declaration", async (path, file) => {
    const module = await import(/* @vite-ignore */ `../../../app/${file}`);
    expect(module.permissions, `${file} declares no permissions`).toBeDefined();
    expect(apiPermissions()[path], `app/routes/api.v1/permissions.server.ts gives ${path} another module's declaration than ${file}'s`).toBe(
      module.permissions,
    );
  });

  test("the declarations handed to the document are those of the routed paths, no more", () => {
    expect(Object.keys(apiPermissions()).sort()).toEqual(apiRoutes.map((route) => toOpenApiPath(route.path)).sort());
  });

  test("and nothing else is described", () => {
    const routed = new Set(apiRoutes.map((route) => toOpenApiPath(route.path)));
    const extra = Object.keys(document.paths).filter((path) => !routed.has(path));
    expect(extra, "described but not routed").toEqual([]);
  });
});

describe("the document holds together", () => {
  test("OpenAPI 3.1 with JSON Schema 2020-12, a server, bearer auth and the session", () => {
    expect(document.openapi).toBe("3.1.0");
    expect(document.jsonSchemaDialect).toBe("https://json-schema.org/draft/2020-12/schema");
    expect(document.servers[0].url).toBe("http://127.0.0.1:3000");
    expect(document.components.securitySchemes).toMatchObject({
      bearerToken: { type: "http", scheme: "bearer" },
      sessionCookie: { type: "apiKey", in: "cookie" },
    });
    expect(document.security).toEqual([{ bearerToken: [] }, { sessionCookie: [] }]);
  });

  test("operation ids are unique; every operation has a summary, a tag that exists, answers and a permission", () => {
    const ids = operations.map(({ operation }) => operation.operationId);
    expect(new Set(ids).size).toBe(ids.length);
    const tags = new Set(document.tags.map((tag) => tag.name));
    for (const { path, method, operation } of operations) {
      const label = `${method.toUpperCase()} ${path}`;
      expect(operation.summary, label).toBeTruthy();
      expect(
        operation.tags.every((tag) => tags.has(tag)),
        label,
      ).toBe(true);
      expect(
        Object.keys(operation.responses).some((status) => /^2/.test(status)),
        label,
      ).toBe(true);
      const { action, roles } = operation["x-permission"];
      if (action === "public") {
        expect(operation.security, `${label} is public, so it must say security: []`).toEqual([]);
      } else {
        expect(roles, label).toEqual([...PERMISSIONS[action]]);
        expect(Object.keys(operation.responses), `${label} needs a token or session: 401 and 403`).toEqual(expect.arrayContaining(["401", "403"]));
      }
    }
  });

  test("every path parameter is declared as a required path parameter", () => {
    for (const { path, method, operation } of operations) {
      const names = [...path.matchAll(/\{([^}]+)\}/g)].map((match) => match[1]);
      const declared = (operation.parameters ?? []).filter((parameter) => parameter.in === "path");
      expect(declared.map((parameter) => parameter.name).sort(), `${method} ${path}`).toEqual([...names].sort());
      expect(declared.every((parameter) => parameter.required)).toBe(true);
    }
  });

  test("every $ref points at something in the document (or inside its own schema resource)", () => {
    const refs: { ref: string; root: unknown }[] = [];
    const walk = (node: unknown, root: unknown) => {
      if (Array.isArray(node)) return node.forEach((child) => walk(child, root));
      if (!node || typeof node !== "object") return;
      const object = node as Record<string, unknown>;
      const scope = typeof object.$id === "string" ? object : root;
      if (typeof object.$ref === "string") refs.push({ ref: object.$ref, root: scope });
      for (const value of Object.values(object)) walk(value, scope);
    };
    walk(document, document);
    expect(refs.length).toBeGreaterThan(20);
    for (const { ref, root } of refs) {
      expect(ref.startsWith("#/"), ref).toBe(true);
      let target: unknown = root;
      for (const part of ref.slice(2).split("/")) target = (target as Record<string, unknown> | undefined)?.[part.replaceAll("~1", "/").replaceAll("~0", "~")];
      expect(target, `${ref} does not resolve`).toBeTruthy();
    }
  });

  test("the error shape and all nine error statuses are there", () => {
    expect(document.components.schemas.Error).toHaveProperty("properties.error.required", ["code", "message"]);
    const statuses = new Set(operations.flatMap(({ operation }) => Object.keys(operation.responses)));
    for (const status of ["400", "401", "403", "404", "409", "413", "422", "429", "503"]) expect(statuses, status).toContain(status);
  });
});

describe("schemas come from the zod schemas", () => {
  const withoutDialect = ({ $schema: _dialect, ...rest }: Record<string, unknown>) => rest;

  test.each([
    ["Robot", robotJsonSchema(), "robot.json"],
    ["Sequence", sequenceJsonSchema(), "sequence.json"],
    ["CalibrationProfile", calibrationProfileJsonSchema(), "calibration.json"],
  ])("%s is the generated JSON Schema, with the $id it is published under", (name, generated, file) => {
    expect(document.components.schemas[name]).toEqual({ $id: `http://127.0.0.1:3000/api/v1/schema/${file}`, ...withoutDialect(generated) });
  });

  test("the table route's query parameters are tableQuerySchema's, with their defaults and limits", () => {
    const table = document.paths["/api/v1/gaits/{gaitId}/versions/{number}/table"].get!;
    const query = Object.fromEntries((table.parameters ?? []).filter((parameter) => parameter.in === "query").map((parameter) => [parameter.name, parameter]));
    expect(Object.keys(query)).toEqual(["format", "units", "rate", "profile", "override"]);
    expect(query.format.schema).toEqual({ default: "csv", type: "string", enum: ["csv", "json", "c"] });
    expect(query.units.schema).toEqual({ default: "deg", type: "string", enum: ["deg", "rad", "us"] });
    expect(query.rate.schema).toEqual({ type: "number", exclusiveMinimum: 0, maximum: 1000 });
    expect(Object.values(query).every((parameter) => !parameter.required && parameter.description)).toBe(true);
    expect(Object.keys(table.responses).sort()).toEqual(["200", "304", "400", "401", "403", "404", "409", "422", "429", "503"]);
    const ok = table.responses["200"];
    expect(Object.keys("content" in ok ? (ok.content ?? {}) : {})).toEqual(["text/csv", "application/json", "text/x-c"]);
  });

  test("the draft PUT body is draftSaveBody's, its sequence the Sequence schema", () => {
    const body = document.paths["/api/v1/gaits/{gaitId}/draft"].put!.requestBody!.content["application/json"].schema;
    expect(body.required).toEqual(["sequence", "baseRevision"]);
    expect(body).toHaveProperty("properties.sequence", { $ref: "#/components/schemas/Sequence" });
    expect(body).toHaveProperty("properties.baseRevision.type", "integer");
  });
});

const get = (path: string, headers: Record<string, string> = {}) =>
  ({ request: new Request(`http://127.0.0.1:3000${path}`, { headers }), params: {}, context: {} }) as never;

describe.each([
  ["/api/v1/openapi.json", openapi, "application/json; charset=utf-8"],
  ["/api/v1/schema/sequence.json", sequenceSchema, "application/schema+json; charset=utf-8"],
  ["/api/v1/schema/calibration.json", calibrationSchema, "application/schema+json; charset=utf-8"],
] as const)("%s", (path, loader, type) => {
  test("answers JSON to anyone, cacheable, with an ETag; 304 when it matches", async () => {
    const answer = loader(get(path));
    expect(answer.status).toBe(200);
    expect(answer.headers.get("Content-Type")).toBe(type);
    expect(answer.headers.get("Cache-Control")).toBe("public, max-age=3600");
    const etag = answer.headers.get("ETag")!;
    expect(etag).toMatch(/^"[0-9a-f]{32}"$/);
    expect(() => JSON.parse("")).toThrow();
    JSON.parse(await answer.text());
    const again = loader(get(path, { "If-None-Match": etag }));
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
  });
});

describe("the schemas are the zod schemas'", () => {
  test("sequence.json is sequenceJsonSchema() with its $id", async () => {
    const body = await sequenceSchema(get("/api/v1/schema/sequence.json")).json();
    expect(body).toEqual({ $id: "http://127.0.0.1:3000/api/v1/schema/sequence.json", ...sequenceJsonSchema() });
  });

  test("calibration.json is calibrationProfileJsonSchema() with its $id", async () => {
    const body = await calibrationSchema(get("/api/v1/schema/calibration.json")).json();
    expect(body).toEqual({ $id: "http://127.0.0.1:3000/api/v1/schema/calibration.json", ...calibrationProfileJsonSchema() });
  });
});

describe("the published schemas say every number's physical range", () => {
  test.each([
    ["Robot", "robot.json"],
    ["Sequence", "sequence.json"],
  ])("every number of %s (%s) has a lower and an upper bound", (name) => {
    const found = numberSchemas(document.components.schemas[name]);
    expect(found.length).toBeGreaterThan(15);
    expect(found.filter(({ schema }) => !isBounded(schema)).map(({ pointer }) => pointer)).toEqual([]);
  });

  test("a leg's links are 1 to 2 000 mm; a sequence's stride ±10 000 mm, its feet ±20 000 mm", async () => {
    expect(document.components.schemas.Robot).toHaveProperty("properties.legs.items.properties.femur.maximum", 2000);
    expect(document.components.schemas.Robot).toHaveProperty("properties.legs.items.properties.tibia.minimum", 1);
    const served = numberSchemas(await sequenceSchema(get("/api/v1/schema/sequence.json")).json());
    const field = (ending: string) => served.filter(({ pointer }) => pointer.endsWith(ending)).map(({ schema }) => [schema.minimum, schema.maximum]);
    expect(field("/strideMm")).toEqual([[-10000, 10000]]);
    expect(field("/foot/prefixItems/0")).toEqual([[-20000, 20000]]);
  });
});
