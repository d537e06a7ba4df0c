import { describe, expect, it } from "vitest";
import { generateGait, legLayout, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { swingingLegs } from "../helpers";

// Tetrapod: duty factor 2/3, two legs up at a time, one on each side and in
// different rows, four feet always down (common practice, from memory).
describe("tetrapod template (common practice, from memory)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const layout = legLayout(robot);
  const sequence = generateGait(robot, { template: "tetrapod", cycleMs: 1200, fps: 60, strideMm: 40 });

  it("has duty factor 2/3", () => {
    expect(sequence.generator.dutyFactor).toBeCloseTo(2 / 3, 12);
  });

  it("swings two legs at every frame, one left and one right, never of the same row, each leg for a third of the cycle", () => {
    const frames = solveSequence(robot, sequence, { checks: [] }).frames;
    const framesUp: Record<string, number> = {};
    swingingLegs(frames).forEach((legs, frame) => {
      expect(legs.length, `frame ${frame}: expected 2 legs in swing, got ${legs.join(" ")}`).toBe(2);
      const [a, b] = legs.map((legId) => layout.seat[legId]);
      expect(a.side, `frame ${frame}: ${legs.join(" ")} on one side`).not.toBe(b.side);
      expect(a.row, `frame ${frame}: ${legs.join(" ")} in one row`).not.toBe(b.row);
      for (const legId of legs) framesUp[legId] = (framesUp[legId] ?? 0) + 1;
    });
    for (const legId of layout.legIds) expect(framesUp[legId], `${legId}: frames in swing, expected 24`).toBe(24);
  });
});
