// Issue 16, item 4: a released version's page says whether today's table is
// still the one its release recorded (DESIGN.md: "a version page says when
// today's table differs from its recorded hash"), and why not.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { releases } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { demoIds, loaderData, requestsAs, type DemoIds } from "../../support/routes";
import { EXPORTER_VERSION } from "~/export";
import { SOLVER_VERSION } from "~/gait";
import { database } from "~/platform/db.server";
import * as versionPage from "~/routes/gaits/version";
import { storedVersion } from "./support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function versionPageAs(role: "viewer" | "firmware", gait: string, number: number) {
  const gaitId = ids.gaitIds[gait];
  const request = await requestsAs(role, ids);
  return loaderData(versionPage, await request("GET", `/gaits/${gaitId}/versions/${number}`), { gaitId, number: String(number) });
}

describe("the version page's release table", () => {
  test("a released version whose table is still the recorded one says so", async () => {
    const page = await versionPageAs("viewer", "Tripod cruise", 1);
    expect(page.releaseTable).toMatchObject({
      matches: true,
      recorded: { exporterVersion: EXPORTER_VERSION, solverVersion: SOLVER_VERSION, tableFormat: "format=csv&units=deg" },
      today: { exporterVersion: EXPORTER_VERSION, solverVersion: SOLVER_VERSION },
      reasons: [],
    });
    expect(page.releaseTable?.today.sha256).toBe(page.releaseTable?.recorded.sha256);
  });

  test("a record made by an older exporter: differs, says the exporter changed, and offers today's and the recorded query", async () => {
    const version = await storedVersion(ids.gaitIds["Wave climb"], 1);
    await database()
      .update(releases)
      .set({ exporterVersion: "1.0.0", tableSha256: "0".repeat(64) })
      .where(eq(releases.versionId, version.id));
    const page = await versionPageAs("firmware", "Wave climb", 1);
    expect(page.releaseTable).toMatchObject({
      matches: false,
      recorded: { exporterVersion: "1.0.0", sha256: "0".repeat(64) },
      today: { exporterVersion: EXPORTER_VERSION },
      reasons: [`the exporter changed from 1.0.0 to ${EXPORTER_VERSION}`],
    });
    expect(page.releaseTable?.today.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(page.releaseTable?.downloadPath).toBe(`/api/v1/gaits/${ids.gaitIds["Wave climb"]}/versions/1/table?format=csv&units=deg`);
  });

  test("the same versions but other bytes: differs, with no version to blame", async () => {
    const version = await storedVersion(ids.gaitIds["Wave climb"], 1);
    await database()
      .update(releases)
      .set({ exporterVersion: EXPORTER_VERSION, solverVersion: SOLVER_VERSION, tableSha256: "f".repeat(64) })
      .where(eq(releases.versionId, version.id));
    const page = await versionPageAs("viewer", "Wave climb", 1);
    expect(page.releaseTable).toMatchObject({ matches: false, reasons: [] });
    expect(page.releaseTable?.downloadPath, "a viewer downloads no tables").toBe(null);
  });

  test("a version never released has no release table", async () => {
    const page = await versionPageAs("viewer", "Tripod cruise", 2);
    expect(page.releaseTable).toBe(null);
  });
});
