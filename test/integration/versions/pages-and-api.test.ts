// The gait page's table (sorting, filtering), the gaits list by robot, the
// comparison page, and GET /api/v1/gaits/:gaitId/versions.
import { eq } from "drizzle-orm";
import { assert, beforeAll, describe, expect, test } from "vitest";
import { apiTokens, gaitVersions, gaits, robotRevisions, robots, workspaces } from "../../../db/schema";
import { uniqueName } from "../../support/names";
import { load, memberAs, outcome, requestsAs, type DemoIds, type LoaderData } from "../../support/routes";
import { robotOf } from "../../support/robots";
import type { VersionState } from "../../../db/schema";
import { hashToken, type Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import * as apiVersions from "~/routes/api.v1/gaits/versions";
import * as compare from "~/routes/gaits/compare";
import * as gaitPage from "~/routes/gaits/gait";
import * as gaitList from "~/routes/gaits/list";
import { setUp, versionIn } from "./support";

let ids: DemoIds;
let lead: Member;
let foreignGaitId: string;
const TOKEN = "gl_versions_test_token_0123456789";

beforeAll(async () => {
  ids = await setUp();
  lead = await memberAs("lead", ids);
  const db = database();
  const [other] = await db.insert(workspaces).values({ slug: "other-lab-versions", name: "Other lab" }).returning();
  const [robot] = await db.insert(robots).values({ workspaceId: other.id, name: "Their crawler" }).returning();
  const [mine] = await db.select().from(robotRevisions).where(eq(robotRevisions.robotId, ids.robotIds["Pier crawler"]));
  const [revision] = await db.insert(robotRevisions).values({ robotId: robot.id, number: 1, definition: mine.definition }).returning();
  const [gait] = await db.insert(gaits).values({ workspaceId: other.id, robotId: robot.id, name: "Their walk", draftRobotRevisionId: revision.id }).returning();
  foreignGaitId = gait.id;
  await db
    .insert(apiTokens)
    .values({ workspaceId: ids.workspaceId, userId: ids.userIds.firmware, name: "build script", tokenHash: hashToken(TOKEN), prefix: TOKEN.slice(0, 8) });
});

const gaitLoad = async (gaitName: string, query = "") => {
  const gaitId = ids.gaitIds[gaitName];
  const request = await requestsAs("viewer", ids);
  return outcome<LoaderData<typeof gaitPage>>(async () => load(gaitPage, await request("GET", `/gaits/${gaitId}${query}`), { gaitId }));
};

describe("the gait page", () => {
  test("lists every version newest first with message, author, date, status, flags and worst margin", async () => {
    const { status, body } = await gaitLoad("Tripod cruise");
    expect(status).toBe(200);
    expect(body.versions.map((row) => [row.number, row.state, row.author?.name])).toEqual([
      [2, "in-review", "Theo Brandt"],
      [1, "released", "Theo Brandt"],
    ]);
    expect(body.versions[0]).toMatchObject({
      message: "Longer, quicker steps for the open deck",
      errors: 0,
      worstMarginMm: expect.any(Number),
      createdAt: expect.any(Date),
    });
    expect(body.gait).toMatchObject({ name: "Tripod cruise", releasedVersion: 1, latestVersion: 2, draft: { hasSequence: true, sameAsVersion: 2 } });
  });

  test("sorts by the query string (oldest first; by worst margin) and filters by state, author, flags and message", async () => {
    await versionIn(ids, "Crawl", "committed", lead, { message: "Lead's sway experiment" });
    expect((await gaitLoad("Crawl", "?sort=number&dir=asc")).body.versions.map((row) => row.number)).toEqual([1, 2, 3]);
    const [lower, higher] = (await gaitLoad("Tripod cruise", "?sort=margin&dir=asc")).body.versions.map((row) => row.worstMarginMm);
    assert.exists(higher, "the second version's worst margin");
    expect(lower).toBeLessThanOrEqual(higher);
    expect((await gaitLoad("Crawl", "?state=sent-back")).body.versions.map((row) => row.number)).toEqual([1]);
    expect((await gaitLoad("Crawl", "?author=mara-lindqvist")).body.versions.map((row) => row.number)).toEqual([3]);
    expect((await gaitLoad("Crawl", "?q=BRISKER")).body.versions.map((row) => row.number)).toEqual([2]);
    expect((await gaitLoad("Crawl", "?flags=clean")).body.versions).toEqual([]);
    expect((await gaitLoad("Crawl", "?flags=errors")).body.versions).toHaveLength(3);
    // Nonsense in the query string falls back to the defaults rather than failing the page.
    const odd = await gaitLoad("Crawl", "?sort=colour&dir=sideways&state=lost");
    expect(odd.status).toBe(200);
    expect(odd.body.query).toMatchObject({ sort: "number", dir: "desc" });
    expect(odd.body.versions).toHaveLength(3);
  });

  test("answers 404 for a gait of another workspace", async () => {
    const request = await requestsAs("owner", ids);
    const answer = await outcome(async () => load(gaitPage, await request("GET", `/gaits/${foreignGaitId}`), { gaitId: foreignGaitId }));
    expect(answer.status).toBe(404);
  });
});

describe("the gaits list", () => {
  test("filters to one robot and gives each gait's newest and released version", async () => {
    const request = await requestsAs("viewer", ids);
    const { body } = await outcome<LoaderData<typeof gaitList>>(async () =>
      load(gaitList, await request("GET", `/gaits?robot=${ids.robotIds["Quay walker"]}`)),
    );
    expect(body.robot).toEqual({ id: ids.robotIds["Quay walker"], name: "Quay walker" });
    const rows = Object.fromEntries(body.gaits.map((gait) => [gait.name, gait]));
    expect(Object.keys(rows).sort()).toEqual(["Crawl", "Trot"]);
    expect(rows.Trot).toMatchObject({ latestVersion: 2, latestState: "in-review", releasedVersion: 1, inReview: 1 });
    expect(rows.Crawl).toMatchObject({ releasedVersion: null });
  });
});

describe("the comparison", () => {
  const compareLoad = async (a: string, b: string) => {
    const request = await requestsAs("viewer", ids);
    return outcome<LoaderData<typeof compare>>(async () => load(compare, await request("GET", `/gaits/compare?a=${a}&b=${b}`)));
  };
  const versionsOf = (gaitName: string) =>
    database().select().from(gaitVersions).where(eq(gaitVersions.gaitId, ids.gaitIds[gaitName])).orderBy(gaitVersions.number);

  test("of two versions of a gait: metric deltas, the key diff, joint overlays and playback from solving both with their pinned revision", async () => {
    const [first, second] = await versionsOf("Tripod cruise");
    const { status, body } = await compareLoad(first.id, second.id);
    expect(status).toBe(200);
    const { comparison } = body;
    assert.exists(comparison, "the comparison");
    expect(comparison.sameGait).toBe(true);
    const metrics = Object.fromEntries(comparison.metrics.map((row) => [row.id, row]));
    expect(metrics.cycleMs).toMatchObject({ a: 1200, b: 1000, delta: -200 });
    expect(metrics.strideMm.delta).toBeCloseTo(15, 6);
    expect(comparison.diff.counts).toMatchObject({ added: 0, removed: 0, changed: 12 });
    expect(comparison.diff.settings.map((change) => change.path)).toEqual(["cycleMs", "generator.strideMm", "generator.stepHeightMm"]);
    expect(comparison.overlays).toHaveLength(18);
    expect(comparison.overlays.some((overlay) => overlay.maxDifferenceDeg > 1)).toBe(true);
    expect(comparison.a.playback.frames).toHaveLength(60);
    expect(comparison.b.playback.frames).toHaveLength(50);
    expect(comparison.robotDiff).toBeNull();
  });

  test("of two gaits on one robot works; of two robots says why not; an unknown id is a 404", async () => {
    const [wave] = await versionsOf("Wave creep");
    const [tripod] = await versionsOf("Tripod cruise");
    const [trot] = await versionsOf("Trot");
    const sameRobot = await compareLoad(tripod.id, wave.id);
    expect(sameRobot.body.comparison?.sameGait).toBe(false);
    const otherRobot = await compareLoad(tripod.id, trot.id);
    expect(otherRobot.status).toBe(200);
    expect(otherRobot.body.comparison).toBeNull();
    expect(otherRobot.body.problem).toMatch(/different robots/);
    expect((await compareLoad(tripod.id, "00000000-0000-4000-8000-000000000000")).status).toBe(404);
  });

  test("names the robot fields that changed when A and B pin different revisions", async () => {
    const robotId = ids.robotIds["Pier crawler"];
    const [revision1] = await database().select().from(robotRevisions).where(eq(robotRevisions.robotId, robotId));
    const definition = robotOf(revision1.definition);
    definition.legs[0].femur += 4;
    const [revision2] = await database().insert(robotRevisions).values({ robotId, number: 2, definition, message: "Longer LF femur" }).returning();
    const gaitId = ids.gaitIds["Wave creep"];
    await database().update(gaits).set({ draftRobotRevisionId: revision2.id }).where(eq(gaits.id, gaitId));
    const newer = await versionIn(ids, "Wave creep", "committed", lead, { message: uniqueName("On revision 2") });
    const [first] = await versionsOf("Wave creep");
    const { body } = await compareLoad(first.id, newer.id);
    expect(body.comparison?.robotDiff).toMatchObject({
      a: 1,
      b: 2,
      changes: [{ path: "legs[0].femur", before: definition.legs[0].femur - 4, after: definition.legs[0].femur }],
    });
  });
});

describe("GET /api/v1/gaits/:gaitId/versions", () => {
  /** The answer as far as these tests read it. */
  type VersionsAnswer = { gait: unknown; versions: { number: number; state: VersionState }[] };
  const call = (gaitId: string, init?: RequestInit) =>
    outcome<VersionsAnswer>(() => load(apiVersions, new Request(`http://127.0.0.1:3000/api/v1/gaits/${gaitId}/versions`, init), { gaitId }));

  test("lists number, state, message, author, time, content hash and summary, newest first, with a bearer token", async () => {
    const { status, body } = await call(ids.gaitIds["Trot"], { headers: { Authorization: `Bearer ${TOKEN}` } });
    expect(status).toBe(200);
    expect(body.gait).toMatchObject({ id: ids.gaitIds["Trot"], name: "Trot", robotName: "Quay walker", releasedVersion: 1 });
    expect(body.versions.map((version) => [version.number, version.state])).toEqual([
      [2, "in-review"],
      [1, "released"],
    ]);
    expect(body.versions[1]).toMatchObject({
      message: "First trot",
      author: { login: "theo-brandt", name: "Theo Brandt" },
      createdAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
      contentHash: expect.stringMatching(/^[0-9a-f]{64}$/),
      summary: { cycleMs: 800, dynamic: true, flagsByKind: { "support-count": expect.any(Number) } },
    });
  });

  test("answers 404 JSON for another workspace's gait, 400 for a malformed id, 401 without credentials", async () => {
    const foreign = await call(foreignGaitId, { headers: { Authorization: `Bearer ${TOKEN}` } });
    expect(foreign).toMatchObject({ status: 404, body: { error: { code: "not_found" } } });
    expect((await call("not-a-uuid", { headers: { Authorization: `Bearer ${TOKEN}` } })).status).toBe(400);
    expect((await call(ids.gaitIds["Trot"])).status).toBe(401);
  });
});
