// URDF gives angles in radians, often written to four or five digits from
// whole degrees (0.7854 for 45°); the import must not show 45.0001052296°. A
// value written to four or more significant digits reads as the degree value
// with the fewest decimals within its last digit's rounding; a shorter one
// (0.5 rad) is taken as written, to 0.001°. The report shows at most three
// decimals. Decision 014.
import { describe, expect, it } from "vitest";
import { importUrdf, type Robot } from "../../app/kinematics";
import { fixtureText } from "../support/robots";

const urdf = fixtureText("test-crab.urdf");

/** The fixture with one attribute of the named joint's line replaced (one joint per line). */
function withJoint(jointName: string, attribute: string, value: string, xml = urdf): string {
  const lines = xml.split("\n");
  const index = lines.findIndex((line) => line.includes(`<joint name="${jointName}"`));
  if (index < 0) throw new Error(`no joint ${jointName} in the fixture`);
  const pattern = new RegExp(`${attribute}="[^"]*"`);
  if (!pattern.test(lines[index])) throw new Error(`joint ${jointName} has no ${attribute}`);
  lines[index] = lines[index].replace(pattern, `${attribute}="${value}"`);
  return lines.join("\n");
}

function imported(xml: string): { robot: Robot; report: string[] } {
  const result = importUrdf(xml, { standHeightMm: 80 });
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result;
}

const frontLeft = (robot: Robot) => robot.legs.find((leg) => leg.id === "FL")!;

describe("URDF angles written in short radians come in as the degrees they stand for", () => {
  it("a mount yaw of 0.7854 rad is 45° (not 45.0001052296°), in the robot and in the report", () => {
    const { robot, report } = imported(withJoint("fl_coxa", "rpy", "0 0 0.7854"));
    expect(frontLeft(robot).mount.yawDeg).toBe(45);
    const line = report.find((entry) => entry.startsWith("leg FL:"));
    expect(line).toContain("yaw 45°;");
    expect(report.join("\n")).not.toMatch(/45\.000/);
  });

  it("0.6109 rad (four digits) is 35°, and limits of ±1.5708 rad are ±90°", () => {
    let xml = withJoint("fl_coxa", "rpy", "0 0 0.6109");
    xml = withJoint("fl_coxa", "lower", "-1.5708", xml);
    xml = withJoint("fl_coxa", "upper", "1.5708", xml);
    const leg = frontLeft(imported(xml).robot);
    expect(leg.mount.yawDeg).toBe(35);
    expect([leg.joints.coxa.minDeg, leg.joints.coxa.maxDeg]).toEqual([-90, 90]);
  });

  it("a velocity of 5.236 rad/s is 300 °/s", () => {
    expect(frontLeft(imported(withJoint("fl_coxa", "velocity", "5.236")).robot).joints.coxa.maxSpeedDegS).toBe(300);
  });

  it("a value written short (0.5 rad, 1.57 rad) is taken as written, to 0.001°: 28.648°, 89.954°", () => {
    let xml = withJoint("fl_coxa", "lower", "-0.5");
    xml = withJoint("fl_coxa", "upper", "1.57", xml);
    const leg = frontLeft(imported(xml).robot);
    expect([leg.joints.coxa.minDeg, leg.joints.coxa.maxDeg]).toEqual([-28.648, 89.954]);
  });

  it("a value that stands for no round degree is kept to 0.001°: 0.61234 rad is 35.084°", () => {
    expect(frontLeft(imported(withJoint("fl_coxa", "rpy", "0 0 0.61234")).robot).mount.yawDeg).toBe(35.084);
  });

  it("full-precision radians (the fixture's 0.6108652381980153) stay exact: 35°", () => {
    expect(frontLeft(imported(urdf).robot).mount.yawDeg).toBe(35);
  });

  it("the report shows at most three decimals (the tibia's zero offset 36.8698976458° reads 36.87°)", () => {
    const { report } = imported(urdf);
    expect(report.find((entry) => entry.startsWith("leg FL:"))).toContain("zero offsets femur 10°, tibia 36.87°");
    for (const line of report) expect(line, line).not.toMatch(/\d\.\d{4,}/);
  });
});
