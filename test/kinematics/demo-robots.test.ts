// The invented demo robots of db/demo/robots: each must be a robot one can walk.
import { describe, expect, it } from "vitest";
import { forwardLeg, JOINT_NAMES, legSide, neutralStance, solveLeg, type Vec3 } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";

const STRIDE_MM = 60;
const STEP_HEIGHT_MM = 30;

describe("demo robots", () => {
  const robots = loadDemoRobots();

  it("are a six-, a four- and an eight-legged robot", () => {
    expect(robots.map((robot) => robot.legs.map((leg) => leg.id))).toEqual([
      ["LF", "LM", "LR", "RF", "RM", "RR"],
      ["LF", "LR", "RF", "RR"],
      ["L1", "L2", "L3", "L4", "R1", "R2", "R3", "R4"],
    ]);
  });

  it("have turned mounts, some zero offsets and one reversed servo per side", () => {
    for (const robot of robots) {
      expect(
        robot.legs.every((leg) => leg.mount.yawDeg !== 0),
        `${robot.name}: every mount yaw non-zero`,
      ).toBe(true);
      const offsets = robot.legs.flatMap((leg) => JOINT_NAMES.map((name) => leg.joints[name].zeroOffsetDeg)).filter((offset) => offset !== 0);
      expect(offsets.length, `${robot.name}: non-zero zero offsets`).toBeGreaterThan(0);
      for (const side of ["left", "right"] as const) {
        const reversed = robot.legs
          .filter((leg) => legSide(robot, leg) === side)
          .flatMap((leg) => JOINT_NAMES.filter((name) => leg.joints[name].servo.reversed));
        expect(reversed, `${robot.name} ${side} side: reversed servos`).toHaveLength(1);
      }
    }
  });

  it("have hobby-servo speeds (about 0.1–0.2 s per 60°, common practice, from memory) and pulses 500–2500 µs around 1500 µs", () => {
    for (const robot of robots) {
      for (const leg of robot.legs) {
        for (const name of JOINT_NAMES) {
          const joint = leg.joints[name];
          const secondsPer60 = 60 / joint.maxSpeedDegS;
          expect(secondsPer60, `${robot.name} ${leg.id} ${name}: s per 60°`).toBeGreaterThanOrEqual(0.1);
          expect(secondsPer60, `${robot.name} ${leg.id} ${name}: s per 60°`).toBeLessThanOrEqual(0.2);
          expect(joint.servo).toMatchObject({ minUs: 500, maxUs: 2500 });
          expect(Math.abs(joint.servo.centerUs - 1500), `${robot.name} ${leg.id} ${name}: centre off 1500 µs`).toBeLessThanOrEqual(30);
        }
      }
    }
  });

  it(`reach a ${STRIDE_MM} mm stride in any direction and a ${STEP_HEIGHT_MM} mm step from the neutral stance, inside the limits`, () => {
    const problems: string[] = [];
    for (const robot of robots) {
      const stance = neutralStance(robot);
      for (const leg of robot.legs) {
        const foot = stance[leg.id];
        for (let directionDeg = 0; directionDeg < 360; directionDeg += 15) {
          const half = STRIDE_MM / 2;
          const rad = (directionDeg * Math.PI) / 180;
          for (const lift of [0, STEP_HEIGHT_MM]) {
            const target: Vec3 = [foot[0] + half * Math.cos(rad), foot[1] + half * Math.sin(rad), foot[2] + lift];
            const solution = solveLeg(robot, leg.id, target);
            if (!solution.reachable || solution.violations.length > 0) {
              problems.push(`${robot.name} ${leg.id} at ${directionDeg}°, lift ${lift} mm: ${solution.reason ?? JSON.stringify(solution.violations)}`);
            }
          }
        }
      }
    }
    expect(problems).toEqual([]);
  });

  it("rest on the belly, legs folded: knees raised above the mounts, feet no lower than a third of standHeight below the body origin", () => {
    for (const robot of robots) {
      for (const leg of robot.legs) {
        const rest = robot.rest?.[leg.id];
        expect(rest, `${robot.name} ${leg.id} rest angles`).toBeDefined();
        const femurGeometricDeg = rest!.femur + leg.joints.femur.zeroOffsetDeg;
        expect(femurGeometricDeg, `${robot.name} ${leg.id}: rest femur (°, geometric)`).toBeGreaterThanOrEqual(60);
        const foot = forwardLeg(robot, leg.id, rest!);
        expect(foot[2], `${robot.name} ${leg.id}: rest foot height (mm, body frame)`).toBeGreaterThanOrEqual(-robot.standHeight / 3);
        expect(foot[2], `${robot.name} ${leg.id}: rest foot height (mm, body frame)`).toBeLessThan(0);
      }
    }
  });
});
