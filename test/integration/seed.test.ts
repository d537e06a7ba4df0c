import { count } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { memberships, robotRevisions, robots, users, workspaces } from "../../db/schema";
import { seedDemo } from "../../db/seed";
import { demoPeople, demoRobots } from "../../db/demo/scenario";
import { database } from "~/lib/db.server";

async function counts() {
  const db = database();
  const tally = async (table: typeof users | typeof workspaces | typeof memberships | typeof robots | typeof robotRevisions) =>
    (await db.select({ n: count() }).from(table))[0].n;
  return {
    workspaces: await tally(workspaces),
    users: await tally(users),
    memberships: await tally(memberships),
    robots: await tally(robots),
    revisions: await tally(robotRevisions),
  };
}

describe("demo seed", () => {
  test("loads one workspace, one person per role and the three demo robots", async () => {
    await seedDemo(database());
    expect(await counts()).toEqual({
      workspaces: 1,
      users: demoPeople.length,
      memberships: demoPeople.length,
      robots: demoRobots.length,
      revisions: demoRobots.length,
    });
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
