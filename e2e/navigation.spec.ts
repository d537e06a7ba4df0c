// Getting around (issue 16, item 7): a slow page shows progress; the account
// menu offers "API tokens" only to the roles that may hold one; a form sent
// to a page without one answers our own 405 page; the bring-up page fits a
// 1 440 px window and says a sweep's speed as one number.
import { axeViolations } from "./support/axe";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const shots = process.env.GAITLOOM_SHOTS ?? null;

async function expectNoSeriousAxeViolations(page: Page) {
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
}

test("a slow page shows progress until it is there", async ({ page }) => {
  await signInAs(page, "theo-brandt", "/robots");
  await page.waitForLoadState("networkidle");
  // The gaits page's data comes 2 s late, as on a busy server.
  let release: () => void = () => {};
  const held = new Promise<void>((resolve) => (release = resolve));
  await page.route(/\/gaits\.data(\?|$)/, async (route) => {
    await Promise.race([held, new Promise((resolve) => setTimeout(resolve, 2_000))]);
    await route.continue();
  });
  await page
    .getByRole("navigation", { name: "Sections" })
    .getByRole("link", { name: /^Gaits/ })
    .click();
  const progress = page.getByRole("banner").getByText("Loading the page…");
  await expect(progress).toBeVisible();
  await expect(page.getByTestId("navigation-progress-bar")).toBeVisible();
  if (shots) await page.screenshot({ path: `${shots}/7-page-loading.png` });
  release();
  await expect(page.getByRole("heading", { level: 1, name: "Gaits" })).toBeVisible();
  await expect(progress).toHaveCount(0);
  await expect(page.getByTestId("navigation-progress-bar")).toHaveCount(0);
});

for (const person of [
  { login: "theo-brandt", role: "animator" },
  { login: "kenji-wu", role: "viewer" },
]) {
  test(`${person.role === "animator" ? "an animator" : "a viewer"} sees no entry for API tokens, in the menu or the settings`, async ({ page }) => {
    await signInAs(page, person.login, "/settings");
    await page.getByLabel("Your account").click();
    const menu = page.getByText(/^Signed in as @/).locator("..");
    await expect(menu.getByRole("link", { name: "Your sessions" })).toBeVisible();
    await expect(page.getByRole("link", { name: "API tokens" })).toHaveCount(0);
    await expect(page.getByRole("navigation", { name: "Settings" }).getByRole("link")).not.toContainText(["API tokens"]);
    await expect(page.getByText("API tokens")).toHaveCount(0);
    await expectNoSeriousAxeViolations(page);
    if (shots) await page.screenshot({ path: `${shots}/7-${person.role}-menu-without-tokens.png` });
  });
}

test("firmware, who may hold tokens, finds them in the menu", async ({ page }) => {
  await signInAs(page, "priya-sandoval", "/robots");
  await page.getByLabel("Your account").click();
  await page.getByRole("link", { name: "API tokens" }).click();
  await expect(page).toHaveURL(/\/settings\/tokens$/);
  await expect(page.getByRole("heading", { level: 1, name: "Settings" })).toBeVisible();
});

test("a form sent to /settings, which takes none, answers our 405 page, not the framework's text", async ({ page }) => {
  await signInAs(page, "ines-okafor", "/settings");
  await page.waitForLoadState("networkidle");
  const answered = page.waitForResponse((response) => response.request().method() === "POST" && new URL(response.url()).pathname === "/settings");
  await page.evaluate(() => {
    const form = document.createElement("form");
    form.method = "post";
    form.action = "/settings";
    document.body.append(form);
    form.submit();
  });
  expect((await answered).status()).toBe(405);
  await expect(page.getByRole("heading", { name: "This page takes no form" })).toBeVisible();
  await expect(page.getByText(/nothing was changed/)).toBeVisible();
  await expect(page.getByText(/did not provide an `action`|routes\/settings|Method Not Allowed/)).toHaveCount(0);
  // The page's loaders did not run, so who is signed in is not known there: no "Sign in" that would say otherwise.
  await expect(page.getByRole("banner").getByRole("link", { name: "Sign in" })).toHaveCount(0);
  await expectNoSeriousAxeViolations(page);
  if (shots) await page.screenshot({ path: `${shots}/7-post-settings-405.png`, fullPage: true });
});

test("the bring-up page fits a 1 440 px window, and a sweep's speed is one number from its frames", async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signInAs(page, "priya-sandoval", "/export/bring-up?kind=sweep");
  await page.getByLabel("Robot (newest revision)").selectOption({ label: "Hull climber" });
  await page.getByRole("button", { name: "Show the table" }).click();
  const checks = page.getByRole("region", { name: "Checks" });
  await expect(checks).toContainText(/Peak speed [\d.]+°\/s/);
  await page.waitForLoadState("networkidle");
  const peak = (await checks.textContent())!.match(/Peak speed ([\d.]+)°\/s/)![1];
  const sentence = page.getByText(/this sweep moves at up to/);
  await expect(sentence).toContainText(`this sweep moves at up to ${peak}°/s`);
  expect(await page.evaluate(() => document.documentElement.scrollWidth), "page width at a 1 440 px window").toBeLessThanOrEqual(1440);
  await expectNoSeriousAxeViolations(page);
  if (shots) await page.screenshot({ path: `${shots}/7-bring-up-1440.png`, fullPage: true });
});
