// Robots in the browser: upload, edit and save, revision history, invalid
// uploads, URDF import, download, the stale-save conflict and firmware's
// calibration-only form. Robot names are unique per run and worker.
import { readFileSync } from "node:fs";
import { readFile } from "node:fs/promises";
import { axeViolations } from "./support/axe";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

const quayWalker = JSON.parse(readFileSync(new URL("../db/demo/robots/quay-walker.json", import.meta.url), "utf8"));
const crabUrdf = readFileSync(new URL("../test/kinematics/fixtures/test-crab.urdf", import.meta.url));

const uniqueName = (label: string) => `${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const slugOf = (name: string) =>
  name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "");

/** The page has hydrated: typing now goes through React. */
async function ready(page: Page) {
  await page.waitForLoadState("networkidle");
}

async function uploadDefinition(page: Page, definition: unknown, fileName = "robot.json") {
  await page.goto("/robots?add=upload");
  await ready(page);
  await page
    .getByLabel("Definition file (JSON)")
    .setInputFiles({ name: fileName, mimeType: "application/json", buffer: Buffer.from(JSON.stringify(definition, null, 2)) });
  await page.getByRole("button", { name: "Upload and create" }).click();
}

async function expectNoAxeViolations(page: Page) {
  // Our part of the page: the main content (the shell around it has its own checks).
  expect(await axeViolations(page)).toEqual([]);
}

test("create a robot by uploading JSON, edit a link length and save as revision 2, then download it", async ({ page }) => {
  const name = uniqueName("E2E walker");
  await signInAs(page, "theo-brandt", "/robots");
  await uploadDefinition(page, { ...quayWalker, name }, "walker.json");

  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByRole("img", { name: `Top view of ${name}` })).toBeVisible();
  await expect(page.getByRole("img", { name: `Side view of ${name}, from the right` })).toBeVisible();
  const history = page.getByRole("table", { name: "Revision history, newest first" });
  await expect(history.getByRole("row")).toHaveCount(2);
  await expect(history).toContainText("Uploaded from walker.json");
  await ready(page);

  // Inline validation next to the field, on every change.
  const femur = page.getByRole("textbox", { name: "LF femur length (mm)" });
  await femur.fill("-5");
  await expect(page.getByText("must be at least 1 (got -5)").first()).toBeVisible();
  await expect(page.getByRole("button", { name: "Save as revision 2" })).toBeDisabled();
  await femur.fill("88");
  await expect(page.getByRole("region", { name: "Problems" })).toHaveCount(0);

  await page.getByLabel("What changed (optional)").fill("Longer femur on LF");
  await page.getByRole("button", { name: "Save as revision 2" }).click();
  await expect(page.getByText("✓ Saved as revision 2.")).toBeVisible();
  await expect(history.getByRole("row")).toHaveCount(3);
  await expect(history.getByRole("row").nth(1)).toContainText("Longer femur on LF");
  await expect(history.getByRole("row").nth(1)).toContainText("Theo Brandt");
  await expect(page.getByRole("textbox", { name: "LF femur length (mm)" })).toHaveValue("88");
  await expect(page.getByRole("button", { name: "Save as revision 3" })).toBeDisabled();

  const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download JSON of revision 2" }).click()]);
  expect(download.suggestedFilename()).toBe(`${slugOf(name)}-r2.robot.json`);
  const saved = JSON.parse(await readFile((await download.path())!, "utf8"));
  expect(saved.name).toBe(name);
  expect(saved.legs[0].femur).toBe(88);

  // The old revision can be opened read-only.
  await page.getByRole("link", { name: "View revision 1" }).click();
  await expect(page.getByRole("heading", { level: 1, name: `${name}, revision 1` })).toBeVisible();
  await expect(page.getByRole("textbox", { name: "LF femur length (mm)" })).toHaveValue(String(quayWalker.legs[0].femur));
  await expect(page.getByRole("textbox", { name: "LF femur length (mm)" })).toHaveAttribute("readonly", "");
});

test("an invalid upload lists the exact path and message, and saves nothing", async ({ page }) => {
  const name = uniqueName("E2E broken");
  const broken = structuredClone(quayWalker);
  broken.name = name;
  broken.legs[2].joints.femur.minDeg = 40;
  broken.legs[2].joints.femur.maxDeg = 30;
  await signInAs(page, "theo-brandt", "/robots");
  await uploadDefinition(page, broken, "broken.json");

  const alert = page.getByRole("alert");
  await expect(alert).toContainText("The definition has 1 problem. Nothing was saved.");
  await expect(alert.getByRole("listitem")).toHaveText(["Leg RF, femur minimum must be below the maximum (got 40 ≥ 30)"]);
  await expect(page).toHaveURL(/\/robots\?(index&)?add=upload$/);
  await page.goto("/robots");
  await expect(page.getByRole("link", { name })).toHaveCount(0);
});

test("import a URDF file: the report says what was mapped and the robot opens", async ({ page }) => {
  const name = uniqueName("E2E crab");
  await signInAs(page, "theo-brandt", "/robots?add=urdf");
  await ready(page);
  await page.getByLabel("URDF file", { exact: true }).setInputFiles({ name: "test-crab.urdf", mimeType: "application/xml", buffer: crabUrdf });
  await page.getByLabel("Name (empty: the URDF robot's)").fill(name);
  await page.getByRole("button", { name: "Import and create" }).click();

  const status = page.getByRole("status").filter({ hasText: "from the URDF file" });
  await expect(status).toContainText(`✓ Created ${name} from the URDF file.`);
  await expect(status).toContainText('base link "base_link" is the body frame; 4 legs found');
  await expect(status).toContainText('leg FL: fl_coxa → fl_femur → fl_tibia → foot "fl_foot"');
  await expect(status).toContainText("servo mapping not in URDF");
  await status.getByRole("link", { name }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByRole("table", { name: "Revision history, newest first" })).toContainText("Imported from URDF test-crab.urdf");
});

test("a save from a stale base gets the conflict message and the edits stay in the form", async ({ page, context }) => {
  const name = uniqueName("E2E conflict");
  await signInAs(page, "theo-brandt", "/robots");
  await uploadDefinition(page, { ...quayWalker, name });
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  const address = page.url();

  const other = await context.newPage();
  await other.goto(address);
  await ready(other);
  await other.getByRole("textbox", { name: "RR tibia length (mm)" }).fill("130");
  await other.getByRole("button", { name: "Save as revision 2" }).click();
  await expect(other.getByText("✓ Saved as revision 2.")).toBeVisible();

  await ready(page);
  await page.getByRole("textbox", { name: "LF coxa length (mm)" }).fill("39");
  await page.getByRole("button", { name: "Save as revision 2" }).click();
  const conflict = page.getByRole("alert").filter({ hasText: "Not saved" });
  await expect(conflict).toContainText("Revision 2 was saved by Theo Brandt");
  await expect(conflict).toContainText("while you were editing revision 1. Nothing was saved. Your edits are still in the form.");
  await expect(page.getByRole("textbox", { name: "LF coxa length (mm)" })).toHaveValue("39");

  await conflict.getByRole("button", { name: "Save mine as revision 3 anyway" }).click();
  await expect(page.getByText("✓ Saved as revision 3.")).toBeVisible();
  await expect(page.getByRole("textbox", { name: "LF coxa length (mm)" })).toHaveValue("39");
});

test("firmware changes calibration only: geometry is locked, a zero offset saves", async ({ page, browser }) => {
  const name = uniqueName("E2E calibration");
  await signInAs(page, "theo-brandt", "/robots");
  await uploadDefinition(page, { ...quayWalker, name });
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  const address = new URL(page.url()).pathname;

  const firmware = await (await browser.newContext()).newPage();
  await signInAs(firmware, "priya-sandoval", address);
  await expect(firmware.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(firmware.getByText("As firmware you can change each joint's zero offset and servo mapping.")).toBeVisible();
  await ready(firmware);
  await expect(firmware.getByRole("textbox", { name: "LF femur length (mm)" })).toHaveAttribute("readonly", "");
  await expect(firmware.getByRole("button", { name: "Mirror left → right" })).toHaveCount(0);
  await firmware.getByRole("textbox", { name: "LF tibia zero offset (degrees)" }).fill("-6.5");
  await firmware.getByRole("checkbox", { name: "RR femur servo reversed" }).click();
  await firmware.getByRole("button", { name: "Save as revision 2" }).click();
  await expect(firmware.getByText("✓ Saved as revision 2.")).toBeVisible();
  await expect(firmware.getByRole("table", { name: "Revision history, newest first" }).getByRole("row").nth(1)).toContainText("Priya Sandoval");
});

test("a viewer reads a robot without controls, and the robot pages pass axe", async ({ page, browser }) => {
  await signInAs(page, "kenji-wu", "/robots");
  await expect(page.getByRole("link", { name: "Upload definition" })).toHaveCount(0);
  await page.getByRole("link", { name: "Pier crawler" }).click();
  await expect(page.getByText("You can read this robot; your role cannot change it.")).toBeVisible();
  await expect(page.getByRole("button", { name: /Save as revision/ })).toHaveCount(0);
  await ready(page);
  await expectNoAxeViolations(page);

  const animator = await (await browser.newContext()).newPage();
  await signInAs(animator, "theo-brandt", "/robots?add=new");
  await expect(animator.getByRole("heading", { name: "New robot" })).toBeVisible();
  await expectNoAxeViolations(animator);
  await animator.getByRole("link", { name: "Quay walker" }).click();
  await expect(animator.getByRole("heading", { level: 1, name: "Quay walker" })).toBeVisible();
  await ready(animator);
  await expectNoAxeViolations(animator);
});

test("a new robot from the starter template opens with its views", async ({ page }) => {
  const name = uniqueName("E2E starter");
  await signInAs(page, "mara-lindqvist", "/robots?add=new");
  await ready(page);
  await page.getByLabel("Name", { exact: true }).fill(name);
  await page.getByLabel("Start from").selectOption({ label: "8 legs" });
  await page.getByRole("button", { name: "Create robot" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByRole("list", { name: "Legs in the views" }).getByRole("listitem")).toHaveCount(8);
});
