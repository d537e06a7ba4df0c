// Issue 16, item 6, as the lead who hit it: the compare picker keeps B to A's
// robot and explains a pair of two robots instead of silently emptying;
// changed settings read by their names; the joint plots shade the limits and
// mark flags as the editor's do.
import { axeViolations } from "./support/axe";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const shot = async (page: Page, name: string) => {
  if (process.env.GAITLOOM_SHOTS) await page.screenshot({ path: `${process.env.GAITLOOM_SHOTS}/6-${name}.png`, fullPage: true });
};

async function versionId(page: Page, text: string): Promise<string> {
  return (await page.getByLabel("A", { exact: true }).locator("option", { hasText: text }).first().getAttribute("value"))!;
}

test("lead: the picker keeps to one robot, and a pair of two robots is explained", async ({ page }) => {
  await signInAs(page, "mara-lindqvist", "/gaits/compare");
  await page.waitForLoadState("networkidle");
  const tripod = await versionId(page, "Tripod cruise v1");
  const trot = await versionId(page, "Trot v1");

  // Once A is a Pier crawler gait, B offers only Pier crawler's gaits.
  await page.getByLabel("A", { exact: true }).selectOption(tripod);
  const groups = await page
    .getByLabel("B", { exact: true })
    .locator("optgroup")
    .evaluateAll((nodes) => nodes.map((node) => node.getAttribute("label")));
  expect(groups.length).toBeGreaterThan(0);
  for (const group of groups) expect(group).toMatch(/^Pier crawler › /);
  await expect(page.getByTestId("picker-hint")).toHaveText(/^B lists the gaits of Pier crawler: versions of two robots cannot be compared/);

  // A pair of two robots from an address: the reason beside the picker, B cleared with it.
  await page.goto(`/gaits/compare?a=${trot}&b=${tripod}`);
  await expect(page.getByRole("alert")).toHaveText(/different robots \(Quay walker and Pier crawler\)/);
  await expect(page.getByLabel("A", { exact: true })).toHaveValue(trot);
  await expect(page.getByLabel("B", { exact: true })).toHaveValue("");
  await expect(page.getByTestId("picker-hint")).toHaveText(/^B was cleared: Tripod cruise v1 is a gait of Pier crawler/);
  await shot(page, "cross-robot");
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
});

test("lead: changed settings by name, and joint plots with limit bands and flag marks", async ({ page }) => {
  test.setTimeout(90_000);
  await signInAs(page, "mara-lindqvist", "/gaits/compare");
  await page.waitForLoadState("networkidle");
  const first = await versionId(page, "Tripod cruise v1");
  const second = await versionId(page, "Tripod cruise v2");
  await page.goto(`/gaits/compare?a=${first}&b=${second}`);
  const settings = page.getByRole("heading", { name: "Settings" }).locator("..");
  await expect(settings).toContainText("Stride length (mm): 40 → 55");
  await expect(settings).toContainText("Cycle time (ms): 1200 → 1000");
  await expect(settings).not.toContainText("generator.");
  const plots = page.getByRole("list", { name: "Joint plots, A and B overlaid" });
  await expect(plots.getByRole("listitem")).toHaveCount(18);
  // Each plot knows its joint's limits; bands are drawn where the curve comes within 15° of one (as in the editor; a unit test draws them).
  const limits = await plots.locator("svg[data-limits]").evaluateAll((plots) => plots.map((plot) => plot.getAttribute("data-limits")));
  expect(limits).toHaveLength(18);
  for (const entry of limits) expect(entry).toMatch(/^-?\d+(\.\d+)?\.\.-?\d+(\.\d+)?$/);
  await expect(page.getByText("shaded: past the joint limits")).toBeVisible();
  await shot(page, "settings-and-plots");
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
});
