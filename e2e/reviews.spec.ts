// Versions and review in Chromium: the animator commits two versions of a
// demo gait and asks the lead for a review; the lead follows the e-mail's
// link to the comparison, reads the changed keys and metric deltas, approves
// and releases; the animator gets the decision mails.
import { demoPeople } from "../db/demo/scenario";
import { MAIL_API, latestMailTo, signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const GAIT = "Alternating tetrapod";
const ROBOT = "Hull climber";
const emailOf = (login: string) => demoPeople.find((person) => person.login === login)!.email;

/** The newest mail to `to` that mentions `needle` (other tests mail the same demo people). */
async function mailAbout(to: string, needle: string, subject: RegExp, timeoutMs = 10_000): Promise<{ subject: string; text: string }> {
  await latestMailTo(to, timeoutMs);
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const messages = (await (await fetch(`${MAIL_API}/messages?to=${encodeURIComponent(to)}`)).json()) as { subject: string; text: string }[];
    const found = messages.find((message) => message.text.includes(needle) && subject.test(message.subject));
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no mail to ${to} about "${needle}" with a subject like ${subject} within ${timeoutMs} ms`);
}

/** Starts the draft over from version `from`, commits it with `message`, and returns the new version's number. */
async function branchAndCommit(page: Page, from: number, message: string): Promise<number> {
  await page.getByRole("button", { name: `Start a new draft from version ${from}`, exact: true }).click();
  await expect(page.getByRole("status")).toContainText(`The working draft now starts from version ${from}`);
  await page.getByLabel("Version message").fill(message);
  await page.getByRole("button", { name: "Commit version" }).click();
  const notice = page.getByRole("status");
  await expect(notice).toContainText(/Committed version \d+\./);
  const number = Number((await notice.textContent())!.match(/Committed version (\d+)/)![1]);
  await expect(page.getByRole("table", { name: "Versions of this gait" }).getByRole("row").filter({ hasText: message })).toBeVisible();
  return number;
}

test("an animator commits two versions and asks for review; the lead compares them from the e-mail, approves and releases", async ({
  page,
  browser,
}, testInfo) => {
  // Two people, two commits, a review, a release: 58 s of the default 60 s at a load of 12 on 2 cores.
  test.setTimeout(120_000);
  const stamp = `${Date.now().toString(36)}-${testInfo.workerIndex}`;
  const messageA = `Wide stance, e2e ${stamp}`;
  const messageB = `Quicker sets of four, e2e ${stamp}`;

  // The animator finds the gait through the robot filter of the gaits list.
  await signInAs(page, "theo-brandt", "/gaits");
  await page.getByLabel("Robot", { exact: true }).selectOption({ label: ROBOT });
  await page.getByRole("button", { name: "Show" }).click();
  await expect(page.getByRole("heading", { level: 1, name: `Gaits of ${ROBOT}` })).toBeVisible();
  await page.getByRole("link", { name: GAIT, exact: true }).click();
  await expect(page.getByRole("heading", { level: 1, name: GAIT })).toBeVisible();

  // Two versions that differ: one branched from version 1, one from version 2.
  const numberA = await branchAndCommit(page, 1, messageA);
  const numberB = await branchAndCommit(page, 2, messageB);
  expect(numberB).toBeGreaterThan(numberA);

  // Review of B, against A, from the lead.
  await page.getByRole("link", { name: `Open version ${numberB}`, exact: true }).click();
  await expect(page.getByRole("heading", { level: 1, name: `${GAIT} v${numberB}` })).toBeVisible();
  await page.getByLabel("Reviewer", { exact: true }).selectOption({ label: "Mara Lindqvist (lead)" });
  await page.getByLabel("Compare with").selectOption({ label: `v${numberA} — ${messageA}` });
  await page.getByLabel("Note to the reviewer").fill("Shorter cycle; please check the joint speeds.");
  await page.getByRole("button", { name: "Request review" }).click();
  await expect(page.getByRole("status")).toContainText("Review requested from Mara Lindqvist. E-mail to Mara Lindqvist: queued.");
  await expect(page.getByLabel("Review", { exact: true }).getByText("In review with Mara Lindqvist.")).toBeVisible();
  // The animator sees the request's mail queued, and (below, once the lead has it) sent.
  const sentMail = page.getByRole("list", { name: "Your e-mails about this version" }).getByRole("listitem").filter({ hasText: "Review request" });
  await expect(sentMail).toContainText(emailOf("mara-lindqvist"));

  // The lead, in a browser of her own, follows the e-mail.
  const context = await browser.newContext();
  const lead = await context.newPage();
  await signInAs(lead, "mara-lindqvist");
  const request = await mailAbout(emailOf("mara-lindqvist"), messageB, /^Review requested/);
  expect(request.subject).toBe(`Review requested: ${GAIT} v${numberB} (${ROBOT})`);
  const link = request.text.match(/https?:\/\/\S+\/gaits\/compare\?a=\S+&b=\S+/)?.[0];
  expect(link, "the review e-mail links to the comparison").toBeTruthy();
  await expect(sentMail.getByText("sent", { exact: true })).toBeVisible();
  await expect(page.getByRole("status")).toContainText("Review requested from Mara Lindqvist.");
  await lead.goto(link!);
  await expect(lead.getByRole("heading", { level: 1, name: "Compare versions" })).toBeVisible();
  await expect(lead.getByRole("article", { name: `A: ${GAIT} v${numberA}` })).toContainText(messageA);
  await expect(lead.getByRole("article", { name: `B: ${GAIT} v${numberB}` })).toContainText(messageB);

  // The changed keys: v2's longer stride moves every foot; its higher steps change every swing.
  const keys = lead.getByRole("table", { name: "Changed keys" });
  await expect(keys).toBeVisible();
  await expect(keys.getByRole("row").filter({ hasText: "changed foot" }).first()).toBeVisible();
  await expect(keys.getByRole("row").filter({ hasText: "changed swing height" }).first()).toBeVisible();
  await expect(lead.getByTestId("diff-counts")).toContainText("16 changed in all");

  // The metric deltas: 1200 ms against 1100 ms, 40 mm against 44 mm of stride.
  const metrics = lead.getByRole("table", { name: "Metric deltas, B against A" });
  const cycle = metrics.getByRole("row", { name: /Cycle time/ });
  await expect(cycle).toContainText("1200 ms");
  await expect(cycle).toContainText("1100 ms");
  await expect(cycle).toContainText("−100 ms");
  await expect(metrics.getByRole("row", { name: /^Stride/ })).toContainText("+4.0 mm");
  await expect(metrics.getByRole("row", { name: /Peak joint speed/ })).toBeVisible();

  // Both robots play together.
  await lead.getByRole("group", { name: "Playback" }).getByRole("button", { name: "Play" }).click();
  await expect(lead.getByRole("group", { name: "Playback" }).getByRole("button", { name: "Pause" })).toBeVisible();
  await expect(lead.getByRole("list", { name: "Joint plots, A and B overlaid" }).getByRole("listitem")).toHaveCount(24);

  // Approve, then release.
  await lead
    .getByRole("article", { name: `B: ${GAIT} v${numberB}` })
    .getByRole("link", { name: `${GAIT} v${numberB}` })
    .click();
  await expect(lead.getByRole("heading", { level: 1, name: `${GAIT} v${numberB}` })).toBeVisible();
  await lead.getByLabel("Approval comment").fill("Joint speeds are within limits; good to go.");
  await lead.getByRole("button", { name: "Approve", exact: true }).click();
  await expect(lead.getByRole("status")).toContainText(`Version ${numberB} approved`);
  await lead.getByRole("button", { name: "Release", exact: true }).click();
  await expect(lead.getByRole("status")).toContainText(`Version ${numberB} released`);
  await expect(lead.getByRole("list", { name: "Review steps, oldest first" })).toContainText("Mara Lindqvist released it");
  await context.close();

  // The animator hears of both decisions, and the gait shows the release.
  const approved = await mailAbout(emailOf("theo-brandt"), messageB, /approved/);
  expect(approved.subject).toBe(`${GAIT} v${numberB} approved by Mara Lindqvist`);
  expect(approved.text).toContain("Joint speeds are within limits; good to go.");
  const released = await mailAbout(emailOf("theo-brandt"), messageB, /released/);
  expect(released.subject).toBe(`${GAIT} v${numberB} released by Mara Lindqvist`);
  // Firmware downloads the table, so it hears of the release too.
  const toFirmware = await mailAbout(emailOf("priya-sandoval"), messageB, /released/);
  expect(toFirmware.text).toContain(`/export?gait=`);
  await page.goto("/reviews");
  await expect(page.getByRole("listitem", { name: `${GAIT} v${numberB}` })).toContainText("Released");
});

test("a viewer reads versions but is offered no review or draft actions", async ({ page }) => {
  await signInAs(page, "kenji-wu", "/gaits");
  await page.getByRole("link", { name: "Tripod cruise", exact: true }).click();
  await expect(page.getByRole("table", { name: "Versions of this gait" })).toBeVisible();
  await expect(page.getByRole("button", { name: "Commit version" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: /Start a new draft/ })).toHaveCount(0);
  await page.getByRole("link", { name: "Open version 2", exact: true }).click();
  await expect(page.getByRole("button", { name: "Approve" })).toHaveCount(0);
  await expect(page.getByLabel("Review", { exact: true })).toContainText("In review with Mara Lindqvist.");
});
