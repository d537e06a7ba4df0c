// API tokens as firmware holds them: an expiry chosen at creation, a copy
// button for the token shown once, and an expired token refused with a 401
// that says it expired. The token is put past its expiry in the e2e database
// (no one waits seven days).
import { and, eq } from "drizzle-orm";
import { apiTokens } from "../db/schema";
import { axeViolations } from "./support/axe";
import { e2eDatabase } from "./support/database";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const shoot = async (page: Page, name: string) => {
  if (process.env.GAITLOOM_SHOTS) await page.screenshot({ path: `${process.env.GAITLOOM_SHOTS}/8-${name}.png`, fullPage: true });
};

test.use({ viewport: { width: 1440, height: 900 } });

test("firmware creates a token that expires in 7 days, copies it with the button, and once expired it answers 401 saying so", async ({
  page,
  context,
  baseURL,
}) => {
  await context.grantPermissions(["clipboard-read", "clipboard-write"], { origin: baseURL });
  const name = `bench rig ${Date.now().toString(36)}`;
  await signInAs(page, "priya-sandoval", "/settings/tokens");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("Token name").fill(name);
  await page.getByLabel("Expires").selectOption({ label: "after 7 days" });
  await page.getByRole("button", { name: "Create token" }).click();
  const created = page.getByRole("status", { name: "New token" });
  await expect(created).toContainText(`Token “${name}” created`);
  const token = (await page.getByTestId("new-token").textContent())?.trim() ?? "";
  expect(token).toMatch(/^gl_/);
  const inAWeek = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
  await expect(created).toContainText(`It stops working at ${inAWeek}`);

  await created.getByRole("button", { name: "Copy token" }).click();
  await expect(created.getByRole("button", { name: "Copied ✓" })).toBeVisible();
  expect(await page.evaluate(() => navigator.clipboard.readText())).toBe(token);
  const row = page.getByRole("table", { name: "Your API tokens" }).getByRole("row").filter({ hasText: name });
  await expect(row).toContainText(inAWeek);
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
  await shoot(page, "token-created");

  const call = () => fetch(new URL("/api/v1/workspace", baseURL), { headers: { Authorization: `Bearer ${token}` } });
  expect((await call()).status).toBe(200);

  const { db, client } = e2eDatabase();
  const past = new Date(Date.now() - 60_000);
  await db
    .update(apiTokens)
    .set({ expiresAt: past })
    .where(and(eq(apiTokens.name, name), eq(apiTokens.prefix, token.slice(0, 9))));
  await client.end();

  const refused = await call();
  expect(refused.status).toBe(401);
  const body = (await refused.json()) as { error: { code: string; message: string } };
  expect(body.error.code).toBe("unauthorized");
  expect(body.error.message).toMatch(
    new RegExp(`^This API token \\(${name}\\) expired at \\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2} UTC; create a new one in Settings → API tokens\\.$`),
  );

  await page.goto("/settings/tokens");
  await expect(page.getByRole("table", { name: "Your API tokens" }).getByRole("row").filter({ hasText: name })).toContainText("expired");
  await shoot(page, "token-expired");
});
