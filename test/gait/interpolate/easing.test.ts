import { describe, expect, it } from "vitest";
import { CSS_EASE } from "~/gait/index";
import { easingFor } from "~/gait/interpolate/easing";
import { cssCubicBezier } from "../helpers";

// W3C CSS Easing Functions Level 1: `ease` is cubic-bezier(0.25, 0.1, 0.25, 1),
// `ease-in-out` cubic-bezier(0.42, 0, 0.58, 1); the output is the curve's y at the
// input x. The browser's own curve is compared in an e2e test elsewhere.
const CURVES: [string, [number, number, number, number]][] = [
  ["ease", [0.25, 0.1, 0.25, 1]],
  ["ease-in", [0.42, 0, 1, 1]],
  ["ease-out", [0, 0, 0.58, 1]],
  ["ease-in-out", [0.42, 0, 0.58, 1]],
  ["an overshooting custom curve", [0.3, -0.4, 0.7, 1.4]],
];

describe("swing easing against the W3C CSS Easing Functions Level 1 definition of cubic-bezier", () => {
  it("the default key ease is CSS `ease`, cubic-bezier(0.25, 0.1, 0.25, 1)", () => {
    expect(CSS_EASE).toEqual([0.25, 0.1, 0.25, 1]);
  });

  for (const [name, curve] of CURVES) {
    it(`${name} matches the curve's definition to 1e-9 at 101 inputs`, () => {
      const ours = easingFor(curve);
      const reference = cssCubicBezier(...curve);
      for (let i = 0; i <= 100; i += 1) {
        const x = i / 100;
        const got = ours(x);
        const expected = reference(x);
        expect(Math.abs(got - expected), `${name} at x = ${x}: expected ${expected}, got ${got}`).toBeLessThan(1e-9);
      }
    });
  }

  it("ease at x = 0.5 is 0.8024 (from memory, and as the definition gives it), and the ends are 0 and 1", () => {
    const ease = easingFor(CSS_EASE);
    expect(ease(0)).toBe(0);
    expect(ease(1)).toBe(1);
    expect(ease(0.5)).toBeCloseTo(cssCubicBezier(0.25, 0.1, 0.25, 1)(0.5), 12);
    expect(ease(0.5)).toBeCloseTo(0.8024, 4);
  });
});
