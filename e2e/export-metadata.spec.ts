// Issue 16, item 4, as the firmware engineer who hit it: a table made with a
// calibration profile names it in its file name and in the CSV's comment
// header (the browser's bytes are the API's), and a released version's page
// says whether today's table is still the one its release recorded.
import { readFileSync } from "node:fs";
import { axeViolations } from "./support/axe";
import { signInAs } from "./support/sign-in";
import { expect, test } from "./support/test";

const shots = (name: string) => (process.env.GAITLOOM_SHOTS ? { path: `${process.env.GAITLOOM_SHOTS}/4-${name}.png`, fullPage: true } : null);

test("a CSV made with a calibration profile names it in its file name and its comment header", async ({ page }) => {
  // Five pages and a download on a shared machine.
  test.setTimeout(120_000);
  const stamp = `${Date.now().toString(36)}${test.info().workerIndex}`;
  const profile = `SN-${stamp}`;
  await signInAs(page, "priya-sandoval", "/export");
  const tripod = await page.getByLabel("Gait", { exact: true }).locator("option", { hasText: "Tripod cruise" }).getAttribute("value");
  await page.goto(`/export?gait=${tripod}`);
  await page.getByRole("link", { name: "Edit the calibration profiles of Pier crawler" }).click();
  await page.getByRole("link", { name: "New profile" }).click();
  await page.getByLabel("Name (e.g. the unit's serial number)").fill(profile);
  await page.getByLabel("LF coxa trim, degrees").fill("1.5");
  await page.getByRole("button", { name: "Create the profile" }).click();
  await expect(page.getByText(profile).first()).toBeVisible();

  await page.goto(`/export?gait=${tripod}&format=csv&units=deg&profile=${profile}`);
  const named = `${profile} (revision 1)`;
  const fileName = `tripod_cruise_v1_deg10_50hz_profile-sn_${stamp}_revision_1.csv`;
  await expect(page.getByRole("region", { name: "In the table's header" }).getByText(named)).toBeVisible();
  await expect(page.getByText(`Calibration profile ${named} applied.`)).toBeVisible();
  const shot = shots("export-profile");
  if (shot) await page.screenshot(shot);
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);

  const downloading = page.waitForEvent("download");
  await page.getByRole("link", { name: `Download ${fileName}` }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toBe(fileName);
  const fromBrowser = readFileSync((await download.path())!);
  const lines = fromBrowser.toString("utf8").split("\r\n");
  expect(lines[0]).toMatch(/^# Gaitloom angle table \(gaitloom\.table\/2\)/);
  expect(lines).toContain(`# Calibration profile: ${named}`);
  expect(lines).toContain("# Robot: Pier crawler, revision 1");
  expect(lines.find((line) => !line.startsWith("#"))).toMatch(/^frame,time_ms,LF\.coxa,/);

  // The download link is the API's address: the same bytes again from it.
  const href = await page.getByRole("link", { name: `Download ${fileName}` }).getAttribute("href");
  expect(href).toMatch(/^\/api\/v1\/gaits\/.+\/versions\/released\/table\?format=csv&units=deg&profile=/);
  const again = await page.request.get(href!);
  expect(Buffer.from(await again.body()).equals(fromBrowser), "the API's bytes equal the browser download's").toBe(true);
  expect(again.headers()["content-disposition"]).toBe(`attachment; filename="${fileName}"`);
});

test("a released version's page says its table is still the recorded one", async ({ page }) => {
  await signInAs(page, "priya-sandoval", "/export");
  const tripod = await page.getByLabel("Gait", { exact: true }).locator("option", { hasText: "Tripod cruise" }).getAttribute("value");
  await page.goto(`/gaits/${tripod}/versions/1`);
  const section = page.getByRole("region", { name: "Release table" });
  await expect(section.getByText("Today's table is the one recorded at the release, byte for byte.")).toBeVisible();
  await expect(section.getByRole("link", { name: "Download today's table" })).toHaveAttribute("href", /\/versions\/1\/table\?format=csv&units=deg$/);
  const shot = shots("version-release-table");
  if (shot) await page.screenshot(shot);
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
});
