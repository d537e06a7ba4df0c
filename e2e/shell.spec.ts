import { signInAs } from "./support/sign-in";
import { expect, test } from "./support/test";

test("the home page renders in IBM Plex Sans served from our own origin, and nothing leaves 127.0.0.1", async ({ page, baseURL }) => {
  const requested: string[] = [];
  page.on("request", (request) => requested.push(request.url()));

  await page.goto("/");
  await expect(page.getByRole("heading", { name: "Walking motions you can ship" })).toBeVisible();
  // Through the sign-in stand-in too: it runs on 127.0.0.1 like everything else.
  await page.getByRole("link", { name: "Sign in to the demo" }).click();
  await page.getByRole("button", { name: "Sign in with GitHub" }).click();
  await page.getByRole("button", { name: /^Continue as Kenji Wu/ }).click();
  await expect(page.getByLabel("Your account")).toBeVisible();
  await page.evaluate(() => document.fonts.ready);

  const fontLoaded = await page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'));
  expect(fontLoaded, "document.fonts.check for IBM Plex Sans").toBe(true);
  const usedFamily = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
  expect(usedFamily).toContain("IBM Plex Sans");

  const fontFiles = requested.filter((url) => /\.woff2?(\?|$)/.test(url));
  expect(fontFiles.length, "at least one font file was fetched").toBeGreaterThan(0);
  for (const url of fontFiles) expect(new URL(url).origin).toBe(new URL(baseURL!).origin);

  const outside = requested.filter((url) => !/^(data|blob):/.test(url) && new URL(url).hostname !== "127.0.0.1");
  expect(outside, "requests to hosts other than 127.0.0.1").toEqual([]);
});

test("the navigation reaches every section and the demo robots are listed", async ({ page }) => {
  await signInAs(page, "kenji-wu");
  const nav = page.getByRole("navigation", { name: "Sections" });
  await nav.getByRole("link", { name: /Robots/ }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Robots" })).toBeVisible();
  await expect(page.getByRole("cell", { name: "Pier Crawler" })).toBeVisible();

  for (const section of ["Gaits", "Reviews", "Settings"]) {
    await nav.getByRole("link", { name: new RegExp(section) }).click();
    await expect(page.getByRole("heading", { level: 1, name: section })).toBeVisible();
    await expect(page).toHaveURL(new RegExp(`/${section.toLowerCase()}$`));
  }
});

test("an unknown address shows the 404 page inside the shell", async ({ page }) => {
  const response = await page.goto("/no/such/place");
  expect(response?.status()).toBe(404);
  await expect(page.getByRole("heading", { name: "There is no page here" })).toBeVisible();
  await expect(page.getByRole("navigation", { name: "Sections" })).toBeVisible();
  await page.getByRole("link", { name: "Back to the start page" }).click();
  await expect(page.getByRole("heading", { name: "Walking motions you can ship" })).toBeVisible();
});

test("a gait or robot that does not exist shows the page's 404 inside the shell", async ({ page }) => {
  await signInAs(page, "kenji-wu");
  for (const address of ["/gaits/999999", "/gaits/999999/versions/1", "/robots/999999", "/robots/999999/revisions/1"]) {
    const response = await page.goto(address);
    expect(response?.status(), address).toBe(404);
    await expect(page.getByRole("heading", { name: "There is no page here" })).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Sections" })).toBeVisible();
  }
});

test("the health check answers with the database reachable", async ({ request }) => {
  const response = await request.get("/healthz");
  expect(response.status()).toBe(200);
  expect(await response.json()).toMatchObject({ ok: true, database: { ok: true } });
});
