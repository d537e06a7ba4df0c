// Harmless malformed input to the JSON API gets a 4xx in the API's error
// shape that names the parameter or path, never a server error: numbers in
// query strings are decimal numbers only, and a NUL character (which
// PostgreSQL cannot store) in a JSON body is refused by its path.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, outcome, requestsAs, type ApiRefusal, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import * as benchTable from "~/routes/api.v1/export/bench-table";
import * as table from "~/routes/api.v1/export/table";
import * as draft from "~/routes/api.v1/gaits/draft";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function getAs(path: string, module: { loader: (args: never) => unknown }, params: Record<string, string>) {
  const request = await (await requestsAs("owner", ids))("GET", path);
  return outcome<ApiRefusal>(async () => load(module, request, params));
}

const tableOf = (query: string) => {
  const gaitId = ids.gaitIds["Tripod cruise"];
  return getAs(`/api/v1/gaits/${gaitId}/versions/1/table?${query}`, table, { gaitId, number: "1" });
};

const benchOf = (query: string) => {
  const robotId = ids.robotIds["Pier crawler"];
  return getAs(`/api/v1/robots/${robotId}/bench-table?${query}`, benchTable, { robotId });
};

describe("numbers in query strings are decimal numbers (no 0x, 0b, 0o prefixes, no spaces)", () => {
  test.each(["rate=0x10", "rate=0b10000", "rate=0o20", "rate=%2016", "rate=16%20", "rate=Infinity"])(
    "the table refuses %s with 400 naming rate",
    async (query) => {
      const answer = await tableOf(query);
      expect(answer.status, JSON.stringify(answer.body).slice(0, 300)).toBe(400);
      expect(answer.body.error).toMatchObject({ code: "bad_request", details: { parameter: "rate" } });
    },
  );

  test.each(["rate=16", "rate=12.5", "rate=2.5e1"])("the table takes %s", async (query) => {
    expect((await tableOf(query)).status).toBe(200);
  });

  test.each([
    ["fps=0x32", "fps"],
    ["seconds=0b10", "seconds"],
    ["dwell=%20500", "dwell"],
    ["kind=sweep&leg=LF&joint=femur&speed=0x1", "speed"],
  ])("the bench table refuses %s with 400 naming the parameter", async (query, parameter) => {
    const answer = await benchOf(query);
    expect(answer.status, JSON.stringify(answer.body).slice(0, 300)).toBe(400);
    expect(answer.body.error).toMatchObject({ code: "bad_request", details: { parameter } });
  });

  test("the bench table takes fps=50&seconds=0.5", async () => {
    expect((await benchOf("fps=50&seconds=0.5")).status).toBe(200);
  });
});

describe("a NUL character in a JSON body is refused with 400 naming its path", () => {
  test("PUT /api/v1/gaits/:gaitId/draft with a sequence name holding U+0000", async () => {
    const gaitId = ids.gaitIds["Wave creep"];
    const current = await getAs(`/api/v1/gaits/${gaitId}/draft`, draft, { gaitId });
    const { sequence, revision } = current.body as unknown as { sequence: Record<string, unknown>; revision: number };
    const request = await (
      await requestsAs("owner", ids)
    )("PUT", `/api/v1/gaits/${gaitId}/draft`, {
      json: { sequence: { ...sequence, name: "Wave\u0000creep" }, baseRevision: revision },
    });
    const answer = await outcome<ApiRefusal>(async () => act(draft, request, { gaitId }));
    expect(answer.status, JSON.stringify(answer.body).slice(0, 300)).toBe(400);
    expect(answer.body.error.code).toBe("bad_request");
    expect(answer.body.error.message).toContain("sequence.name");
    expect(answer.body.error.message).toMatch(/NUL/);
  });
});
