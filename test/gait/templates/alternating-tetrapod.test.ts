import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { swingingLegs } from "../helpers";

// Alternating tetrapod for eight legs: the tripod's pattern with four legs a set
// (rows 1 and 3 of one side with rows 2 and 4 of the other), duty factor 1/2
// (common practice, from memory).
describe("alternating-tetrapod template (common practice, from memory)", () => {
  it("has duty factor 1/2 and alternates L1 L3 R2 R4 with R1 R3 L2 L4", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.eight);
    const sequence = generateGait(robot, { template: "alternating-tetrapod", cycleMs: 1000, fps: 50, strideMm: 30 });
    expect(sequence.generator.dutyFactor).toBe(0.5);
    swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames).forEach((legs, frame) => {
      const expected = frame < 25 ? ["L1", "L3", "R2", "R4"] : ["L2", "L4", "R1", "R3"];
      expect(legs, `frame ${frame}: expected ${expected.join(" ")}, got ${legs.join(" ")}`).toEqual(expected);
    });
  });
});
