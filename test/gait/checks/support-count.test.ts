import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { cycleFraction, flaggedFrames } from "../helpers";

// A wave that lifts too many legs: duty factor 0.4 instead of 5/6 keeps each
// leg up for 0.6 of the cycle, so three or four legs are up at once. With the
// lift-offs of Song and Waldron's wave gait (Machines That Walk, 1989: touch-down
// F(i·β) left, F(i·β + 1/2) right, lift-off β later) and the half-open contact
// rule, the frames with fewer than three feet down follow by counting alone.
describe("wave lifting too many legs: support-count exactly where fewer than three feet are down", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const beta = 0.4;
  const frames = 60;
  const sequence = generateGait(robot, { template: "wave", dutyFactor: beta, strideMm: 40, cycleMs: 1200, fps: 50 });
  const solved = solveSequence(robot, sequence);
  const rows: Record<string, [number, "left" | "right"]> = {
    LF: [0, "left"],
    LM: [1, "left"],
    LR: [2, "left"],
    RF: [0, "right"],
    RM: [1, "right"],
    RR: [2, "right"],
  };
  const liftOff = Object.fromEntries(
    Object.entries(rows).map(([legId, [row, side]]) => [legId, cycleFraction(row * beta + (side === "right" ? 0.5 : 0) + beta)]),
  );

  function feetDown(frame: number): number {
    const t = frame / frames;
    // Up from lift-off (included) to touch-down (excluded), 1 − β later.
    return Object.values(liftOff).filter((phase) => !(cycleFraction(t - phase + 1e-12) < 1 - beta)).length;
  }

  it("uses the book's lift-off times", () => {
    for (const [legId, phase] of Object.entries(liftOff)) expect(sequence.generator.phase![legId], legId).toBeCloseTo(phase, 9);
  });

  it("flags the frames with fewer than three feet down, and only those, as errors with the count", () => {
    const expected = Array.from({ length: frames }, (_, frame) => frame).filter((frame) => feetDown(frame) < 3);
    expect(expected.length).toBeGreaterThan(0);
    expect(flaggedFrames(solved.flags, "support-count"), `expected frames ${expected.join(",")}`).toEqual(expected);
    for (const flag of solved.flags.filter((f) => f.kind === "support-count")) {
      expect(flag.value, `frame ${flag.frame}: feet down`).toBe(feetDown(flag.frame));
      expect(flag.severity).toBe("error");
      expect(flag.message).toBe(`${flag.value} feet on the ground at frame ${flag.frame}, at least 3 needed for static support`);
      expect(solved.frames[flag.frame].marginMm, `frame ${flag.frame}: margin`).toBeNull();
    }
  });

  it("a trot's support flags are warnings: the gait is dynamic (DESIGN.md)", () => {
    const quad = loadDemoRobot(DEMO_ROBOTS.four);
    const trot = solveSequence(quad, generateGait(quad, { template: "trot", strideMm: 40, cycleMs: 800, fps: 50 }));
    const support = trot.flags.filter((flag) => flag.kind === "support-count");
    expect(support).toHaveLength(40);
    expect(new Set(support.map((flag) => flag.severity))).toEqual(new Set(["warning"]));
    expect(trot.summary.dynamic).toBe(true);
    expect(trot.summary.errors).toBe(0);
  });
});
