import { describe, expect, it } from "vitest";
import {
  createLegSolver,
  forwardLeg,
  solveLeg,
  SOLVE_COXA_LIMIT,
  SOLVE_FEMUR_LIMIT,
  SOLVE_TIBIA_LIMIT,
  SOLVE_UNREACHABLE,
  type BodyPose,
  type Vec3,
} from "../../app/kinematics";
import { SOLVE_NOT_FINITE, SOLVE_OK } from "../../app/kinematics/solve-status";
import { loadDemoRobots } from "../support/robots";
import { seededRandom } from "./support/prng";

describe("createLegSolver: the hot path gives the public API's numbers", () => {
  it("solve and forward equal solveLeg and forwardLeg bit for bit on 5000 seeded targets, with and without a pose", () => {
    const random = seededRandom(5);
    const mismatches: string[] = [];
    for (const robot of loadDemoRobots()) {
      const solver = createLegSolver(robot);
      const angles = new Float64Array(3 * robot.legs.length);
      const foot = new Float64Array(3);
      for (let sample = 0; sample < 5000 / 3; sample += 1) {
        const pose: BodyPose | undefined =
          sample % 2 === 0
            ? undefined
            : {
                x: random.between(-20, 20),
                y: random.between(-20, 20),
                z: random.between(-20, 20),
                roll: random.between(-10, 10),
                pitch: random.between(-10, 10),
                yaw: random.between(-20, 20),
              };
        solver.setBodyPose(pose);
        const legIndex = random.index(robot.legs.length);
        const leg = robot.legs[legIndex];
        const target: Vec3 = [leg.mount.x + random.between(-250, 250), leg.mount.y + random.between(-250, 250), random.between(-200, 50)];
        const bits = solver.solve(legIndex, target[0], target[1], target[2], angles, legIndex * 3);
        const expected = solveLeg(robot, leg.id, target, pose);
        const got = { coxa: angles[legIndex * 3], femur: angles[legIndex * 3 + 1], tibia: angles[legIndex * 3 + 2] };
        if (JSON.stringify(got) !== JSON.stringify(expected.angles))
          mismatches.push(`${leg.id} angles ${JSON.stringify(got)} vs ${JSON.stringify(expected.angles)}`);
        if (((bits & SOLVE_UNREACHABLE) === 0) !== expected.reachable) mismatches.push(`${leg.id} reachable bits ${bits} vs ${expected.reachable}`);
        const limitBits = expected.violations.reduce(
          (sum, v) => sum | { coxa: SOLVE_COXA_LIMIT, femur: SOLVE_FEMUR_LIMIT, tibia: SOLVE_TIBIA_LIMIT }[v.joint],
          0,
        );
        if ((bits & ~SOLVE_UNREACHABLE) !== limitBits) mismatches.push(`${leg.id} limit bits ${bits} vs ${JSON.stringify(expected.violations)}`);
        if (!expected.reachable && solver.reason(legIndex, target[0], target[1], target[2], bits) !== expected.reason) mismatches.push(`${leg.id} reason`);
        solver.forward(legIndex, got.coxa, got.femur, got.tibia, foot);
        const expectedFoot = forwardLeg(robot, leg.id, got, pose);
        if (JSON.stringify([...foot]) !== JSON.stringify(expectedFoot)) mismatches.push(`${leg.id} foot ${[...foot]} vs ${expectedFoot}`);
      }
    }
    expect(mismatches.slice(0, 5), `${mismatches.length} mismatches`).toEqual([]);
  });

  it("reports SOLVE_OK for a neutral foot and writes only its own three slots", () => {
    const [pier] = loadDemoRobots();
    const solver = createLegSolver(pier);
    const out = new Float64Array(9).fill(7);
    expect(solver.solve(solver.legIndex("LF"), 150, 115, -90, out, 3)).toBe(SOLVE_OK);
    expect([out[0], out[1], out[2], out[6], out[7], out[8]]).toEqual([7, 7, 7, 7, 7, 7]);
    expect(solver.solve(0, Number.NaN, 0, 0, out, 3) & SOLVE_NOT_FINITE).toBe(SOLVE_NOT_FINITE);
    expect([out[3], out[4], out[5]].every(Number.isFinite)).toBe(true);
  });

  it("limits gives the solve's own limit bits for angles given rather than solved: on a limit is inside, 1e-6° past it is out", () => {
    const [pier] = loadDemoRobots();
    const solver = createLegSolver(pier);
    const random = seededRandom(9);
    const angles = new Float64Array(3);
    for (let sample = 0; sample < 2000; sample += 1) {
      const legIndex = random.index(pier.legs.length);
      const leg = pier.legs[legIndex];
      const bits = solver.solve(
        legIndex,
        leg.mount.x + random.between(-250, 250),
        leg.mount.y + random.between(-250, 250),
        random.between(-200, 50),
        angles,
        0,
      );
      expect(solver.limits(legIndex, angles[0], angles[1], angles[2])).toBe(bits & (SOLVE_COXA_LIMIT | SOLVE_FEMUR_LIMIT | SOLVE_TIBIA_LIMIT));
    }
    const { coxa, femur, tibia } = pier.legs[0].joints;
    expect(solver.limits(0, coxa.minDeg, femur.maxDeg, tibia.minDeg)).toBe(SOLVE_OK);
    expect(solver.limits(0, coxa.minDeg - 1e-6, femur.maxDeg, tibia.maxDeg + 1e-6)).toBe(SOLVE_COXA_LIMIT | SOLVE_TIBIA_LIMIT);
    expect(solver.limits(0, 0, femur.maxDeg + 1e-6, 0)).toBe(SOLVE_FEMUR_LIMIT);
  });

  it("knows its legs by id", () => {
    const [, quay] = loadDemoRobots();
    const solver = createLegSolver(quay);
    expect(solver.legIds).toEqual(["LF", "LR", "RF", "RR"]);
    expect(solver.legIndex("RF")).toBe(2);
    expect(() => solver.legIndex("LM")).toThrow('robot "Quay walker" has no leg "LM" (legs: LF, LR, RF, RR)');
  });
});
