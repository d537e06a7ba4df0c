import { describe, expect, it } from "vitest";
import { GaitInputError, generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { swingingLegs } from "../helpers";

describe("custom template", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.four);

  it("takes explicit phases and duty factor", () => {
    const phase = { LF: 0, RR: 0.25, RF: 0.5, LR: 0.75 };
    const sequence = generateGait(robot, { template: "custom", dutyFactor: 0.8, phase, cycleMs: 1000, fps: 20 });
    expect(sequence.generator.phase).toEqual(phase);
    expect(sequence.legs.RR.keys.map((key) => [key.t, key.contact])).toEqual([
      [0.25, "swing"],
      [0.45, "stance"],
    ]);
    // Swing lasts 0.2 of the cycle, 4 frames of 20: LF up in frames 0..3, RR in 5..8, RF in 10..13, LR in 15..18.
    const up = swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames);
    expect(up.map((legs) => legs.join(""))).toEqual([
      "LF",
      "LF",
      "LF",
      "LF",
      "",
      "RR",
      "RR",
      "RR",
      "RR",
      "",
      "RF",
      "RF",
      "RF",
      "RF",
      "",
      "LR",
      "LR",
      "LR",
      "LR",
      "",
    ]);
  });

  it("refuses a missing duty factor or phase, naming the fields", () => {
    expect(() => generateGait(robot, { template: "custom", phase: { LF: 0, LR: 0, RF: 0, RR: 0 } })).toThrow(/dutyFactor: is required for a custom gait/);
    try {
      generateGait(robot, { template: "custom", dutyFactor: 0.75, phase: { LF: 0, LR: 0.5 } });
      throw new Error("expected a refusal");
    } catch (error) {
      expect(error).toBeInstanceOf(GaitInputError);
      expect((error as GaitInputError).issues).toEqual([
        { path: "phase.RF", message: "is required for a custom gait" },
        { path: "phase.RR", message: "is required for a custom gait" },
      ]);
    }
  });
});
