import { describe, expect, it } from "vitest";
import { generateGait, legLayout, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { cycleFraction, swingingLegs } from "../helpers";

// Ripple: duty factor 3/4; on each side the legs lift from the back forwards a
// third of a cycle apart, the sides half a cycle apart, so at most two legs are
// up and never two neighbours on one side (common practice, from memory).
describe("ripple template (common practice, from memory)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const layout = legLayout(robot);
  const sequence = generateGait(robot, { template: "ripple", cycleMs: 1200, fps: 60, strideMm: 40 });
  const phase = sequence.generator.phase!;

  it("has duty factor 3/4", () => {
    expect(sequence.generator.dutyFactor).toBe(0.75);
  });

  it("lifts each side back to front a third of a cycle apart, the right side half a cycle after the left", () => {
    for (const side of [layout.left, layout.right]) {
      expect(cycleFraction(phase[side[1]] - phase[side[2]]), `${side[1]} after ${side[2]}`).toBeCloseTo(1 / 3, 9);
      expect(cycleFraction(phase[side[0]] - phase[side[1]]), `${side[0]} after ${side[1]}`).toBeCloseTo(1 / 3, 9);
    }
    for (let row = 0; row < 3; row += 1) {
      expect(cycleFraction(phase[layout.right[row]] - phase[layout.left[row]]), `row ${row}: right after left`).toBeCloseTo(1 / 2, 9);
    }
  });

  it("has at most two legs up at every frame, never neighbours on one side", () => {
    swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames).forEach((legs, frame) => {
      expect(legs.length, `frame ${frame}: ${legs.join(" ")}`).toBeLessThanOrEqual(2);
      if (legs.length === 2) {
        const [a, b] = legs.map((legId) => layout.seat[legId]);
        expect(a.side === b.side && Math.abs(a.row - b.row) === 1, `frame ${frame}: neighbours ${legs.join(" ")} both up`).toBe(false);
      }
    });
  });
});
