// Hostile but schema-valid extremes (DESIGN.md, "Never a NaN"): the longest
// and the shortest links the robot format allows, mounts at the edge of the
// body's range, targets a kilometre out, on the coxa axis and at overflowing
// magnitudes; and definitions that skipped the parse (links of 1e200 mm or
// zero). Every number out is finite; a target no posture reaches, and a leg
// whose numbers give no solve, answer reachable: false with a reason.
import { describe, expect, it } from "vitest";
import {
  createLegSolver,
  forwardLeg,
  forwardLegJoints,
  neutralStance,
  parseRobot,
  reachRing,
  solveLeg,
  type BodyPose,
  type Robot,
  type Vec3,
} from "../../app/kinematics";
import { numericLeaves } from "../support/numbers";
import { testRobotJson } from "./support/test-robot";

/** The worked-example quadruped with every link `linkMm` long, its mounts at `mountMm` from the centre. */
function extremeRobot(linkMm: number, mountMm: number): Robot {
  const json = testRobotJson({ coxa: linkMm, femur: linkMm, tibia: linkMm });
  for (const leg of json.legs) {
    leg.mount.x = Math.sign(leg.mount.x) * mountMm;
    leg.mount.y = Math.sign(leg.mount.y) * mountMm;
    leg.mount.z = -mountMm;
  }
  json.standHeight = Math.min(5000, Math.max(1, 1.5 * linkMm));
  const parsed = parseRobot(json);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.robot;
}

const ROBOTS: [string, Robot][] = [
  ["2 000 mm links, mounts 5 000 mm out", extremeRobot(2000, 5000)],
  ["1 mm links, mounts 1 mm out", extremeRobot(1, 1)],
  ["1 mm links, mounts 5 000 mm out", extremeRobot(1, 5000)],
];

const POSES: (BodyPose | undefined)[] = [
  undefined,
  { x: 5000, y: -5000, z: 5000, roll: 180, pitch: -180, yaw: 180 },
  { x: -5000, y: 5000, z: -5000, roll: -90, pitch: 90, yaw: -180 },
];

/** Targets of leg 0 (mount m): far out on every axis, on and near the coxa axis, at the mount, at overflowing magnitudes. */
function hostileTargets(robot: Robot): Vec3[] {
  const { x, y, z } = robot.legs[0].mount;
  return [
    [1e6, 0, 0],
    [-1e6, 1e6, -1e6],
    [0, 0, 1e6],
    [x, y, z],
    [x, y, z - 1e6],
    [x, y, z + 1e6],
    [x + 0.5, y, z - 1],
    [x + 1e-12, y - 1e-12, z],
    [1e300, -1e300, 1e300],
    [1.7e308, 1.7e308, -1.7e308],
    [Number.MAX_VALUE, -Number.MAX_VALUE, 0],
  ];
}

const finite = (value: unknown) => numericLeaves(value).every(({ value: number }) => Number.isFinite(number));

describe("solveLeg at the extremes: finite angles, and a reason whenever unreachable", () => {
  for (const [name, robot] of ROBOTS) {
    it(name, () => {
      const bad: string[] = [];
      for (const pose of POSES) {
        for (const target of hostileTargets(robot)) {
          for (const leg of robot.legs) {
            const solution = solveLeg(robot, leg.id, target, pose);
            const where = `${leg.id} at ${target.join(", ")} mm${pose ? ` posed ${JSON.stringify(pose)}` : ""}`;
            if (!finite(solution)) bad.push(`${where}: ${JSON.stringify(solution)}`);
            if (!solution.reachable && !solution.reason) bad.push(`${where}: unreachable without a reason`);
          }
        }
      }
      expect(bad).toEqual([]);
    });
  }

  it("a target a kilometre out is beyond full extension, with the distance", () => {
    const [, robot] = ROBOTS[0];
    const solution = solveLeg(robot, "LF", [1e6, 0, 0]);
    expect(solution.reachable).toBe(false);
    expect(solution.reason).toMatch(/^leg LF: the foot is [\d.]+ mm from the femur joint, beyond full extension \(4000\.0 mm\)$/);
  });

  it("a finite target too far out to square (1e300 mm) is beyond full extension too, not 'not a finite point', and the leg points at it", () => {
    const [, robot] = ROBOTS[0];
    const solution = solveLeg(robot, "LF", [1e300, 0, 0]);
    expect(solution.reachable).toBe(false);
    expect(solution.reason).toMatch(/beyond full extension/);
    // Straight leg (geometric tibia 90°), level (femur 0°), along +x (coxa 0°): the nearest posture.
    expect(solution.angles.coxa).toBeCloseTo(0, 9);
    expect(solution.angles.femur).toBeCloseTo(0, 6);
    expect(solution.angles.tibia).toBeCloseTo(90, 9);
  });

  it("on the coxa axis of the longest legs: unreachable, finite", () => {
    const [, robot] = ROBOTS[0];
    const { x, y, z } = robot.legs[0].mount;
    const solution = solveLeg(robot, "LF", [x, y, z - 3000]);
    expect(solution.reachable).toBe(false);
    expect(solution.reason).toMatch(/from the coxa axis, where the coxa angle is undefined/);
    expect(finite(solution.angles)).toBe(true);
  });
});

