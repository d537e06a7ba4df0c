import { count } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { gaitVersions, gaits, memberships, releases, reviewEvents, robotRevisions, robots, users, workspaces } from "../../db/schema";
import { seedDemo } from "../../db/seed";
import { demoGaits, demoPeople, demoRobots } from "../../db/demo/scenario";
import { database } from "~/platform/db.server";

async function counts() {
  const db = database();
  const tally = async (
    table:
      typeof users | typeof workspaces | typeof memberships | typeof robots | typeof robotRevisions | typeof gaits | typeof gaitVersions | typeof reviewEvents,
  ) => (await db.select({ n: count() }).from(table))[0].n;
  return {
    workspaces: await tally(workspaces),
    users: await tally(users),
    memberships: await tally(memberships),
    robots: await tally(robots),
    revisions: await tally(robotRevisions),
    gaits: await tally(gaits),
    versions: await tally(gaitVersions),
    reviewSteps: await tally(reviewEvents),
  };
}

describe("demo seed", () => {
  test("loads one workspace, one person per role, the three demo robots and their gaits with two or more versions each", async () => {
    await seedDemo(database());
    expect(await counts()).toMatchObject({
      workspaces: 1,
      users: demoPeople.length,
      memberships: demoPeople.length,
      robots: demoRobots.length,
      revisions: demoRobots.length,
      gaits: demoGaits.length,
      versions: demoGaits.reduce((n, gait) => n + gait.versions.length, 0),
    });
    expect(demoGaits.every((gait) => gait.versions.length >= 2)).toBe(true);
    const states = await database().select({ number: gaitVersions.number, state: gaitVersions.state, gaitId: gaitVersions.gaitId }).from(gaitVersions);
    const released = states.filter((row) => row.state === "released");
    expect(new Set(released.map((row) => row.gaitId)).size).toBe(released.length);
    expect(released.length).toBeGreaterThan(0);
    // Each demo release keeps the hash of the table it shipped.
    const records = await database().select().from(releases);
    expect(records).toHaveLength(released.length);
    expect(records.every((record) => /^[0-9a-f]{64}$/.test(record.tableSha256))).toBe(true);
    const roles = new Set(demoPeople.map((person) => person.role));
    expect([...roles].sort()).toEqual(["animator", "firmware", "lead", "owner", "viewer"]);
  });

  test("is idempotent: a second run adds and changes nothing", async () => {
    await seedDemo(database());
    const before = await counts();
    await seedDemo(database());
    expect(await counts()).toEqual(before);
  });
});
