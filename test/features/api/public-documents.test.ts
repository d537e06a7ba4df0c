// The public documents: /api/v1/openapi.json, /api/v1/schema/sequence.json and
// /api/v1/schema/calibration.json — no sign-in, a strong ETag, 304 on If-None-Match.
import { describe, expect, test } from "vitest";
import { calibrationProfileJsonSchema } from "~/export";
import { sequenceJsonSchema } from "~/gait";
import { loader as calibrationSchema } from "~/routes/api.v1/export/calibration-schema";
import { loader as openapi } from "~/routes/api.v1/export/openapi";
import { loader as sequenceSchema } from "~/routes/api.v1/export/sequence-schema";

const get = (path: string, headers: Record<string, string> = {}) => ({ request: new Request(`http://127.0.0.1:3000${path}`, { headers }), params: {}, context: {} }) as never;

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
