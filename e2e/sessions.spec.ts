// Sessions end for good in the browser: signing out, and signing out
// everywhere from the list of one's sessions. The people here are new ones
// of their own, so no other spec's session of a demo person is ended.
import { expect, test } from "./support/test";
import { signInAsNewPerson } from "./support/sign-in";

const newcomer = (label: string) => {
  const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
  return { login: `${label}-${stamp}`, name: `${label} ${stamp}`, email: `${label}.${stamp}@example.test` };
};

test("signing out ends the session: the cookie from before, sent again, is signed out", async ({ page, context }) => {
  await signInAsNewPerson(page, newcomer("rowan"));
  await expect(page.getByLabel("Your account")).toBeVisible();
  const before = (await context.cookies()).filter((cookie) => cookie.name === "gaitloom_session");
  expect(before).toHaveLength(1);

  await page.getByLabel("Your account").click();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("link", { name: "Sign in", exact: true })).toBeVisible();

  // The old cookie, put back as someone who had copied it would.
  await context.addCookies(before);
  await page.goto("/welcome");
  await expect(page).toHaveURL(/\/sign-in\?returnTo=%2Fwelcome/);
  await expect(page.getByRole("link", { name: "Sign in", exact: true })).toBeVisible();
});

test("the account lists where you are signed in, this browser marked, and signing out everywhere ends every one", async ({ page, browser }) => {
  const person = newcomer("sasha");
  const elsewhere = await browser.newContext();
  const other = await elsewhere.newPage();
  await signInAsNewPerson(other, person);
  await expect(other.getByLabel("Your account")).toBeVisible();
  await signInAsNewPerson(page, person);

  await page.getByLabel("Your account").click();
  await page.getByRole("link", { name: "Your sessions" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Your sessions" })).toBeVisible();
  const list = page.getByRole("table", { name: "Where you are signed in" });
  await expect(list.getByRole("row")).toHaveCount(3); // the header and two sessions
  await expect(list.getByRole("row").filter({ hasText: "This browser" })).toHaveCount(1);

  await page.getByRole("button", { name: "Sign out everywhere" }).click();
  await expect(page.getByRole("link", { name: "Sign in", exact: true })).toBeVisible();
  await other.goto("/account/sessions");
  await expect(other).toHaveURL(/\/sign-in/);
  await elsewhere.close();
});
