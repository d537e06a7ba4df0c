import { describe, expect, it } from "vitest";
import { JOINT_NAMES, angleToPulse } from "~/kinematics/index";
import { clampPulseUs, createPulseTable, rawPulseUs } from "~/gait/pulses";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";

// The solve's allocation-free pulse mapping must give what the kinematics' angleToPulse gives.
describe("the solve's pulse table equals the kinematics' angleToPulse", () => {
  it("on every demo joint from −200° to 200° in 2.5° steps", () => {
    for (const file of Object.values(DEMO_ROBOTS)) {
      const robot = loadDemoRobot(file);
      const joints = robot.legs.flatMap((leg) => JOINT_NAMES.map((name) => leg.joints[name]));
      const table = createPulseTable(joints);
      joints.forEach((joint, index) => {
        for (let deg = -200; deg <= 200; deg += 2.5) {
          const expected = angleToPulse(joint, deg);
          const raw = rawPulseUs(table, index, deg);
          const us = clampPulseUs(table, index, raw);
          expect(us, `${file} joint ${index} at ${deg}°: expected ${expected.us} µs`).toBe(expected.us);
          expect(us !== raw, `${file} joint ${index} at ${deg}°: clamped`).toBe(expected.clamped);
        }
      });
    }
  });
});
