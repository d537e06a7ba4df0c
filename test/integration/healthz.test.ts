import { describe, expect, test } from "vitest";
import { loader } from "~/routes/healthz";

describe("GET /healthz", () => {
  test("answers ok with the database reachable", async () => {
    const response = await loader();
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toMatchObject({ ok: true, service: "gaitloom", database: { ok: true } });
    expect(body.database.latencyMs).toBeGreaterThanOrEqual(0);
  });
});
