// The gait editor in Chromium as the demo animator: a new tripod for the demo
// hexapod, a key dragged to a new time (flags and joint plots change), a foot
// dragged out of reach (unreachable flags at exactly the frames the engine
// finds), undo, and a reload that finds the draft as it was left. The editor
// passes axe-core without serious or critical violations.
import { parseSequence, solveSequence } from "../app/gait/index";
import { parseRobot } from "../app/kinematics/index";
import { axeViolations } from "./support/axe";
import { signInAs } from "./support/sign-in";
import { expect, test, type Locator, type Page } from "./support/test";

const uniqueName = (label: string) => `${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

async function createTripod(page: Page, name: string) {
  await signInAs(page, "theo-brandt", "/gaits/new");
  await page.goto("/gaits/new");
  await page.waitForLoadState("networkidle");
  const robot = page.getByLabel("Robot");
  const crawler = await robot.locator("option", { hasText: "Pier crawler" }).getAttribute("value");
  await robot.selectOption(crawler!);
  await page.getByLabel("Name").fill(name);
  await page.getByRole("radio", { name: /tripod/ }).check();
  await page.getByRole("button", { name: "Create and open the editor" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await expect(page.getByTestId("save-status")).toHaveAttribute("data-status", "saved");
}

async function drag(page: Page, target: Locator, dx: number, dy: number) {
  const box = (await target.boundingBox())!;
  const x = box.x + box.width / 2;
  const y = box.y + box.height / 2;
  await page.mouse.move(x, y);
  await page.mouse.down();
  await page.mouse.move(x + dx / 3, y + dy / 3, { steps: 4 });
  await page.mouse.move(x + dx, y + dy, { steps: 8 });
  await page.mouse.up();
}

async function saved(page: Page) {
  await expect(page.getByTestId("save-status")).toHaveAttribute("data-status", "saved", { timeout: 10_000 });
}

/** Every frame of the listed flag runs of one kind and leg, from the Checks list. */
async function listedFrames(page: Page, kind: string, leg: string): Promise<number[]> {
  const runs = await page
    .getByTestId("checks")
    .locator(`button[data-flag-kind="${kind}"][data-leg="${leg}"]`)
    .evaluateAll((buttons) => buttons.map((button) => [Number(button.getAttribute("data-from")), Number(button.getAttribute("data-to"))]));
  return runs.flatMap(([from, to]) => Array.from({ length: to - from + 1 }, (_, i) => from + i)).sort((a, b) => a - b);
}

/** What the engine says about the stored draft, solved here in Node with the same code. */
async function engineFrames(page: Page, gaitId: string, kind: string, leg: string): Promise<number[]> {
  const draft = await (await page.request.get(`/api/v1/gaits/${gaitId}/draft`)).json();
  const robotJson = await (await page.request.get(`/api/v1/robots/${draft.robot.id}`)).json();
  expect(robotJson.latest.number, "the demo robot has not changed since the draft pinned it").toBe(draft.robot.revision);
  const robot = parseRobot(robotJson.latest.definition);
  const sequence = parseSequence(draft.sequence);
  if (!robot.ok || !sequence.ok) throw new Error("the stored draft or robot does not parse");
  return solveSequence(robot.robot, sequence.sequence)
    .flags.filter((flag) => flag.kind === kind && flag.leg === leg)
    .map((flag) => flag.frame)
    .sort((a, b) => a - b);
}

const femurCurve = (page: Page) => page.getByTestId("joint-plots").locator('svg[data-joint="femur"] path').last().getAttribute("d");

test("animator: new tripod, drag a key, drag a foot out of reach, undo, reload — the draft is as left, and axe finds nothing serious", async ({ page }) => {
  test.setTimeout(90_000);
  const name = uniqueName("E2E tripod");
  await createTripod(page, name);
  const gaitId = new URL(page.url()).pathname.split("/")[2];

  // A fresh tripod on the demo hexapod passes every check.
  await expect(page.getByTestId("checks-count")).toContainText("no flags");
  const curveBefore = await femurCurve(page);

  // LF touches down at frame 30 of 60; drag it ten frames later. For those frames only two feet are down.
  const touchDown = page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 30 / });
  const lanes = (await page.getByTestId("timeline-lanes").boundingBox())!;
  await drag(page, touchDown, (lanes.width / 60) * 10, 0);
  const moved = page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 40 / });
  await expect(moved).toBeVisible();
  await expect(moved).toHaveAttribute("aria-pressed", "true");
  await expect(page.getByTestId("checks-count")).not.toContainText("no flags");
  await expect(page.locator('[data-track="body"] [data-flag-kind="support-count"]').first()).toBeAttached();
  await expect.poll(() => femurCurve(page)).not.toBe(curveBefore);
  await saved(page);
  await expect(page.getByTestId("checks-status")).toHaveText("Server reference agrees with the browser preview.", { timeout: 10_000 });
  const supportFramesAfterMove = await listedFrames(page, "support-count", "body");
  expect(supportFramesAfterMove.length).toBeGreaterThan(0);

  // The selected touch-down places the foot: drag it far out to the front left.
  const handle = page.getByTestId("foot-handle");
  await expect(handle).toBeVisible();
  await drag(page, handle, -140, -140);
  await expect(page.getByTestId("checks").locator('button[data-flag-kind="unreachable"][data-leg="LF"]').first()).toBeVisible();
  await saved(page);
  await expect(page.getByTestId("checks-status")).toHaveText("Server reference agrees with the browser preview.", { timeout: 10_000 });
  const listed = await listedFrames(page, "unreachable", "LF");
  expect(listed.length).toBeGreaterThan(10);
  expect(listed).toEqual(await engineFrames(page, gaitId, "unreachable", "LF"));
  // The foot stays planted from touch-down (frame 40) to lift-off (frame 60, which is frame 0): all of it out of reach.
  for (let frame = 40; frame < 60; frame += 1) expect(listed).toContain(frame);

  // Undo puts the foot back: no unreachable flags, the moved key stays.
  await page.getByRole("button", { name: "Undo" }).click();
  await expect(page.getByTestId("checks").locator('button[data-flag-kind="unreachable"]')).toHaveCount(0);
  await expect(moved).toBeVisible();
  await saved(page);
  const left = await (await page.request.get(`/api/v1/gaits/${gaitId}/draft`)).json();

  // Reload: the draft is as left, with no offer to restore anything.
  await page.reload();
  await page.waitForLoadState("networkidle");
  await expect(page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 40 / })).toBeVisible();
  await expect(page.getByText("Unsaved changes found in this browser")).toHaveCount(0);
  await expect(page.getByTestId("checks").locator('button[data-flag-kind="unreachable"]')).toHaveCount(0);
  const reloaded = await (await page.request.get(`/api/v1/gaits/${gaitId}/draft`)).json();
  expect(reloaded.sequence).toEqual(left.sequence);
  expect(reloaded.revision).toBe(left.revision);
  expect(await listedFrames(page, "support-count", "body")).toEqual(supportFramesAfterMove);

  // axe-core on the editor (the main content; the shell has its own checks).
  await page.getByRole("button", { name: /^LF key 2 of 2/ }).click();
  const violations = await axeViolations(page, ["serious", "critical"]);
  expect(violations).toEqual([]);
});

test("keyboard: shortcuts step the playhead, add and delete a key, and the help dialog lists them", async ({ page }) => {
  const name = uniqueName("E2E keys");
  await createTripod(page, name);
  const readout = page.getByTestId("frame-readout");
  await page.getByRole("heading", { level: 1, name }).click();
  await page.keyboard.press("ArrowRight");
  await page.keyboard.press("Shift+ArrowRight");
  await expect(readout).toContainText("frame 11 /");
  await page.keyboard.press("a");
  await expect(page.getByRole("button", { name: /^LF key 2 of 3, lift-off at frame 11 / })).toBeVisible();
  await page.keyboard.press("Delete");
  await expect(page.getByRole("button", { name: /^LF key \d of 3/ })).toHaveCount(0);
  await page.keyboard.press("Control+z");
  await expect(page.getByRole("button", { name: /^LF key 2 of 3/ })).toBeVisible();
  await page.keyboard.press("?");
  const help = page.getByRole("dialog", { name: "Keyboard shortcuts" });
  await expect(help).toBeVisible();
  await expect(help.getByRole("row", { name: /Play or pause/ })).toBeVisible();
  await help.getByRole("button", { name: "Close" }).click();
  await expect(help).toBeHidden();
});

test("a viewer sees the editor read-only: no key commands, no commit, nothing saved", async ({ browser }) => {
  const animator = await browser.newPage();
  const name = uniqueName("E2E shown");
  await createTripod(animator, name);
  const gaitId = new URL(animator.url()).pathname.split("/")[2];
  await animator.close();

  const page = await browser.newPage();
  await signInAs(page, "kenji-wu", `/gaits/${gaitId}/edit`);
  await page.goto(`/gaits/${gaitId}/edit`);
  await page.waitForLoadState("networkidle");
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByText("Read only: your role can view this gait.")).toBeVisible();
  await expect(page.getByRole("button", { name: "Commit version" })).toHaveCount(0);
  await expect(page.getByRole("toolbar", { name: "Key commands" })).toHaveCount(0);
  await expect(page.getByTestId("save-status")).toHaveAttribute("data-status", "read-only");
  await page.getByRole("button", { name: /^LF key 2 of 2/ }).click();
  await page.keyboard.press("Delete");
  await expect(page.getByTestId("editor-notice")).toHaveText(/Your role can view this gait but not change it/);
  await expect(page.getByRole("button", { name: /^LF key 2 of 2/ })).toBeVisible();
  await page.close();
});

test("never lost: edits made while the server is unreachable come back after a reload and are saved", async ({ page, context }) => {
  const name = uniqueName("E2E offline");
  await createTripod(page, name);
  await context.route("**/api/v1/gaits/*/draft", (route) => (route.request().method() === "PUT" ? route.abort("internetdisconnected") : route.continue()));
  await page.getByRole("button", { name: /^LF key 2 of 2/ }).click();
  for (let i = 0; i < 3; i += 1) await page.keyboard.press("]");
  await expect(page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 33 / })).toBeVisible();
  await expect(page.getByTestId("save-status")).toHaveAttribute("data-status", "offline", { timeout: 10_000 });

  await page.reload();
  await page.waitForLoadState("networkidle");
  await expect(page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 30 / })).toBeVisible();
  const offer = page.getByRole("alert").filter({ hasText: "Unsaved changes found in this browser" });
  await expect(offer).toBeVisible();
  await context.unroute("**/api/v1/gaits/*/draft");
  await offer.getByRole("button", { name: "Restore them" }).click();
  await expect(page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 33 / })).toBeVisible();
  await saved(page);

  await page.reload();
  await page.waitForLoadState("networkidle");
  await expect(page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 33 / })).toBeVisible();
  await expect(page.getByText("Unsaved changes found in this browser")).toHaveCount(0);
});

test("never lost: a stale save offers their draft or a copy of mine; both keep every edit", async ({ page, context }) => {
  const name = uniqueName("E2E clash");
  await createTripod(page, name);
  const gaitUrl = page.url();
  const other = await context.newPage();
  await other.goto(gaitUrl);
  await other.waitForLoadState("networkidle");

  // The first tab saves first.
  await page.getByRole("button", { name: /^LF key 2 of 2/ }).click();
  await page.keyboard.press("]");
  await saved(page);

  // The second tab still edits the older revision: its save is refused.
  await other.getByRole("button", { name: /^RF key 2 of 2/ }).click();
  await other.keyboard.press("]");
  const clash = other.getByRole("alert").filter({ hasText: "Someone else saved this draft" });
  await expect(clash).toBeVisible({ timeout: 10_000 });
  await expect(clash).toContainText("Nothing was saved.");

  // Reload theirs: their key moved, mine is one Undo away, and undoing saves on top of theirs.
  await clash.getByRole("button", { name: /^Reload theirs/ }).click();
  await expect(other.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 31 / })).toBeVisible();
  await expect(other.getByRole("button", { name: /^RF key 2 of 2, lift-off at frame 30 / })).toBeVisible();
  await saved(other);
  await other.getByRole("button", { name: "Undo" }).click();
  await expect(other.getByRole("button", { name: /^RF key 2 of 2, lift-off at frame 31 / })).toBeVisible();
  await saved(other);

  // Now the first tab is behind: it keeps its next edit as a copy instead.
  await page.getByRole("button", { name: /^RR key 2 of 2/ }).click();
  await page.keyboard.press("]");
  const second = page.getByRole("alert").filter({ hasText: "Someone else saved this draft" });
  await expect(second).toBeVisible({ timeout: 10_000 });
  const copyName = `${name} (mine)`;
  await second.getByLabel("Name of the copy").fill(copyName);
  await second.getByRole("button", { name: "Keep mine as a copy" }).click();
  await expect(page.getByRole("heading", { level: 1, name: copyName })).toBeVisible();
  await expect(page.getByRole("button", { name: /^RR key 2 of 2, lift-off at frame 31 / })).toBeVisible();
  await expect(page.getByRole("button", { name: /^LF key 2 of 2, touch-down at frame 31 / })).toBeVisible();
  await other.close();
});
