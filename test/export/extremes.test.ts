// angleTable at the extremes (DESIGN.md, "Never a NaN"; the one rounding of
// every table): a gait on the longest legs the robot format allows gives a
// table of finite numbers in every unit and format, and a solved result that
// holds what no solve gives — an angle of 1e300°, a time that is not a number —
// is refused with a TableExportError rather than written as a wrapped integer
// or "NaN".
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { angleTable, type TableFormat, type TableUnits } from "~/export/index";
import { generateGait, solveSequence, type SolvedSequence } from "~/gait/index";
import { parseRobot, type Robot } from "~/kinematics/index";
import { testRobotJson } from "../kinematics/support/test-robot";
import { OVERRIDE, codeOf, metaFor } from "./helpers";

function longestLegs(): Robot {
  const json = testRobotJson({ coxa: 2000, femur: 2000, tibia: 2000 });
  for (const leg of json.legs) [leg.mount.x, leg.mount.y] = [Math.sign(leg.mount.x) * 5000, Math.sign(leg.mount.y) * 5000];
  json.standHeight = 5000;
  const parsed = parseRobot(json);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.robot;
}

const robot = longestLegs();
const params = { template: "wave" as const, cycleMs: 2000, fps: 100, strideMm: 10000, turnDegPerCycle: 360, stepHeightMm: 1000, name: "Extreme wave" };
const solved = solveSequence(robot, generateGait(robot, params));
const gait = { robot, params };

describe("a table of the longest legs' gait holds finite numbers only", () => {
  const formats: TableFormat[] = ["csv", "json"];
  const units: TableUnits[] = ["deg", "rad", "us"];
  for (const format of formats) {
    for (const unit of units) {
      it(`${format}, ${unit}`, () => {
        const text = angleTable(robot, solved, { format, units: unit, meta: metaFor(gait), overrideReason: OVERRIDE });
        const cells =
          format === "json"
            ? (JSON.parse(text) as { frames: { timeMs: number; values: number[] }[] }).frames.flatMap((frame) => [frame.timeMs, ...frame.values])
            : Papa.parse<string[]>(text.trim(), { skipEmptyLines: true, comments: "#" })
                .data.slice(1)
                .flatMap((row) => row.map(Number));
        expect(cells.length).toBe(solved.frames.length * (robot.legs.length * 3 + (format === "json" ? 1 : 2)));
        expect(cells.filter((value) => !Number.isFinite(value))).toEqual([]);
      });
    }
  }

  it("c, us: every cell a uint16_t", () => {
    const text = angleTable(robot, solved, { format: "c", units: "us", meta: metaFor(gait), overrideReason: OVERRIDE });
    expect(text).not.toMatch(/NaN|Infinity/);
  });
});

describe("a solved result no solve gives is refused", () => {
  const options = { units: "deg" as const, meta: metaFor(gait), overrideReason: OVERRIDE };
  const changed = (change: (copy: SolvedSequence) => void): SolvedSequence => {
    const copy = structuredClone(solved);
    change(copy);
    return copy;
  };

  it("an angle of 1e300° (its tenths do not fit any table integer): value-out-of-range, in every format", () => {
    const huge = changed((copy) => (copy.frames[1].legs.LF.angles.femur = 1e300));
    for (const format of ["csv", "json", "c"] as const)
      expect(
        codeOf(() => angleTable(robot, huge, { ...options, format })),
        format,
      ).toBe("value-out-of-range");
  });

  it("1e9° in radians (1.7e11 ten-thousandths, beyond int32): value-out-of-range", () => {
    const huge = changed((copy) => (copy.frames[1].legs.RR.angles.tibia = 1e9));
    expect(codeOf(() => angleTable(robot, huge, { ...options, units: "rad", format: "json" }))).toBe("value-out-of-range");
  });

  it("a frame time that is not a number: solved-mismatch", () => {
    const broken = changed((copy) => (copy.frames[2].timeMs = Number.NaN));
    expect(codeOf(() => angleTable(robot, broken, { ...options, format: "csv" }))).toBe("solved-mismatch");
    const infinite = changed((copy) => (copy.frames[2].timeMs = Number.POSITIVE_INFINITY));
    expect(codeOf(() => angleTable(robot, infinite, { ...options, format: "json" }))).toBe("solved-mismatch");
  });
});
