// The audit log as the owner reads it: sentences that name who did what to
// which object, filtered by person and by object, paged past 200 entries in
// a stable order, the recorded details one click away, and a page that fits
// a 1 440 px window. Hundreds of entries are seeded straight into the e2e
// database (as a busy half hour of use would write them).
import { and, eq } from "drizzle-orm";
import { auditLog, robots } from "../db/schema";
import { axeViolations } from "./support/axe";
import { demoWorkspaceId, e2eDatabase, userId } from "./support/database";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const shoot = async (page: Page, name: string) => {
  if (process.env.GAITLOOM_SHOTS) await page.screenshot({ path: `${process.env.GAITLOOM_SHOTS}/2-${name}.png`, fullPage: true });
};

test.use({ viewport: { width: 1440, height: 900 } });

test("the owner filters the audit log by person and by object and pages past 200 entries", async ({ page }) => {
  // Seven page loads of the log, two axe runs and a seed of 232 entries: more than one journey's time on a loaded 2-core machine.
  test.setTimeout(150_000);
  const marker = `Seeded gait ${Date.now().toString(36)}`;
  const { db, client } = e2eDatabase();
  const workspaceId = await demoWorkspaceId(db);
  const [priya, theo, ines, kenji] = await Promise.all(["priya-sandoval", "theo-brandt", "ines-okafor", "kenji-wu"].map((login) => userId(db, login)));
  const [crawler] = await db
    .select({ id: robots.id })
    .from(robots)
    .where(and(eq(robots.workspaceId, workspaceId), eq(robots.name, "Pier crawler")));
  // 230 downloads by firmware, then entries written before names were recorded: a role change and robot saves.
  await db.insert(auditLog).values(
    Array.from({ length: 230 }, (_, index) => ({
      workspaceId,
      actorId: priya,
      action: "table.downloaded",
      targetType: "gait_version",
      details: { gait: marker, number: index + 1, format: "csv", units: "deg" },
    })),
  );
  await db.insert(auditLog).values([
    {
      workspaceId,
      actorId: ines,
      action: "member.role-changed",
      targetType: "user",
      targetId: kenji,
      details: { from: "viewer", to: "firmware", seeded: marker },
    },
    {
      workspaceId,
      actorId: theo,
      action: "robot.save",
      targetType: "robot",
      targetId: crawler.id,
      details: { revision: 904, changedFields: 2, seeded: marker },
    },
  ]);
  await client.end();

  await signInAs(page, "ines-okafor", "/settings/audit");
  const entries = page.getByRole("table", { name: /Audit log entries/ });
  await expect(entries).toBeVisible();
  // Among the newest (this sign-in, and other specs' steps, came after them): the seeded entries, in words.
  const save = entries.getByRole("row").filter({ hasText: "revision 904" });
  await expect(save).toContainText("Theo Brandt saved robot Pier crawler revision 904 (2 fields changed)");
  await expect(save.getByRole("link", { name: "Pier crawler" })).toHaveAttribute("href", `/robots/${crawler.id}`);
  await expect(entries.getByRole("row").filter({ hasText: "Kenji Wu’s role" }).first()).toContainText(
    "Ines Okafor changed Kenji Wu’s role from viewer to firmware",
  );
  // The page fits the window: nothing wider than the viewport.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(1440);
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
  await shoot(page, "audit-newest");

  // The recorded details, one click away.
  const row = save;
  await row.getByText("Recorded details").click();
  await expect(row.locator("pre")).toContainText('"revision": 904');
  await shoot(page, "audit-details");

  // By person, and a word: Priya's 230 downloads of the seeded gait, 50 a page.
  const filter = page.getByRole("search", { name: "Filter the audit log" });
  await filter.getByLabel("Person").selectOption({ label: "Priya Sandoval" });
  await filter.getByLabel("Search").fill(marker);
  await filter.getByRole("button", { name: "Show" }).click();
  const pages = page.getByRole("navigation", { name: "Audit log pages", exact: true });
  await expect(pages).toContainText("Entries 1–50 of 230 that match, newest first.");
  await expect(entries.getByRole("row").nth(1)).toContainText(`Priya Sandoval downloaded the csv deg table of version 230 of gait ${marker}`);
  for (const [first, last] of [
    [51, 100],
    [101, 150],
    [151, 200],
    [201, 230],
  ]) {
    await pages.getByRole("link", { name: "Older →" }).click();
    await expect(pages).toContainText(`Entries ${first}–${last} of 230 that match`);
  }
  // Past 200: the oldest of them, and nothing older.
  await expect(entries.getByRole("row")).toHaveCount(31);
  await expect(entries.getByRole("row").last()).toContainText(`version 1 of gait ${marker}`);
  await expect(pages.getByRole("link", { name: "Older →" })).toHaveCount(0);
  await shoot(page, "audit-page-5");
  // And back one page: the same entries as on the way down.
  await pages.getByRole("link", { name: "← Newer" }).click();
  await expect(pages).toContainText("Entries 151–200 of 230 that match");
  await expect(entries.getByRole("row").nth(1)).toContainText(`version 80 of gait ${marker}`);

  // By object: the Pier crawler's entries, and only saves.
  await page.getByRole("link", { name: "Clear" }).click();
  await expect(page).toHaveURL(/\/settings\/audit$/);
  // The fields show the cleared filter too.
  await expect(filter.getByLabel("Search")).toHaveValue("");
  await expect(filter.getByLabel("Person")).toHaveValue("");
  await filter.getByLabel("Object").selectOption({ label: "Pier crawler" });
  await filter.getByLabel("Action").selectOption({ label: "Saved a robot" });
  await filter.getByRole("button", { name: "Show" }).click();
  await expect(entries.getByRole("row").nth(1)).toContainText("Theo Brandt saved robot Pier crawler revision 904");
  const whats = await entries.getByRole("row").locator("td:nth-child(2)").allInnerTexts();
  expect(whats.every((text) => /saved robot Pier crawler/.test(text))).toBe(true);
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
  await shoot(page, "audit-by-object");
});
