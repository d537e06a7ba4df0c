import { describe, expect, it } from "vitest";
import { GaitInputError, generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { swingingLegs } from "../helpers";

// Trot: the diagonal pairs alternate with duty factor 1/2 (M. Hildebrand,
// "Symmetrical gaits of horses", Science 150, 1965: diagonal feet move together).
describe("trot template (Hildebrand 1965: diagonal pairs together)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.four);
  const sequence = generateGait(robot, { template: "trot", cycleMs: 800, fps: 50, strideMm: 40 });

  it("has duty factor 1/2 and swings the diagonal pairs LF+RR and RF+LR in turn", () => {
    expect(sequence.generator.dutyFactor).toBe(0.5);
    swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames).forEach((legs, frame) => {
      const expected = frame < 20 ? ["LF", "RR"] : ["LR", "RF"];
      expect(legs, `frame ${frame}: expected ${expected.join(" ")}, got ${legs.join(" ")}`).toEqual(expected);
    });
  });

  it("is only for four legs", () => {
    expect(() => generateGait(loadDemoRobot(DEMO_ROBOTS.six), { template: "trot" })).toThrow(GaitInputError);
    expect(() => generateGait(loadDemoRobot(DEMO_ROBOTS.six), { template: "trot" })).toThrow(
      /trot needs 4 legs, 2 a side \(this robot has 3 left and 3 right\)/,
    );
  });
});
