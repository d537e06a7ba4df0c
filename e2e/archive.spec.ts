// Archiving and deleting, as the roles that do it: an animator archives a
// robot from its page (it leaves the usual list, waits under Archived, and
// comes back when restored); the owner deletes an archived robot, told first
// which gait still uses it, then archives and deletes that gait. The robots
// and gaits are made for the test in the e2e database, so no other spec's
// demo data moves.
import { readFileSync } from "node:fs";
import { gaits, robotRevisions, robots } from "../db/schema";
import { axeViolations } from "./support/axe";
import { demoWorkspaceId, e2eDatabase, userId } from "./support/database";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const quayWalker = JSON.parse(readFileSync(new URL("../db/demo/robots/quay-walker.json", import.meta.url), "utf8"));
const uniqueName = (label: string) => `${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

const shoot = async (page: Page, name: string) => {
  if (process.env.GAITLOOM_SHOTS) await page.screenshot({ path: `${process.env.GAITLOOM_SHOTS}/8-${name}.png`, fullPage: true });
};

const noSeriousViolations = async (page: Page) => expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);

/** A robot of the demo workspace (archived when asked), and a gait on it when named. */
async function seedRobot(options: { archived?: boolean; gait?: string } = {}) {
  const name = uniqueName("Shelf walker");
  const { db, client } = e2eDatabase();
  try {
    const workspaceId = await demoWorkspaceId(db);
    const theo = await userId(db, "theo-brandt");
    const [robot] = await db
      .insert(robots)
      .values({ workspaceId, name, createdById: theo, archivedAt: options.archived ? new Date() : null })
      .returning({ id: robots.id });
    await db
      .insert(robotRevisions)
      .values({ robotId: robot.id, number: 1, definition: { ...quayWalker, name }, message: "Seeded for the archive spec", authorId: theo });
    if (options.gait) await db.insert(gaits).values({ workspaceId, robotId: robot.id, name: options.gait, createdById: theo });
    return { id: robot.id, name };
  } finally {
    await client.end();
  }
}

test.use({ viewport: { width: 1440, height: 900 } });
// Each test is a journey through four or five pages with an axe run on most: two journeys' time on a loaded 2-core machine.
test.describe.configure({ timeout: 120_000 });

test("an animator archives a robot from its page; it leaves the list, waits under Archived, and comes back when restored", async ({ page }) => {
  const robot = await seedRobot();
  await signInAs(page, "theo-brandt", `/robots/${robot.id}`);
  await expect(page.getByRole("heading", { level: 1, name: robot.name })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await page.getByRole("button", { name: `Archive ${robot.name}` }).click();
  await expect(page.getByRole("status").filter({ hasText: `${robot.name} is archived` })).toBeVisible();
  await expect(page.getByText(/^Archived \d{4}-\d{2}-\d{2}$/)).toBeVisible();
  // An animator may restore, not delete.
  await expect(page.getByRole("button", { name: `Restore ${robot.name}` })).toBeVisible();
  await expect(page.getByRole("button", { name: `Delete ${robot.name}…` })).toHaveCount(0);
  await noSeriousViolations(page);
  await shoot(page, "robot-page-archived");

  await page.goto("/robots");
  await expect(page.getByRole("heading", { level: 1, name: "Robots" })).toBeVisible();
  await expect(page.getByRole("link", { name: robot.name })).toHaveCount(0);
  await page.getByRole("navigation", { name: "Which robots" }).getByRole("link", { name: "Archived" }).click();
  const archived = page.getByRole("table", { name: "Archived robots" });
  await expect(archived.getByRole("link", { name: robot.name })).toBeVisible();
  await noSeriousViolations(page);
  await shoot(page, "robots-archived-list");

  await page.waitForLoadState("networkidle");
  await archived.getByRole("button", { name: `Restore ${robot.name}` }).click();
  await expect(archived.getByRole("link", { name: robot.name })).toHaveCount(0);
  await page.getByRole("navigation", { name: "Which robots" }).getByRole("link", { name: "In use" }).click();
  await expect(page.getByRole("link", { name: robot.name })).toBeVisible();
});

test("the owner deletes an archived robot: first told which gait still uses it, then deletes that gait and the robot", async ({ page }) => {
  const gaitName = uniqueName("Shelf crawl");
  const robot = await seedRobot({ archived: true, gait: gaitName });
  await signInAs(page, "ines-okafor", "/robots?show=archived");
  const archived = page.getByRole("table", { name: "Archived robots" });
  const row = archived.getByRole("row").filter({ hasText: robot.name });
  await page.waitForLoadState("networkidle");
  await row.getByRole("button", { name: `Delete ${robot.name}…` }).click();
  await row
    .getByRole("group", { name: `Delete ${robot.name} for good?` })
    .getByRole("button", { name: "Delete for good" })
    .click();
  const refusal = row.getByRole("alert");
  await expect(refusal).toContainText(
    `${robot.name} cannot be deleted: 1 gait uses it (${gaitName}). Delete that gait first, or keep the robot archived. Nothing was deleted.`,
  );
  await noSeriousViolations(page);
  await shoot(page, "robot-delete-refused");

  // The refusal links the gait: archive it there, then delete it.
  await refusal.getByRole("link", { name: gaitName }).click();
  await expect(page.getByRole("heading", { level: 1, name: gaitName })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await page.getByRole("button", { name: `Archive ${gaitName}` }).click();
  await expect(page.getByRole("status").filter({ hasText: `${gaitName} is archived` })).toBeVisible();
  await noSeriousViolations(page);
  await shoot(page, "gait-page-archived");
  await page.getByRole("button", { name: `Delete ${gaitName}…` }).click();
  await page.getByRole("button", { name: "Delete for good" }).click();
  await expect(page).toHaveURL(/\/gaits\?show=archived&deleted=/);
  await expect(page.getByRole("status")).toContainText(`${gaitName} is deleted, with its draft and versions.`);
  await noSeriousViolations(page);
  await shoot(page, "gaits-archived-list");

  await page.goto("/robots?show=archived");
  await page.waitForLoadState("networkidle");
  await row.getByRole("button", { name: `Delete ${robot.name}…` }).click();
  await row.getByRole("button", { name: "Delete for good" }).click();
  await expect(page.getByRole("status")).toContainText(`${robot.name} is deleted, with its revisions and calibration profiles.`);
  await expect(archived.getByRole("link", { name: robot.name })).toHaveCount(0);

  // The audit log names both, though they are gone.
  await page.goto(`/settings/audit?q=${encodeURIComponent(robot.name)}`);
  const entries = page.getByRole("table", { name: /Audit log entries/ });
  await expect(entries.getByRole("row").nth(1)).toContainText(`Ines Okafor deleted robot ${robot.name} and its 1 revision`);
});
