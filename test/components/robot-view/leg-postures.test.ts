import { describe, expect, test } from "vitest";
import { forwardLeg, neutralStance, type BodyPose } from "~/kinematics";
import { legPoints, legPostures } from "~/components/robot-view";
import { loadDemoRobot } from "../../support/robots";

// A small seeded generator (Park–Miller), so failures repeat.
function random(seed: number) {
  let state = seed;
  return () => {
    state = (state * 48271) % 2147483647;
    return state / 2147483647;
  };
}

describe("leg points for the views", () => {
  test("the foot agrees with forwardLeg to 1e-9 mm for random angles, with and without a body pose", () => {
    const next = random(20240611);
    for (const file of ["pier-crawler", "quay-walker", "hull-climber"] as const) {
      const robot = loadDemoRobot(file);
      for (let trial = 0; trial < 200; trial += 1) {
        const leg = robot.legs[trial % robot.legs.length];
        const angles = { coxa: next() * 80 - 40, femur: next() * 140 - 70, tibia: next() * 140 - 70 };
        const pose: BodyPose | undefined =
          trial % 2 === 0 ? undefined : { x: next() * 20 - 10, y: next() * 20 - 10, z: next() * 20 - 10, roll: next() * 10 - 5, pitch: next() * 10 - 5, yaw: next() * 30 - 15 };
        const expected = forwardLeg(robot, leg.id, angles, pose);
        const { foot } = legPoints(leg, angles, pose);
        for (let axis = 0; axis < 3; axis += 1) expect(Math.abs(foot[axis] - expected[axis]), `${file} ${leg.id} axis ${axis}`).toBeLessThan(1e-9);
      }
    }
  });

  test("the joints lie along the leg: femur joint one coxa length out from the mount, knee one femur length on", () => {
    const robot = loadDemoRobot("pier-crawler");
    const leg = robot.legs[0];
    const { mount, hip, knee, foot } = legPoints(leg, { coxa: 10, femur: 20, tibia: -15 });
    const distance = (a: number[], b: number[]) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
    expect(distance(mount, hip)).toBeCloseTo(leg.coxa, 9);
    expect(distance(hip, knee)).toBeCloseTo(leg.femur, 9);
    expect(distance(knee, foot)).toBeCloseTo(leg.tibia, 9);
  });

  test("the neutral stance of every demo robot is reachable and within limits", () => {
    for (const file of ["pier-crawler", "quay-walker", "hull-climber"] as const) {
      const robot = loadDemoRobot(file);
      const postures = legPostures(robot, neutralStance(robot));
      expect(postures.map((posture) => posture.legId)).toEqual(robot.legs.map((leg) => leg.id));
      for (const posture of postures) {
        expect(posture.reachable, `${file} ${posture.legId}`).toBe(true);
        expect(posture.violations).toEqual([]);
      }
    }
  });
});
