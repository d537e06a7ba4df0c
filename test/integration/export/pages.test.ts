// The export and bring-up pages' loaders, and the bench-table API: defaults,
// the preview rows, the download link and build-script command, the problems
// shown (override, bad query), and the bench tables' speed checks.
import { assert, beforeAll, beforeEach, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { bearer, demoIds, load, loaderData, requestsAs, responseOf, type ApiRefusal, type DemoIds } from "../../support/routes";
import type { JsonTable } from "../../support/tables";
import type { FlagKind } from "~/gait";
import { database } from "~/platform/db.server";
import { resetRateLimits } from "~/platform/rate-limit.server";
import * as benchTable from "~/routes/api.v1/export/bench-table";
import * as bringUp from "~/routes/export/bring-up";
import * as exportPage from "~/routes/export/page";
import { auditEntries, getTable, tokenFor } from "./support";

let ids: DemoIds;
let token: string;
let crawler: string;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  token = await tokenFor(ids.workspaceId, ids.userIds.firmware);
  crawler = ids.robotIds["Pier crawler"];
});
beforeEach(() => resetRateLimits());

async function page<Page extends typeof exportPage | typeof bringUp>(module: Page, path: string) {
  const request = await requestsAs("firmware", ids);
  return loaderData(module, await request("GET", path));
}

describe("/export", () => {
  test("opens on a gait with a released version, its released table, CSV in degrees", async () => {
    const data = await page(exportPage, "/export");
    assert.exists(data.gait, "the page's gait");
    assert.exists(data.table, "the page's table");
    assert.exists(data.download, "the page's download");
    expect(data.gait.releasedVersion).not.toBe(null);
    expect(data.version).toBe("released");
    expect(data.query).toMatchObject({ format: "csv", units: "deg", rate: null, profile: null, override: null });
    expect(data.problem).toBe(null);
    expect(data.table.preview.shownRows).toBe(data.table.facts.frameCount);
    expect(data.download.path).toBe(`/api/v1/gaits/${data.gait.id}/versions/released/table?format=csv&units=deg`);
    expect(data.download.command).toBe(
      `curl -fsS -H "Authorization: Bearer $GAITLOOM_TOKEN" -o '${data.download.fileName}' 'http://127.0.0.1:3000${data.download.path}'`,
    );
    // Looking at the page is not a download.
    expect((await auditEntries("table.downloaded", 1)).length).toBe(0);
  });

  test("the preview holds the file's numbers, and the download link gives that file", async () => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    const data = await page(exportPage, `/export?gait=${gaitId}&version=2&units=us&rate=25`);
    assert.exists(data.table, "the page's table");
    assert.exists(data.download, "the page's download");
    expect(data.table.facts).toMatchObject({ rateHz: 25, frameCount: 25, units: "us" });
    const file = await getTable(bearer(data.download.path, token), gaitId, 2);
    const records = file.text.split("\r\n").filter((line) => !line.startsWith("#"));
    expect(records[1].split(",").slice(2).map(Number)).toEqual(data.table.preview.values.slice(0, data.table.facts.channelCount));
    expect(data.table.facts.sha256).toBeTruthy();
  });

  test("a version with errors: the page asks for the override reason, then shows the table with it", async () => {
    const gaitId = ids.gaitIds["Crawl"];
    const refused = await page(exportPage, `/export?gait=${gaitId}&version=1`);
    expect(refused.problem).toMatchObject({ needsOverride: true, parameter: "override" });
    expect(refused.table).toBe(null);
    const given = await page(exportPage, `/export?gait=${gaitId}&version=1&override=${encodeURIComponent("bench only")}`);
    expect(given.problem).toBe(null);
    assert.exists(given.table, "the page's table");
    assert.exists(given.download, "the page's download");
    expect(given.table.facts.overrideReason).toBe("bench only");
    expect(given.download.path).toContain("override=bench+only");
  });

  test("a bad rate is shown as a problem naming it; empty fields are ignored", async () => {
    const data = await page(exportPage, `/export?gait=${ids.gaitIds["Trot"]}&rate=abc&profile=&override=`);
    expect(data.problem).toMatchObject({ parameter: "rate" });
    const fine = await page(exportPage, `/export?gait=${ids.gaitIds["Trot"]}&rate=&profile=&override=`);
    expect(fine.problem).toBe(null);
    assert.exists(fine.gait, "the page's gait");
    expect(fine.gait.name).toBe("Trot");
  });

  test("a gait without a released version opens at its newest", async () => {
    const data = await page(exportPage, `/export?gait=${ids.gaitIds["Wave creep"]}`);
    expect(data.version).toBe(2);
  });
});

