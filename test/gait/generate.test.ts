import { describe, expect, it } from "vitest";
import { neutralStance } from "~/kinematics/index";
import { GAIT_DEFAULTS, GaitInputError, generateGait, parseSequence } from "~/gait/index";
import { SEQUENCE_FORMAT } from "~/gait/sequence";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";

describe("generateGait (DESIGN.md, Core module contracts)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);

  it("fills omitted fields with the template's and the engine's defaults and keeps the parameters in `generator`", () => {
    const sequence = generateGait(robot, { template: "ripple" });
    expect(sequence.format).toBe(SEQUENCE_FORMAT);
    expect(sequence.loop).toBe(true);
    expect(sequence.cycleMs).toBe(GAIT_DEFAULTS.cycleMs);
    expect(sequence.fps).toBe(GAIT_DEFAULTS.fps);
    expect(sequence.generator).toMatchObject({
      template: "ripple",
      dutyFactor: 0.75,
      strideMm: GAIT_DEFAULTS.strideMm,
      directionDeg: 0,
      turnDegPerCycle: 0,
      stepHeightMm: GAIT_DEFAULTS.stepHeightMm,
      bodyHeightMm: robot.standHeight,
    });
    expect(parseSequence(JSON.parse(JSON.stringify(sequence)))).toEqual({ ok: true, sequence });
  });

  it("places feet at the neutral stance shifted by half the stance's travel, sideways for directionDeg 90", () => {
    const sequence = generateGait(robot, { template: "tripod", strideMm: 60, directionDeg: 90, bodyHeightMm: 80 });
    const neutral = neutralStance(robot, 80);
    const [liftOff, touchDown] = ["swing", "stance"].map((contact) => sequence.legs.RM.keys.find((key) => key.contact === contact)!.foot!);
    // β·stride/2 = 15 mm, along +y (left) at touch-down, −y at lift-off; feet on the ground.
    expect(touchDown[1] - neutral.RM[1]).toBeCloseTo(15, 9);
    expect(liftOff[1] - neutral.RM[1]).toBeCloseTo(-15, 9);
    expect(touchDown[0]).toBeCloseTo(neutral.RM[0], 9);
    expect(touchDown[2]).toBe(-80);
  });

  it("puts the feet on arcs about the body centre when turning on the spot", () => {
    const sequence = generateGait(robot, { template: "tripod", strideMm: 0, turnDegPerCycle: 20 });
    const neutral = neutralStance(robot, robot.standHeight).LF;
    const touchDown = sequence.legs.LF.keys.find((key) => key.contact === "stance")!.foot!;
    // The body turns 20° · β / 2 = 5° during half the stance; the foot lands 5° further round (counter-clockwise).
    const angle = (Math.atan2(touchDown[1], touchDown[0]) - Math.atan2(neutral[1], neutral[0])) * (180 / Math.PI);
    expect(angle).toBeCloseTo(5, 9);
    expect(Math.hypot(touchDown[0], touchDown[1])).toBeCloseTo(Math.hypot(neutral[0], neutral[1]), 9);
  });

  it("copies body pose keys (crouch, lean, shift) into the body track, apex and ease into the lift-off keys", () => {
    const bodyKeys = [
      { t: 0, pose: { z: -10 } },
      { t: 0.5, pose: { roll: 5, y: 8 }, ease: [0.42, 0, 0.58, 1] as [number, number, number, number] },
    ];
    const sequence = generateGait(robot, { template: "tetrapod", stepHeightMm: 35, swingEase: [0, 0, 0.58, 1], bodyKeys });
    expect(sequence.body.keys).toEqual([
      { t: 0, pose: { x: 0, y: 0, z: -10, roll: 0, pitch: 0, yaw: 0 } },
      { t: 0.5, pose: { x: 0, y: 8, z: 0, roll: 5, pitch: 0, yaw: 0 }, ease: [0.42, 0, 0.58, 1] },
    ]);
    const liftOff = sequence.legs.LM.keys.find((key) => key.contact === "swing")!;
    expect(liftOff.apexMm).toBe(35);
    expect(liftOff.ease).toEqual([0, 0, 0.58, 1]);
  });

  it("refuses bad parameters with paths, and a template that does not suit the robot", () => {
    try {
      generateGait(robot, { template: "tripod", dutyFactor: 1.2, cycleMs: -5 });
      throw new Error("expected a refusal");
    } catch (error) {
      expect(error).toBeInstanceOf(GaitInputError);
      expect((error as GaitInputError).issues).toEqual([
        { path: "cycleMs", message: "must be at least 1 (got -5)" },
        { path: "dutyFactor", message: "must be below 1 (got 1.2)" },
      ]);
    }
    expect(() => generateGait(loadDemoRobot(DEMO_ROBOTS.eight), { template: "tripod" })).toThrow(
      /tripod needs 6 legs, 3 a side \(this robot has 4 left and 4 right\)/,
    );
    expect(() => generateGait(robot, { template: "wave", phase: { XX: 0 } })).toThrow(/phase\.XX: names no leg/);
  });
});
