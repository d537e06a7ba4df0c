import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { frameAt, playbackOf, syncedFractions } from "~/features/compare";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";

describe("playbackOf", () => {
  it("keeps per frame the body height and tilt, each leg's servo angles (to 0.001°), the margin and the feet down", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.six);
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40 });
    const solved = solveSequence(robot, sequence);
    const playback = playbackOf(solved, sequence.cycleMs, sequence.loop);
    expect(playback).toMatchObject({ cycleMs: 1200, fps: 50, loop: true });
    expect(playback.frames).toHaveLength(60);
    const [first] = playback.frames;
    expect(first.heightMm).toBeCloseTo(solved.frames[0].body.z, 2);
    for (const [legId, leg] of Object.entries(solved.frames[0].legs)) {
      expect(Math.abs(first.angles[legId].femur - leg.angles.femur)).toBeLessThanOrEqual(0.0005);
    }
    expect(first.stance.sort()).toEqual(
      Object.entries(solved.frames[0].legs)
        .filter(([, leg]) => leg.contact === "stance")
        .map(([id]) => id)
        .sort(),
    );
  });
});

describe("frameAt", () => {
  it("shows the last frame at or before the cycle fraction, wrapping a loop", () => {
    const loop = { loop: true, frames: new Array(50).fill(null) };
    expect(frameAt(loop, 0)).toBe(0);
    expect(frameAt(loop, 0.5)).toBe(25);
    expect(frameAt(loop, 0.999)).toBe(49);
    expect(frameAt(loop, 1)).toBe(0);
    expect(frameAt({ loop: false, frames: new Array(51).fill(null) }, 1)).toBe(50);
  });
});

describe("syncedFractions", () => {
  it("in the same phase, both follow A's cycle; in real time, each its own (1200 ms against 1000 ms)", () => {
    expect(syncedFractions(600, "phase", 1200, 1000)).toEqual([0.5, 0.5]);
    expect(syncedFractions(600, "time", 1200, 1000)).toEqual([0.5, 0.6]);
    expect(syncedFractions(1300, "time", 1200, 1000)).toEqual([100 / 1200, 0.3]);
  });
});
