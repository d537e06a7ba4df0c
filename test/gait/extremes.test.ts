// solveSequence at the edges of what the robot and sequence formats allow
// (DESIGN.md, "Never a NaN"): 2 000 mm and 1 mm links, strides of 10 m, a
// full turn a cycle, body offsets of 5 m and half turns, feet 20 m out,
// easings that overshoot tenfold, 1 000 frames a second. Every number of the
// frames, of the column layout (bar marginMm's documented NaN for "fewer than
// three feet") and of the summary is finite. A sequence that skipped the parse
// and carries a NaN is refused rather than solved into NaN.
import { describe, expect, it } from "vitest";
import { GaitInputError, columnsOf, decodeColumns, encodeColumns, generateGait, parseSequence, runSolve, solveSequence, type Sequence } from "~/gait/index";
import { parseRobot, type Robot } from "~/kinematics/index";
import { testRobotJson } from "../kinematics/support/test-robot";
import { numbersIn } from "./helpers";

function extremeRobot(linkMm: number, mountMm: number, standHeightMm: number): Robot {
  const json = testRobotJson({ coxa: linkMm, femur: linkMm, tibia: linkMm });
  for (const leg of json.legs) {
    leg.mount.x = Math.sign(leg.mount.x) * mountMm;
    leg.mount.y = Math.sign(leg.mount.y) * mountMm;
  }
  json.standHeight = standHeightMm;
  const parsed = parseRobot(json);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.robot;
}

function parsed(json: unknown): Sequence {
  const result = parseSequence(json);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.sequence;
}

const large = extremeRobot(2000, 5000, 5000);
const small = extremeRobot(1, 1, 1);

const extremeBody = [
  { t: 0, pose: { x: 5000, y: -5000, z: -5000, roll: 180, pitch: -180, yaw: 180 }, ease: [0, -10, 1, 10] as [number, number, number, number] },
  { t: 0.25, pose: { x: -5000, y: 5000, z: 5000, roll: -180, pitch: 180, yaw: -180 }, ease: [1, 10, 0, -10] as [number, number, number, number] },
  { t: 0.5, pose: {} },
];

/** Every leg's keys at the far corners of the foot range, swinging 1 000 mm high on overshooting easings. */
function cornerSequence(robot: Robot): Sequence {
  const legs = Object.fromEntries(
    robot.legs.map((leg, index) => [
      leg.id,
      {
        keys: [
          { t: 0, contact: "swing", foot: [20000, -20000, -20000], ease: [0, 10, 1, -10], apexMm: 1000 },
          { t: 0.3 + index * 0.1, contact: "stance", foot: [-20000, 20000, 20000] },
          { t: 0.95, contact: "swing", foot: [index % 2 ? 20000 : -20000, 0, -20000], ease: [0.5, -10, 0.5, 10] },
        ],
      },
    ]),
  );
  return parsed({
    format: "gaitloom.sequence/1",
    cycleMs: 500,
    fps: 1000,
    loop: true,
    generator: { strideMm: -10000, directionDeg: -360, turnDegPerCycle: 360, stepHeightMm: 1000, bodyHeightMm: 5000 },
    legs,
    body: { keys: extremeBody },
  });
}

const cases: [string, Robot, () => Sequence][] = [
  [
    "2 000 mm links: wave, 10 m stride, a full turn a cycle, 1 000 fps, body offsets at their bounds",
    large,
    () =>
      generateGait(large, {
        template: "wave",
        cycleMs: 600,
        fps: 1000,
        strideMm: 10000,
        directionDeg: 360,
        turnDegPerCycle: -360,
        stepHeightMm: 1000,
        bodyHeightMm: 5000,
        swingEase: [1, -10, 0, 10],
        bodyKeys: extremeBody,
      }),
  ],
  [
    "1 mm links: trot at the same bounds",
    small,
    () =>
      generateGait(small, {
        template: "trot",
        cycleMs: 600_000,
        fps: 1,
        strideMm: -10000,
        turnDegPerCycle: 360,
        stepHeightMm: 1000,
        bodyHeightMm: 1,
        bodyKeys: extremeBody,
      }),
  ],
  ["2 000 mm links: feet at the corners of the foot range", large, () => cornerSequence(large)],
  ["1 mm links: feet at the corners of the foot range", small, () => cornerSequence(small)],
];

describe("every number out of solveSequence is finite at the extremes", () => {
  for (const [name, robot, make] of cases) {
    it(name, () => {
      const sequence = make();
      const solved = solveSequence(robot, sequence);
      const numbers = numbersIn(solved);
      expect(numbers.length).toBeGreaterThan(100);
      expect(
        numbers.filter((value) => !Number.isFinite(value)),
        "non-finite numbers in frames, flags or summary",
      ).toEqual([]);
      expect(JSON.parse(JSON.stringify(solved))).toEqual(solved);

      // The column layout: every column finite but marginMm, whose NaN is the frame layout's null.
      const columns = decodeColumns(JSON.parse(JSON.stringify(encodeColumns(columnsOf(runSolve(robot, sequence))))));
      const { marginMm, flags, summary, ...rest } = columns;
      // numbersIn reads a Float32Array's values as an object's.
      const floats = numbersIn(rest).concat(numbersIn(flags), numbersIn(summary));
      expect(floats.length).toBeGreaterThan(numbers.length / 2);
      expect(floats.filter((value) => !Number.isFinite(value))).toEqual([]);
      solved.frames.forEach((frame, i) => {
        if (frame.marginMm === null) expect(marginMm[i]).toBeNaN();
        else expect(Number.isFinite(marginMm[i]), `marginMm[${i}]`).toBe(true);
      });
    });
  }
});

describe("a sequence that skipped the parse", () => {
  const robot = large;
  const valid = cornerSequence(robot);

  it("with a NaN foot is refused with a GaitInputError naming the frame and leg, not solved into NaN", () => {
    const broken = structuredClone(valid);
    broken.legs.LF.keys[1].foot = [Number.NaN, 0, 0];
    expect(() => solveSequence(robot, broken)).toThrow(GaitInputError);
    expect(() => runSolve(robot, broken)).toThrow(/LF/);
  });

  it("with an infinite body offset is refused too", () => {
    const broken = structuredClone(valid);
    broken.body.keys[0].pose.yaw = Number.POSITIVE_INFINITY;
    expect(() => solveSequence(robot, broken)).toThrow(GaitInputError);
  });
});