describe("the hot-path solver and the reach at the extremes", () => {
  for (const [name, robot] of ROBOTS) {
    it(name, () => {
      const solver = createLegSolver(robot);
      const out = new Float64Array(3);
      const foot = new Float64Array(3);
      const bad: string[] = [];
      for (const pose of POSES) {
        solver.setBodyPose(pose);
        for (const target of hostileTargets(robot)) {
          for (let leg = 0; leg < robot.legs.length; leg += 1) {
            const status = solver.solve(leg, target[0], target[1], target[2], out);
            solver.forward(leg, out[0], out[1], out[2], foot);
            if (![...out, ...foot].every(Number.isFinite)) bad.push(`${robot.legs[leg].id} at ${target.join(", ")}: ${[...out]} → ${[...foot]}`);
            if (status !== 0 && !solver.reason(leg, target[0], target[1], target[2], status)) bad.push(`${target.join(", ")}: no reason`);
          }
        }
      }
      expect(bad).toEqual([]);
      for (const height of [1, robot.standHeight, 5000]) {
        expect(finite(neutralStance(robot, height)), `neutral stance at ${height} mm`).toBe(true);
        for (const leg of robot.legs) expect(finite(reachRing(robot, leg.id, -height)), `${leg.id} ring at ${height} mm`).toBe(true);
      }
    });
  }
});

describe("forwardLeg: a finite foot for any finite angles, a RangeError for angles that are not numbers", () => {
  for (const [name, robot] of ROBOTS) {
    it(name, () => {
      for (const pose of POSES) {
        for (const angle of [0, 180, -1e6, 1e300, -Number.MAX_VALUE]) {
          const angles = { coxa: angle, femur: -angle, tibia: angle };
          expect(finite(forwardLeg(robot, "LF", angles, pose)), `${angle}°`).toBe(true);
          expect(finite(forwardLegJoints(robot, "RR", angles, pose)), `${angle}°`).toBe(true);
        }
      }
    });
  }

  it("NaN or an infinite angle is refused, naming the leg and the joint", () => {
    const [, robot] = ROBOTS[0];
    expect(() => forwardLeg(robot, "LF", { coxa: 0, femur: Number.NaN, tibia: 0 })).toThrow(RangeError);
    expect(() => forwardLeg(robot, "LF", { coxa: 0, femur: Number.NaN, tibia: 0 })).toThrow(/LF.*femur.*NaN/);
    expect(() => forwardLegJoints(robot, "RR", { coxa: 0, femur: 0, tibia: Number.POSITIVE_INFINITY })).toThrow(/RR.*tibia.*Infinity/);
  });
});

describe("definitions that skipped the parse: no NaN either", () => {
  // The probe's robot for POST /api/v1/ik: 1e200 mm links (their squares overflow), and links of zero.
  const unparsed = (change: (leg: Robot["legs"][number]) => void): Robot => {
    const robot = structuredClone(extremeRobot(100, 100));
    change(robot.legs[0]);
    return robot;
  };
  const cases: [string, Robot][] = [
    ["1e200 mm femur and tibia", unparsed((leg) => ([leg.femur, leg.tibia] = [1e200, 1e200]))],
    ["1e300 mm coxa", unparsed((leg) => (leg.coxa = 1e300))],
    ["a zero femur", unparsed((leg) => (leg.femur = 0))],
    ["a tibia of 5e-324 mm", unparsed((leg) => (leg.tibia = Number.MIN_VALUE))],
    ["an infinite tibia", unparsed((leg) => (leg.tibia = Number.POSITIVE_INFINITY))],
    ["a NaN mount", unparsed((leg) => (leg.mount.x = Number.NaN))],
    ["a NaN zero offset", unparsed((leg) => (leg.joints.femur.zeroOffsetDeg = Number.NaN))],
  ];
  for (const [name, robot] of cases) {
    it(`${name}: solveLeg answers reachable: false with a reason and finite angles`, () => {
      for (const target of [
        [150, 150, -100],
        [0, 0, 0],
        [1e6, 0, 0],
      ] as Vec3[]) {
        const solution = solveLeg(robot, "LF", target);
        expect(solution.reachable, JSON.stringify(target)).toBe(false);
        expect(solution.reason).toMatch(/^leg LF: /);
        expect(finite(solution), JSON.stringify(solution)).toBe(true);
      }
      // The other legs are untouched and still solve.
      expect(solveLeg(robot, "RR", neutralStance(extremeRobot(100, 100)).RR).reachable).toBe(true);
    });

    it(`${name}: forwardLeg and createLegSolver refuse the leg with a RangeError naming it`, () => {
      expect(() => forwardLeg(robot, "LF", { coxa: 0, femur: 0, tibia: 0 })).toThrow(RangeError);
      expect(() => createLegSolver(robot)).toThrow(/leg LF/);
    });
  }
});
