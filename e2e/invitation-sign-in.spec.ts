// An invitation followed by someone who is not signed in (issue 16): the
// sign-in page names the invitation, the header's "Sign in" keeps it, joining
// is confirmed, and the link used again answers a readable 410 page.
import { axeViolations } from "./support/axe";
import { latestMailTo, signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const shots = process.env.GAITLOOM_SHOTS ?? null;

async function expectNoSeriousAxeViolations(page: Page) {
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
}

test("a newcomer follows an invitation through sign-in, joins with a confirmation, and the used link explains itself", async ({ page, browser }) => {
  // Two people, a mail through the job runner and four pages checked with axe: longer than one page's journey.
  test.setTimeout(120_000);
  const stamp = Date.now().toString(36);
  const newcomer = { login: `rowan-${stamp}`, name: `Rowan Tide ${stamp}`, email: `rowan.${stamp}@breakwater-lab.test` };

  await signInAs(page, "ines-okafor", "/settings/members");
  await page.getByLabel("E-mail").fill(newcomer.email);
  await page.getByLabel("Role").last().selectOption("animator");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByRole("status")).toContainText(`Invitation for ${newcomer.email} created`);
  const link = (await latestMailTo(newcomer.email, 20_000)).text.match(/https?:\/\/\S+\/invitations\/\S+/)?.[0];
  expect(link, "the invitation e-mail carries a link").toBeTruthy();
  const invitationPath = new URL(link!).pathname;

  const context = await browser.newContext();
  const theirs = await context.newPage();
  await theirs.goto(link!);
  await expect(theirs).toHaveURL(/\/sign-in\?returnTo=/);
  await expect(theirs.getByRole("heading", { level: 1, name: "Sign in to join Breakwater Robotics Lab" })).toBeVisible();
  const invitation = theirs.getByRole("region", { name: "Your invitation" });
  await expect(invitation).toContainText("Ines Okafor invited r***@breakwater-lab.test to work in Breakwater Robotics Lab as animator.");
  await expect(invitation).not.toContainText(newcomer.email);
  await expectNoSeriousAxeViolations(theirs);
  if (shots) await theirs.screenshot({ path: `${shots}/3-sign-in-names-invitation.png`, fullPage: true });

  // The header's "Sign in" keeps the way to the invitation.
  const headerSignIn = theirs.getByRole("banner").getByRole("link", { name: "Sign in" });
  await expect(headerSignIn).toHaveAttribute("href", `/sign-in?returnTo=${encodeURIComponent(invitationPath)}`);
  await headerSignIn.click();
  await expect(theirs.getByRole("region", { name: "Your invitation" })).toContainText("as animator");

  // Signing in (a new account on the local GitHub) comes back to the invitation.
  await theirs.getByRole("button", { name: "Sign in with GitHub" }).click();
  await theirs.getByLabel("Login").fill(newcomer.login);
  await theirs.getByLabel("Name").fill(newcomer.name);
  await theirs.getByLabel("E-mail").fill(newcomer.email);
  await theirs.getByRole("button", { name: "Continue as this person" }).click();
  await expect(theirs).toHaveURL(new RegExp(`${invitationPath}$`));
  await theirs.getByRole("button", { name: "Join as animator" }).click();

  // Joined: said on the start page.
  await expect(theirs.getByRole("status").filter({ hasText: "You joined" })).toContainText("You joined Breakwater Robotics Lab as animator.");
  await expect(theirs.getByLabel("Your account")).toContainText("Animator");
  await expectNoSeriousAxeViolations(theirs);
  if (shots) await theirs.screenshot({ path: `${shots}/3-joined-confirmation.png`, fullPage: true });

  // The link used again: a 410 page in words, not "Internal Server Error".
  const answer = await theirs.goto(link!);
  expect(answer?.status()).toBe(410);
  await expect(theirs.getByRole("heading", { name: "This link no longer works" })).toBeVisible();
  await expect(theirs.getByText("This invitation link was already used.")).toBeVisible();
  await expect(theirs.getByText("Internal Server Error")).toHaveCount(0);
  await expectNoSeriousAxeViolations(theirs);
  if (shots) await theirs.screenshot({ path: `${shots}/3-used-link-410.png`, fullPage: true });
  await context.close();

  // Signed out, the used link's sign-in page says so before anyone signs in.
  const stranger = await browser.newPage();
  await stranger.goto(link!);
  await expect(stranger.getByRole("region", { name: "Your invitation" })).toContainText("The invitation link no longer works.");
  await expect(stranger.getByRole("region", { name: "Your invitation" })).toContainText("This invitation link was already used.");
  await expectNoSeriousAxeViolations(stranger);
  if (shots) await stranger.screenshot({ path: `${shots}/3-sign-in-ended-invitation.png`, fullPage: true });
  await stranger.close();
});
