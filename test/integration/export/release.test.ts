// Release reproducibility: recordReleaseTable builds the canonical table
// inside the release's transaction and stores its SHA-256 with the solver and
// exporter versions; the same table fetched again through the API has that
// very hash. (The release transition itself calls recordReleaseTable; here it
// is called directly.)
import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, test } from "vitest";
import { releases, reviewEvents } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { bearer, demoIds, loaderData, requestsAs, type DemoIds } from "../../support/routes";
import { EXPORTER_VERSION } from "~/export";
import { database } from "~/platform/db.server";
import { ServiceError } from "~/platform/errors.server";
import { resetRateLimits } from "~/platform/rate-limit.server";
import { SOLVER_VERSION } from "~/gait";
import { RELEASE_TABLE } from "~/features/tables/query";
import { recordReleaseTable } from "~/features/tables/releases.server";
import * as exportPage from "~/routes/export/page";
import { getTable, sha256, storedVersion, tablePath, tokenFor } from "./support";

let ids: DemoIds;
let token: string;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  token = await tokenFor(ids.workspaceId, ids.userIds.firmware);
});
beforeEach(() => resetRateLimits());

describe("recordReleaseTable", () => {
  test("Tripod cruise v1: the stored SHA-256 is the hash of the table the API serves again", async () => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    const version = await storedVersion(gaitId, 1);
    const record = await database().transaction((tx) => recordReleaseTable(tx, { versionId: version.id, releasedById: ids.userIds.lead }));
    expect(record).toMatchObject({
      versionId: version.id,
      tableFormat: `format=${RELEASE_TABLE.format}&units=${RELEASE_TABLE.units}`,
      solverVersion: SOLVER_VERSION,
      exporterVersion: EXPORTER_VERSION,
    });
    expect(record.tableSha256).toMatch(/^[0-9a-f]{64}$/);
    const [stored] = await database().select().from(releases).where(eq(releases.id, record.id));
    expect(stored.releasedById).toBe(ids.userIds.lead);

    const again = await getTable(bearer(tablePath(gaitId, "released", stored.tableFormat), token), gaitId, "released");
    expect(again.status).toBe(200);
    expect(sha256(again.text)).toBe(stored.tableSha256);
    expect(again.headers.get("Repr-Digest")).toBe(`sha-256=:${Buffer.from(stored.tableSha256, "hex").toString("base64")}:`);
    // The canonical table is degrees as CSV at the sequence's own rate (50 Hz).
    expect(again.headers.get("Content-Disposition")).toBe('attachment; filename="tripod_cruise_v1_deg10_50hz_no-profile.csv"');
  });

  test("inside a transaction that rolls back, nothing is stored", async () => {
    const version = await storedVersion(ids.gaitIds["Trot"], 2);
    await expect(
      database().transaction(async (tx) => {
        await recordReleaseTable(tx, { versionId: version.id, releasedById: ids.userIds.lead });
        throw new Error("the release failed after the table was recorded");
      }),
    ).rejects.toThrow(/release failed/);
    expect(await database().select().from(releases).where(eq(releases.versionId, version.id))).toEqual([]);
  });

  test("a version with error flags and no override reason anywhere: the release is refused (409)", async () => {
    const version = await storedVersion(ids.gaitIds["Crawl"], 2);
    const error = await database()
      .transaction((tx) => recordReleaseTable(tx, { versionId: version.id, releasedById: ids.userIds.lead }))
      .catch((thrown: unknown) => thrown);
    expect(error).toBeInstanceOf(ServiceError);
    expect((error as ServiceError).status).toBe(409);
    expect((error as ServiceError).message).toMatch(/error flags and no override reason/);
  });

  test("with errors, the approval's override reason goes into the table and its query; the API reproduces the hash", async () => {
    const gaitId = ids.gaitIds["Crawl"];
    const version = await storedVersion(gaitId, 1);
    const reason = "Approved over com-outside: the crawl is played on the stand only";
    await database()
      .insert(reviewEvents)
      .values({ versionId: version.id, actorId: ids.userIds.lead, fromState: "in-review", toState: "approved", overrideReason: reason });
    const record = await database().transaction((tx) => recordReleaseTable(tx, { versionId: version.id, releasedById: ids.userIds.lead }));
    expect(record.tableFormat).toBe(`format=csv&units=deg&override=${new URLSearchParams({ o: reason }).toString().slice(2)}`);
    const again = await getTable(bearer(tablePath(gaitId, 1, record.tableFormat), token), gaitId, 1);
    expect(again.status).toBe(200);
    expect(sha256(again.text)).toBe(record.tableSha256);
    expect(decodeURIComponent(again.headers.get("Gaitloom-Override")!)).toBe(reason);
  });

  test("an override reason given by the caller wins over the review history", async () => {
    const version = await storedVersion(ids.gaitIds["Crawl"], 2);
    const record = await database().transaction((tx) =>
      recordReleaseTable(tx, { versionId: version.id, releasedById: null, overrideReason: "Released for the stand rig" }),
    );
    expect(new URLSearchParams(record.tableFormat).get("override")).toBe("Released for the stand rig");
  });

  test("an unknown version: 404", async () => {
    const error = await database()
      .transaction((tx) => recordReleaseTable(tx, { versionId: "00000000-0000-4000-8000-000000000000", releasedById: null }))
      .catch((thrown: unknown) => thrown);
    expect((error as ServiceError).status).toBe(404);
  });
});

describe("the export page shows the release record", () => {
  test("the released table in the canonical query matches it byte for byte", async () => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    const request = await requestsAs("firmware", ids);
    const page = await loaderData(exportPage, await request("GET", `/export?gait=${gaitId}&version=released&format=csv&units=deg`));
    expect(page.release).toMatchObject({ matches: true, tableFormat: "format=csv&units=deg" });
    const other = await loaderData(exportPage, await request("GET", `/export?gait=${gaitId}&version=released&format=json&units=us`));
    expect(other.release?.matches).toBe(null);
    expect(other.release?.path).toBe(`/api/v1/gaits/${gaitId}/versions/1/table?format=csv&units=deg`);
  });

  test("a released version from before records were kept shows none", async () => {
    const released = await storedVersion(ids.gaitIds["Wave climb"], 1);
    await database().delete(releases).where(eq(releases.versionId, released.id));
    const request = await requestsAs("firmware", ids);
    const page = await loaderData(exportPage, await request("GET", `/export?gait=${ids.gaitIds["Wave climb"]}`));
    expect(page.version).toBe("released");
    expect(page.release).toBe(null);
  });
});
