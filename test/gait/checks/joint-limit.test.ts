import { describe, expect, it } from "vitest";
import { flagKey, straightTripod } from "./expected";

// A deliberately too-long stride: 320 mm a cycle for the six-legged demo robot
// drives the coxa past ±45° at the ends of the stroke. The expected flags come
// from DESIGN.md's foot path and the kinematics' solveLeg, not from the engine.
describe("too-long stride: joint-limit flags exactly where DESIGN.md's foot path leaves the joint limits", () => {
  const linear = [0, 0, 1, 1] as [number, number, number, number];
  const { solved, expected } = straightTripod({ strideMm: 320, cycleMs: 2000, fps: 25, stepHeightMm: 25, swingEase: linear }, (s) => s);

  it("every foot stays reachable (only the limits are passed)", () => {
    expect(expected.unreachable).toBe(0);
    expect(solved.flags.filter((flag) => flag.kind === "unreachable")).toEqual([]);
  });

  for (const kind of ["joint-limit", "joint-speed", "loop-jump"]) {
    it(`${kind}: the same frames, legs and joints as worked out independently`, () => {
      const want = expected.flags
        .filter((flag) => flag.kind === kind)
        .map(flagKey)
        .sort();
      const got = solved.flags
        .filter((flag) => flag.kind === kind)
        .map(flagKey)
        .sort();
      expect(got, `expected ${want.length} ${kind} flags: ${want.join("; ")}`).toEqual(want);
    });
  }

  it("joint-limit values and limits agree to 1e-6°, and the messages read in degrees", () => {
    const joints = solved.flags.filter((flag) => flag.kind === "joint-limit");
    expect(joints.length).toBeGreaterThan(4);
    for (const flag of joints) {
      const match = expected.flags.find((other) => flagKey(other) === flagKey(flag))!;
      expect(Math.abs(flag.value - match.value), `${flagKey(flag)}: angle expected ${match.value}°, got ${flag.value}°`).toBeLessThan(1e-6);
      expect(flag.limit).toBe(match.limit);
      expect(flag.severity).toBe("error");
      const side = flag.value > flag.limit ? "above its maximum" : "below its minimum";
      expect(flag.message).toBe(`${flag.leg} ${flag.joint} at ${flag.value.toFixed(1)}° at frame ${flag.frame}, ${side} ${flag.limit.toFixed(1)}°`);
    }
    expect(joints[0].message).toBe("LF coxa at 51.9° at frame 0, above its maximum 45.0°");
  });
});
