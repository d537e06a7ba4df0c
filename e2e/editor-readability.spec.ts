// Issue 16, item 5, as the animator who hit it: on a gait full of flags the
// timeline's badges are whole and apart, the top view's leg labels do not
// overlap, the parameters are on screen with the timeline at 1440×900 and
// 1280×800, keys show a focus ring, the foot handle says how to move it and
// moves by keyboard, and the check summary counts frames as frames and flags
// as flags. A viewer's read-only editor does not invite a drag.
import { parseSequence, solveSequence } from "../app/gait/index";
import { parseRobot } from "../app/kinematics/index";
import { axeViolations } from "./support/axe";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const shot = async (page: Page, name: string, fullPage = true) => {
  if (process.env.GAITLOOM_SHOTS) await page.screenshot({ path: `${process.env.GAITLOOM_SHOTS}/5-${name}.png`, fullPage });
};

type Box = { x: number; y: number; width: number; height: number };
const overlap = (a: Box, b: Box) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

async function createTripod(page: Page, name: string): Promise<string> {
  await signInAs(page, "theo-brandt", "/gaits/new");
  await page.waitForLoadState("networkidle");
  const robot = page.getByLabel("Robot");
  await robot.selectOption((await robot.locator("option", { hasText: "Pier crawler" }).getAttribute("value"))!);
  await page.getByLabel("Name").fill(name);
  await page.getByRole("radio", { name: /tripod/ }).check();
  await page.getByRole("button", { name: "Create and open the editor" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await page.waitForLoadState("networkidle");
  await expect(page.getByTestId("save-status")).toHaveAttribute("data-status", "saved");
  return new URL(page.url()).pathname.split("/")[2];
}

async function setParameter(page: Page, label: RegExp, value: string) {
  const field = page.getByRole("region", { name: "Template and parameters" }).getByLabel(label);
  await field.fill(value);
  await field.press("Enter");
}

/** At this window size, with the page at its top, the whole parameter panel and the timeline's tracks (the gait diagram) are on screen together. */
async function expectParametersBesideTimeline(page: Page, width: number, height: number) {
  await page.setViewportSize({ width, height });
  await page.evaluate(() => window.scrollTo(0, 0));
  const tracks = (await page.getByTestId("timeline-lanes").boundingBox())!;
  const parameters = (await page.getByRole("region", { name: "Template and parameters" }).boundingBox())!;
  expect(parameters.y, `${width}×${height}: the parameter panel starts on screen`).toBeGreaterThanOrEqual(0);
  expect(parameters.y + parameters.height, `${width}×${height}: the parameter panel ends on screen`).toBeLessThanOrEqual(height);
  expect(tracks.y + tracks.height, `${width}×${height}: the timeline's tracks end on screen (${Math.round(tracks.y + tracks.height)} px)`).toBeLessThanOrEqual(
    height,
  );
}

test("animator: a gait full of flags stays readable, and the parameters sit with the timeline", async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 900 });
  const name = `E2E dense ${Date.now().toString(36)}`;
  const gaitId = await createTripod(page, name);
  await expectParametersBesideTimeline(page, 1440, 900);
  await expectParametersBesideTimeline(page, 1280, 800);
  await shot(page, "layout-1280x800", false);
  await page.setViewportSize({ width: 1440, height: 900 });

  // A long, quick stride: out of reach, past limits and too fast on many frames.
  await setParameter(page, /^Stride/, "200");
  await setParameter(page, /^Cycle time/, "500");
  await expect(page.getByTestId("checks-count")).not.toContainText("no flags");
  await expect(page.getByTestId("save-status")).toHaveAttribute("data-status", "saved", { timeout: 10_000 });
  await expect(page.getByTestId("checks-status")).toHaveText("Server reference agrees with the browser preview.", { timeout: 15_000 });

  // Badges: each one's text whole, and none on top of another on its track.
  const tracks = page.getByTestId("timeline-lanes").locator("[data-track]");
  let badgeCount = 0;
  for (const track of await tracks.all()) {
    const badges = track.locator("[data-flag-kind]");
    const boxes: Box[] = [];
    for (const badge of await badges.all()) {
      const { cut, text } = await badge.evaluate((element) => ({ cut: element.scrollWidth > element.clientWidth + 0.5, text: element.textContent }));
      expect(cut, `badge "${text}" is cut`).toBe(false);
      expect(text).toMatch(/^[▲◆] [A-Za-z]+( \+\d+)?$/);
      boxes.push((await badge.boundingBox())!);
    }
    badgeCount += boxes.length;
    for (let i = 0; i < boxes.length; i += 1)
      for (let j = i + 1; j < boxes.length; j += 1) expect(overlap(boxes[i], boxes[j]), `badges ${i} and ${j} overlap`).toBe(false);
  }
  expect(badgeCount).toBeGreaterThan(3);

  // The summary counts frames as frames and flags as flags: the engine's own numbers for the stored draft.
  const draft = await (await page.request.get(`/api/v1/gaits/${gaitId}/draft`)).json();
  const robotJson = await (await page.request.get(`/api/v1/robots/${draft.robot.id}`)).json();
  const robot = parseRobot(robotJson.latest.definition);
  const sequence = parseSequence(draft.sequence);
  if (!robot.ok || !sequence.ok) throw new Error("the stored draft or robot does not parse");
  const flags = solveSequence(robot.robot, sequence.sequence).flags;
  const errorFrames = new Set(flags.filter((flag) => flag.severity === "error").map((flag) => flag.frame)).size;
  const warningFrames = new Set(flags.filter((flag) => flag.severity === "warning").map((flag) => flag.frame)).size;
  expect(flags.length, "more flags than frames, as in the report").toBeGreaterThan(errorFrames);
  await expect(page.getByTestId("checks-count")).toHaveText(
    new RegExp(`^Server: ${errorFrames} frames? with errors, ${warningFrames} with warnings \\(${flags.length} flags\\) in \\d+ runs?\\.$`),
  );

  // The top view's leg labels sit apart.
  const labels = page.getByRole("region", { name: "Robot view" }).locator("figure").first().locator("g[data-leg] text");
  const labelBoxes = await Promise.all((await labels.all()).map(async (label) => ({ text: await label.textContent(), box: (await label.boundingBox())! })));
  expect(labelBoxes).toHaveLength(6);
  for (let i = 0; i < labelBoxes.length; i += 1) {
    for (let j = i + 1; j < labelBoxes.length; j += 1)
      expect(overlap(labelBoxes[i].box, labelBoxes[j].box), `${labelBoxes[i].text} and ${labelBoxes[j].text}`).toBe(false);
  }

  // A key shows a focus ring when reached by keyboard.
  const key = page.getByRole("button", { name: /^LF key 2 of 2, touch-down/ });
  await page.getByRole("heading", { level: 1, name }).click();
  await page.keyboard.press("Shift");
  await key.focus();
  expect(await key.evaluate((element) => [getComputedStyle(element).outlineStyle, getComputedStyle(element).outlineWidth])).toEqual(["solid", "2px"]);

  // The foot handle: a grab cursor, a hint in words, and the arrow keys move the foot.
  await key.click();
  const handle = page.getByTestId("foot-handle");
  await expect(handle).toBeVisible();
  expect(await handle.evaluate((element) => getComputedStyle(element).cursor)).toBe("grab");
  await expect(page.getByTestId("foot-hint")).toHaveText(/Drag it, or Tab to it and use the arrow keys \(Shift: 10 mm\)\./);
  const xOf = async () => Number((await handle.getAttribute("aria-label"))!.match(/x (-?\d+) mm/)![1]);
  const before = await xOf();
  await handle.focus();
  await page.keyboard.press("Shift+ArrowUp");
  await page.keyboard.press("ArrowUp");
  await expect.poll(xOf).toBe(before + 11);
  await shot(page, "dense-flags");
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
});

test("viewer: the read-only timeline does not say to drag keys", async ({ page }) => {
  await signInAs(page, "kenji-wu", "/gaits");
  const href = await page.getByRole("link", { name: "Tripod cruise" }).first().getAttribute("href");
  await page.goto(`${href}/edit`);
  const timeline = page.getByRole("region", { name: "Timeline" });
  await expect(timeline.getByText("Click a key to see its details; your role cannot move keys.")).toBeVisible();
  await expect(timeline.getByText(/drag keys/i)).toHaveCount(0);
  await shot(page, "read-only");
  expect(await axeViolations(page, ["serious", "critical"])).toEqual([]);
});
