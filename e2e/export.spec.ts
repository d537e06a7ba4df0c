// The firmware engineer's path to the robot: create an API token, download
// the released table of a demo gait from the export page, and get the very
// same bytes with the page's curl command and the token; a token of another
// workspace gets nothing of Breakwater's.
import { execFile } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { signInAs, signInAsNewPerson } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const run = promisify(execFile);
const CURL = "/usr/bin/curl";

const stampOf = () => `${Date.now().toString(36)}-${test.info().workerIndex}-${Math.random().toString(36).slice(2, 6)}`;

async function createToken(page: Page, name: string): Promise<string> {
  await page.goto("/settings/tokens");
  await page.getByLabel("Token name").fill(name);
  await page.getByRole("button", { name: "Create token" }).click();
  const token = (await page.getByTestId("new-token").textContent())?.trim() ?? "";
  expect(token.length).toBeGreaterThan(20);
  return token;
}

/** The HTTP status curl gets for `url` with `token`. */
async function statusWith(url: string, token: string): Promise<number> {
  const { stdout } = await run(CURL, ["-s", "-o", "/dev/null", "-w", "%{http_code}", "-H", `Authorization: Bearer ${token}`, url]);
  return Number(stdout);
}

test.beforeAll(() => {
  expect(existsSync(CURL), `${CURL} is needed for this test (Debian's curl package)`).toBe(true);
});

test("firmware downloads the released table in the app, and curl with a token gets the same bytes", async ({ page, baseURL }) => {
  const stamp = stampOf();
  await signInAs(page, "priya-sandoval", "/settings/tokens");
  const token = await createToken(page, `export build ${stamp}`);

  await page.goto("/export");
  await expect(page.getByRole("heading", { name: "Export an angle table" })).toBeVisible();
  await expect(page.getByRole("region", { name: "This table drives real motors." })).toBeVisible();
  await expect(page.getByText("Test with the robot on a stand and its legs free.")).toBeVisible();
  const gait = page.getByLabel("Gait", { exact: true });
  const tripod = await gait.locator("option", { hasText: "Tripod cruise" }).getAttribute("value");
  // A choice shows its table at once once the page has hydrated; "Show the table" submits the same GET form before that.
  const show = page.getByRole("button", { name: "Show the table" });
  await gait.selectOption(tripod!);
  await show.click();
  await expect(page).toHaveURL(new RegExp(`gait=${tripod}`));
  await expect(page.getByLabel("Version", { exact: true })).toHaveValue("released");
  await page.getByLabel("Format", { exact: true }).selectOption("csv");
  await page.getByLabel("Units", { exact: true }).selectOption("us");
  await show.click();
  await expect(page).toHaveURL(/units=us/);
  await expect(page.getByLabel("Units", { exact: true })).toHaveValue("us");
  // The preview shows the first frames in the file's own rounding.
  await expect(page.getByRole("region", { name: /Table preview/ }).getByRole("columnheader", { name: "time_ms" })).toBeVisible();

  const downloading = page.waitForEvent("download");
  await page.getByRole("link", { name: /^Download tripod_cruise_v1_us_50hz_no-profile\.csv$/ }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toBe("tripod_cruise_v1_us_50hz_no-profile.csv");
  const fromBrowser = readFileSync((await download.path())!);
  // The comment header first (issue 16), then the header record.
  const lines = fromBrowser.toString("utf8").split("\r\n");
  expect(lines[0]).toMatch(/^# Gaitloom angle table/);
  expect(lines.find((line) => !line.startsWith("#"))).toMatch(/^frame,time_ms,/);

  // The command as the page gives it to copy, run as a build script would: curl with the token from the environment.
  const command = (await page.getByTestId("curl-command").textContent())!.trim();
  expect(command).toMatch(
    /^curl -fsS -H "Authorization: Bearer \$GAITLOOM_TOKEN" -o 'tripod_cruise_v1_us_50hz_no-profile\.csv' '.+\/api\/v1\/gaits\/.+\/versions\/released\/table\?format=csv&units=us'$/,
  );
  const url = new URL(command.match(/'([^']+)'$/)![1]);
  const target = new URL(url.pathname + url.search, baseURL).toString();
  const scriptCommand = command.replace(/'[^']+'$/, `'${target}'`);
  const folder = mkdtempSync(join(tmpdir(), "gaitloom-export-"));
  try {
    await run("/bin/sh", ["-c", scriptCommand], { cwd: folder, env: { ...process.env, GAITLOOM_TOKEN: token } });
    const fromCurl = readFileSync(join(folder, "tripod_cruise_v1_us_50hz_no-profile.csv"));
    expect(fromCurl.equals(fromBrowser), "curl's bytes equal the browser download's").toBe(true);
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }

  // The same again with If-None-Match: nothing changed, so 304.
  const { stdout: headers } = await run(CURL, ["-sS", "-D", "-", "-o", "/dev/null", "-H", `Authorization: Bearer ${token}`, target]);
  const etag = headers.match(/^etag: (.+)\r$/im)![1];
  const { stdout: status } = await run(CURL, [
    "-s",
    "-o",
    "/dev/null",
    "-w",
    "%{http_code}",
    "-H",
    `Authorization: Bearer ${token}`,
    "-H",
    `If-None-Match: ${etag}`,
    target,
  ]);
  expect(Number(status)).toBe(304);
  expect(await statusWith(target, "gl_not_a_real_token")).toBe(401);
});

test("a token of another workspace is refused Breakwater's tables", async ({ page, browser, baseURL }) => {
  const stamp = stampOf();
  // Breakwater's released table address, as firmware sees it on the export page.
  await signInAs(page, "priya-sandoval", "/export");
  const tripod = await page.getByLabel("Gait", { exact: true }).locator("option", { hasText: "Tripod cruise" }).getAttribute("value");
  const target = new URL(`/api/v1/gaits/${tripod}/versions/released/table?format=csv&units=deg`, baseURL).toString();

  const context = await browser.newContext();
  try {
    const outsider = await context.newPage();
    await signInAsNewPerson(outsider, { login: `export-out-${stamp}`, name: `Outsider ${stamp}`, email: `export.out.${stamp}@example.test` }, "/export");
    await expect(outsider).toHaveURL(/\/welcome$/);
    await outsider.getByLabel("Workspace name").fill(`Reef Lab ${stamp}`);
    await outsider.getByRole("button", { name: "Create workspace" }).click();
    await expect(outsider.getByRole("heading", { name: `Reef Lab ${stamp}` })).toBeVisible();
    const foreignToken = await createToken(outsider, `reef build ${stamp}`);
    const status = await statusWith(target, foreignToken);
    expect(status, "another workspace's token: Breakwater's gait is not found").toBe(404);
    // Its own workspace answers to it, so the token itself is good.
    expect(await statusWith(new URL("/api/v1/workspace", baseURL).toString(), foreignToken)).toBe(200);
  } finally {
    await context.close();
  }
});
