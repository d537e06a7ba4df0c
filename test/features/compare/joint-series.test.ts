import { describe, expect, it } from "vitest";
import { jointOverlays, sampleAt, sampleFractions, type AngleFrames } from "~/features/compare";

const frames = (values: number[], loop = true): AngleFrames => ({
  loop,
  frames: values.map((value) => ({ legs: { LF: { angles: { coxa: value, femur: 2 * value, tibia: 0 } } } })),
});

describe("joint overlays on one time axis", () => {
  it("samples a loop linearly between frames and wraps to frame 0 at the end of the cycle", () => {
    const values = [0, 10, 20, 30];
    expect(sampleAt(values, true, 0)).toBe(0);
    expect(sampleAt(values, true, 0.125)).toBe(5);
    expect(sampleAt(values, true, 0.875)).toBe(15); // halfway from 30 back to 0
    expect(sampleAt(values, true, 1)).toBe(0);
  });

  it("samples a one-shot move with its last frame at the end", () => {
    expect(sampleAt([0, 10, 20], false, 1)).toBe(20);
    expect(sampleAt([0, 10, 20], false, 0.25)).toBe(5);
  });

  it("draws both on the finer grid, closing the loop at 1", () => {
    expect(sampleFractions(4, 2, true)).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(sampleFractions(3, 5, false)).toEqual([0, 0.25, 0.5, 0.75, 1]);
  });

  it("gives A and B per leg and joint and their largest difference in degrees", () => {
    const overlays = jointOverlays(frames([0, 10, 20, 30]), frames([0, 40]));
    expect(overlays.map((overlay) => `${overlay.legId} ${overlay.joint}`)).toEqual(["LF coxa", "LF femur", "LF tibia"]);
    const coxa = overlays[0];
    expect(coxa.a).toEqual([0, 10, 20, 30, 0]);
    expect(coxa.b).toEqual([0, 20, 40, 20, 0]);
    expect(coxa.maxDifferenceDeg).toBe(20);
    expect(overlays[1].maxDifferenceDeg).toBe(40);
    expect(overlays[2].maxDifferenceDeg).toBe(0);
  });

  it("leaves out legs only one side has", () => {
    const b: AngleFrames = { loop: true, frames: [{ legs: { RF: { angles: { coxa: 0, femur: 0, tibia: 0 } } } }] };
    expect(jointOverlays(frames([0, 1]), b)).toEqual([]);
  });
});