describe("bench tables", () => {
  const get = <Answer = unknown>(query: string) =>
    responseOf<Answer>(() => load(benchTable, bearer(`/api/v1/robots/${crawler}/bench-table?${query}`, token), { robotId: crawler }));

  test("centre: every pulse at its servo's centerUs, held for 2 s at 50 Hz", async () => {
    const answer = await get<JsonTable>("kind=centre&format=json&units=us");
    expect(answer.status).toBe(200);
    expect(answer.headers.get("Content-Disposition")).toBe('attachment; filename="pier_crawler_centre_vbench_us_50hz_no-profile.json"');
    expect(answer.body.meta.frameCount).toBe(100);
    for (const frame of [answer.body.frames[0], answer.body.frames[99]]) {
      frame.values.forEach((us, column) => expect(us).toBe(answer.body.channels[column].centerUs));
    }
    const [entry] = await auditEntries("bench-table.downloaded", 1);
    expect(entry.details).toMatchObject({ table: "centre", format: "json", units: "us", via: "token" });
  });

  test("a slow sweep passes its speed check; one at twice the joint's limit needs an override (joint-speed errors)", async () => {
    const slow = await get<JsonTable>("kind=sweep&leg=LF&joint=femur&speed=0.25&format=json");
    expect(slow.status).toBe(200);
    expect(slow.body.meta.flags.errors).toBe(0);
    const fast = await get<ApiRefusal<{ errorFlags: Partial<Record<FlagKind, number>> }>>("kind=sweep&leg=LF&joint=femur&speed=2&format=json");
    expect(fast.status).toBe(409);
    expect(fast.body.error.details?.errorFlags["joint-speed"]).toBeGreaterThan(0);
    const overridden = await get<JsonTable>(`kind=sweep&leg=LF&joint=femur&speed=2&format=json&override=${encodeURIComponent("servo test at double speed")}`);
    expect(overridden.status).toBe(200);
    expect(overridden.body.meta.flags.byKind["joint-speed"]).toBeGreaterThan(0);
  });

  test("ETag and 304 as for gait tables", async () => {
    const first = await get("kind=sweep&leg=RM&joint=tibia");
    const again = await responseOf(() =>
      load(benchTable, bearer(`/api/v1/robots/${crawler}/bench-table?kind=sweep&leg=RM&joint=tibia`, token, { "If-None-Match": first.headers.get("ETag")! }), {
        robotId: crawler,
      }),
    );
    expect(again.status).toBe(304);
  });

  test.each([
    ["kind=sweep&joint=femur", "leg"],
    ["kind=sweep&leg=XX&joint=femur", "leg"],
    ["kind=sweep&leg=LF", "joint"],
    ["kind=spin", "kind"],
    ["fps=0", "fps"],
  ])("%s: 400 naming %s", async (query, parameter) => {
    const answer = await get<ApiRefusal>(query);
    expect(answer.status).toBe(400);
    expect(answer.body.error.details?.parameter).toBe(parameter);
  });

  test("the bring-up page shows the sweep's checks, its speed against the limit, and the download", async () => {
    const data = await page(bringUp, `/export/bring-up?robot=${crawler}&kind=sweep&leg=LF&joint=coxa&speed=1.5`);
    expect(data.problem).toMatchObject({ needsOverride: true });
    assert.exists(data.checks, "the sweep's checks");
    assert.exists(data.checks.limitDegS, "the joint's speed limit");
    expect(data.checks.totalFlags).toBeGreaterThan(0);
    expect(data.checks.flags[0].kind).toBe("joint-speed");
    expect(data.checks.peakSpeedDegS).toBeGreaterThan(data.checks.limitDegS);
    const slow = await page(bringUp, `/export/bring-up?robot=${crawler}&kind=sweep&leg=LF&joint=coxa`);
    expect(slow.problem).toBe(null);
    assert.exists(slow.checks, "the sweep's checks");
    assert.exists(slow.checks.limitDegS, "the joint's speed limit");
    assert.exists(slow.download, "the page's download");
    expect(slow.checks.peakSpeedDegS).toBeLessThanOrEqual(slow.checks.limitDegS * 0.25 + 1e-6);
    expect(slow.download.path).toBe(
      `/api/v1/robots/${crawler}/bench-table?kind=sweep&leg=LF&joint=coxa&speed=0.25&dwell=500&fps=50&hold=stance&format=csv&units=deg`,
    );
  });

  test("choosing a sweep without a leg starts at the first leg's coxa", async () => {
    const data = await page(bringUp, `/export/bring-up?robot=${crawler}&kind=sweep`);
    expect(data.query).toMatchObject({ kind: "sweep", leg: "LF", joint: "coxa" });
    assert.exists(data.table, "the page's table");
    expect(data.table.facts.gait.name).toBe("Pier crawler sweep-LF-coxa");
  });
});
