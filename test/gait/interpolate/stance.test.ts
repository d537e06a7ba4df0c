import { describe, expect, it } from "vitest";
import { generateGait, solveSequence, type GaitParams } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot, type DemoRobotFile } from "../../support/robots";
import { distance, worldFoot } from "../helpers";

// DESIGN.md, Gait sequence: a stance foot stays where it touched down, fixed in
// the world, while the body moves. The world foot is recomposed here with
// three.js (T(body) · foot), not with the engine's own transforms.
const CASES: [string, DemoRobotFile, GaitParams][] = [
  ["straight, tripod", DEMO_ROBOTS.six, { template: "tripod", strideMm: 50 }],
  ["sideways and turning, ripple", DEMO_ROBOTS.six, { template: "ripple", strideMm: 40, directionDeg: 60, turnDegPerCycle: 20 }],
  ["turning on the spot, wave", DEMO_ROBOTS.four, { template: "wave", strideMm: 0, turnDegPerCycle: -15, cycleMs: 2400 }],
  [
    "turning with body keys (crouch, lean, shift), alternating tetrapod",
    DEMO_ROBOTS.eight,
    {
      template: "alternating-tetrapod",
      strideMm: 30,
      turnDegPerCycle: 12,
      bodyKeys: [
        { t: 0, pose: { z: 0, x: 0 } },
        { t: 0.3, pose: { z: -12, roll: 4, pitch: -3, x: 6, y: -4, yaw: 3 } },
        { t: 0.7, pose: { z: -5, roll: -2, y: 5 } },
      ],
    },
  ],
];

describe("stance feet are fixed in the world to 1e-6 mm (DESIGN.md; world feet recomposed with three.js)", () => {
  for (const [name, file, params] of CASES) {
    it(name, () => {
      const robot = loadDemoRobot(file);
      const frames = solveSequence(robot, generateGait(robot, { cycleMs: 1200, fps: 50, ...params }), { checks: [] }).frames;
      let runs = 0;
      for (const legId of Object.keys(frames[0].legs)) {
        for (let frame = 1; frame < frames.length; frame += 1) {
          if (frames[frame].legs[legId].contact !== "stance" || frames[frame - 1].legs[legId].contact !== "stance") continue;
          runs += 1;
          const before = worldFoot(frames[frame - 1], legId);
          const here = worldFoot(frames[frame], legId);
          const moved = distance(before, here);
          expect(moved, `${legId} stance foot moved ${moved} mm in the world from frame ${frame - 1} to ${frame}, expected ≤ 1e-6 mm`).toBeLessThan(1e-6);
          expect(Math.abs(here[2]), `${legId} stance foot height at frame ${frame}, expected 0 mm`).toBeLessThan(1e-6);
        }
      }
      expect(runs).toBeGreaterThan(100);
    });
  }

  it("in the body frame the stance foot slides back along the travel (straight: by stride/cycle per frame)", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.six);
    const frames = solveSequence(robot, generateGait(robot, { template: "tripod", strideMm: 60, cycleMs: 1200, fps: 50 }), { checks: [] }).frames;
    // LM is in stance in frames 0..29 (tripod set B lifts at t = 1/2).
    for (let frame = 1; frame < 30; frame += 1) {
      const step = frames[frame].legs.LM.foot[0] - frames[frame - 1].legs.LM.foot[0];
      expect(step, `LM foot x step at frame ${frame}: expected −1 mm (60 mm / 60 frames), got ${step}`).toBeCloseTo(-1, 9);
    }
  });
});
