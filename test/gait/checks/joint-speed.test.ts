import { describe, expect, it } from "vitest";
import { CSS_EASE, solveSequence } from "~/gait/index";
import { cssCubicBezier } from "../helpers";
import { flagKey, straightTripod } from "./expected";

// A deliberately too-fast cycle: a tripod step of 40 mm in 500 ms turns some
// joints faster than their maxSpeedDegS. Joint speed is |Δangle| · fps between
// frames (DESIGN.md); the expected frames come from DESIGN.md's foot path, the
// W3C cubic-bezier definition of `ease` and the kinematics' solveLeg.
describe("too-fast cycle: joint-speed flags exactly where |Δangle|·fps exceeds maxSpeedDegS", () => {
  const { robot, sequence, solved, expected } = straightTripod({ strideMm: 40, cycleMs: 500, fps: 50, stepHeightMm: 25 }, cssCubicBezier(...CSS_EASE));

  it("flags the same frames, legs and joints, with speeds to 1e-6 °/s, and nothing else", () => {
    const want = expected.flags.map(flagKey).sort();
    const got = solved.flags.map(flagKey).sort();
    expect(want.length).toBeGreaterThan(0);
    expect(got, `expected: ${want.join("; ")}`).toEqual(want);
    for (const flag of solved.flags) {
      const match = expected.flags.find((other) => flagKey(other) === flagKey(flag))!;
      expect(Math.abs(flag.value - match.value), `${flagKey(flag)}: expected ${match.value} °/s, got ${flag.value} °/s`).toBeLessThan(1e-6);
    }
  });

  it("reads like 'LR tibia turns 355 °/s at frame 3, limit 330 °/s'", () => {
    const first = solved.flags.find((flag) => flag.kind === "joint-speed")!;
    expect(first.message).toBe(`${first.leg} ${first.joint} turns ${first.value.toFixed(0)} °/s at frame ${first.frame}, limit ${first.limit} °/s`);
    expect(first.message).toBe("LR tibia turns 355 °/s at frame 3, limit 330 °/s");
    expect(first.severity).toBe("error");
  });

  it("speedHeadroom is below 1 here and is the factor that brings the fastest joint to its limit", () => {
    const headroom = solved.summary.speedHeadroom!;
    expect(headroom).toBeLessThan(1);
    // Playing slower by the headroom (cycle and rate scaled together, same samples) just reaches the limit.
    const slower = solveSequence(robot, { ...sequence, cycleMs: sequence.cycleMs / headroom, fps: sequence.fps * headroom });
    expect(slower.summary.frames).toBe(solved.summary.frames);
    expect(slower.summary.speedHeadroom!, "headroom after slowing by it").toBeCloseTo(1, 9);
  });
});
