import { describe, expect, test } from "vitest";
import { forwardLegJoints, neutralStance, type BodyPose } from "~/kinematics";
import { legPostures } from "~/components/robot-view";
import { loadDemoRobot } from "../../support/robots";

const POSE: BodyPose = { x: 4, y: -3, z: 6, roll: 3, pitch: -4, yaw: 12 };

describe("leg postures for the views", () => {
  test("a leg with given angles is drawn at those angles (the kinematics' forwardLegJoints), moved with the body", () => {
    const robot = loadDemoRobot("pier-crawler");
    const angles = { coxa: 10, femur: 20, tibia: -15 };
    const given = Object.fromEntries(robot.legs.map((leg) => [leg.id, angles]));
    const postures = legPostures(robot, {}, given, POSE);
    expect(postures.map((posture) => posture.legId)).toEqual(robot.legs.map((leg) => leg.id));
    for (const posture of postures) {
      expect(posture.points).toEqual(forwardLegJoints(robot, posture.legId, angles, POSE));
      expect(posture.reachable).toBe(true);
    }
  });

  test("a leg with only a foot target is solved: its foot lands on the target to 1e-9 mm, with and without a body pose", () => {
    for (const pose of [undefined, POSE]) {
      const robot = loadDemoRobot("quay-walker");
      const feet = neutralStance(robot);
      for (const posture of legPostures(robot, feet, undefined, pose)) {
        const target = feet[posture.legId];
        for (let axis = 0; axis < 3; axis += 1) expect(Math.abs(posture.points.foot[axis] - target[axis]), `${posture.legId} axis ${axis}`).toBeLessThan(1e-9);
      }
    }
  });

  test("a leg with neither angles nor a foot target is left out; an unreachable target is marked with its reason", () => {
    const robot = loadDemoRobot("hull-climber");
    const [first, second] = robot.legs;
    const postures = legPostures(robot, { [first.id]: [first.mount.x + 1000, first.mount.y, first.mount.z] }, { [second.id]: { coxa: 0, femur: 0, tibia: 0 } });
    expect(postures.map((posture) => posture.legId)).toEqual([first.id, second.id]);
    expect(postures[0].reachable).toBe(false);
    expect(postures[0].reason).toMatch(/beyond full extension/);
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
