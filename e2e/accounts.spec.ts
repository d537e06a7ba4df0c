import { demoPeople } from "../db/demo/scenario";
import { latestMailTo, signInAs, signInAsNewPerson } from "./support/sign-in";
import { expect, test } from "./support/test";

const roleLabel = (role: string) => role[0].toUpperCase() + role.slice(1);

for (const person of demoPeople) {
  test(`${person.name} signs in through the local GitHub and works as ${person.role}`, async ({ page }) => {
    await signInAs(page, person.login);
    const account = page.getByLabel("Your account");
    await expect(account).toContainText(person.name);
    await expect(account).toContainText(roleLabel(person.role));
    await page
      .getByRole("link", { name: /Robots/ })
      .first()
      .click();
    await expect(page.getByRole("heading", { level: 1, name: "Robots" })).toBeVisible();
  });
}

test("signing in returns to the page the person was going to, and signing out ends the session", async ({ page }) => {
  await page.goto("/settings/members");
  await expect(page).toHaveURL(/\/sign-in\?returnTo=%2Fsettings%2Fmembers/);
  await page.getByRole("button", { name: "Sign in with GitHub" }).click();
  await page.getByRole("button", { name: /^Continue as Ines Okafor/ }).click();
  await expect(page).toHaveURL(/\/settings\/members$/);
  await expect(page.getByRole("table", { name: "Members of this workspace" })).toBeVisible();

  await page.getByLabel("Your account").click();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("link", { name: "Sign in", exact: true })).toBeVisible();
  await page.goto("/settings/members");
  await expect(page).toHaveURL(/\/sign-in/);
});

test("an owner invites a new person by e-mail; they follow the link and land in the workspace with the invited role", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const newcomer = { login: `dara-${stamp}`, name: `Dara Quill ${stamp}`, email: `dara.${stamp}@breakwater-lab.test` };

  await signInAs(page, "ines-okafor", "/settings/members");
  await page.getByLabel("E-mail").fill(newcomer.email);
  await page.getByLabel("Role").last().selectOption("firmware");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByRole("status")).toContainText(`Invitation for ${newcomer.email} created; its e-mail is queued.`);
  const pending = page.getByRole("table", { name: "Pending invitations" }).getByRole("row").filter({ hasText: newcomer.email });
  await expect(pending.getByRole("cell", { name: newcomer.email, exact: true })).toBeVisible();
  // The job runner sends it; the page follows until it has.
  await expect(pending.getByText(/^(queued|sent)$/)).toBeVisible();
  await expect(pending.getByText("sent", { exact: true })).toBeVisible({ timeout: 15_000 });
  // Following the mail keeps the answer to the invitation on the page.
  await expect(page.getByRole("status")).toContainText(`Invitation for ${newcomer.email} created`);

  // The mail, as the local inbox page shows it.
  await page.goto("/local/mail");
  const letter = page
    .getByRole("article", { name: /invited you to Breakwater Robotics Lab/ })
    .filter({ hasText: newcomer.email })
    .first();
  await expect(letter).toBeVisible();
  const mail = await latestMailTo(newcomer.email);
  const link = mail.text.match(/https?:\/\/\S+\/invitations\/\S+/)?.[0];
  expect(link, "the invitation e-mail carries a link").toBeTruthy();

  // The newcomer, in a browser of their own.
  const context = await browser.newContext();
  const theirs = await context.newPage();
  await theirs.goto(link!);
  await expect(theirs).toHaveURL(/\/sign-in/);
  await signInAsNewPerson(theirs, newcomer, new URL(link!).pathname);
  await expect(theirs.getByRole("heading", { name: "Join Breakwater Robotics Lab" })).toBeVisible();
  await theirs.getByRole("button", { name: "Join as firmware" }).click();
  await expect(theirs.getByRole("heading", { name: "Breakwater Robotics Lab" })).toBeVisible();
  await expect(theirs.getByLabel("Your account")).toContainText("Firmware");

  // Single use: the same link now refuses.
  await theirs.goto(link!);
  await expect(theirs.getByText("This invitation link was already used.")).toBeVisible();
  await context.close();
});

test("an invitation followed by an account whose GitHub address is not verified explains what to do, and joining is refused", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const newcomer = { login: `eli-${stamp}`, name: `Eli Marsh ${stamp}`, email: `eli.${stamp}@breakwater-lab.test`, verified: false };

  await signInAs(page, "ines-okafor", "/settings/members");
  await page.getByLabel("E-mail").fill(newcomer.email);
  await page.getByLabel("Role").last().selectOption("lead");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByRole("status")).toContainText(`Invitation for ${newcomer.email} created`);
  // The job runner sends it after the answer.
  const link = (await latestMailTo(newcomer.email, 20_000)).text.match(/https?:\/\/\S+\/invitations\/\S+/)?.[0];
  expect(link, "the invitation e-mail carries a link").toBeTruthy();

  const context = await browser.newContext();
  const theirs = await context.newPage();
  await signInAsNewPerson(theirs, newcomer, new URL(link!).pathname);
  await expect(theirs.getByRole("heading", { name: "Join Breakwater Robotics Lab" })).toBeVisible();
  await expect(theirs.getByText(/verify that address on GitHub and sign in again/i)).toBeVisible();
  await expect(theirs.getByRole("button", { name: /^Join as/ })).toHaveCount(0);
  // Sent anyway (an old tab, a script): refused, and no membership.
  const answer = await theirs.request.post(new URL(link!).pathname, { form: {}, headers: { Origin: new URL(link!).origin } });
  expect(answer.status()).toBe(403);
  await theirs.goto("/robots");
  await expect(theirs).toHaveURL(/\/welcome$/);
  await context.close();
});

test("a person with no workspace is offered to start one", async ({ page }) => {
  const stamp = Date.now().toString(36);
  await signInAsNewPerson(page, { login: `solo-${stamp}`, name: `Solo ${stamp}`, email: `solo.${stamp}@example.test` }, "/robots");
  await expect(page).toHaveURL(/\/welcome$/);
  await page.getByLabel("Workspace name").fill(`Tidepool Lab ${stamp}`);
  await page.getByRole("button", { name: "Create workspace" }).click();
  await expect(page.getByRole("heading", { name: `Tidepool Lab ${stamp}` })).toBeVisible();
  await expect(page.getByLabel("Your account")).toContainText("Owner");
});
