// Time on the timeline: snapping to frames and tenths of frames, keys kept
// between their neighbours, and the frame counts of loops and one-shot moves.
import { describe, expect, test } from "vitest";
import { keyTimeBounds, placeKeyTime, snapTime, solvedFramesOf, wrapTime } from "~/features/gaits/editor/timing";

describe("timing", () => {
  test("snap to the nearest frame (N = 60), or the nearest tenth of a frame", () => {
    expect(snapTime(0.2541, 60) * 60).toBeCloseTo(15, 9);
    expect(snapTime(0.2541, 60, true) * 600).toBeCloseTo(152, 9);
  });

  test("a key stays one step after the previous key and before the next; a loop's last key below t = 1", () => {
    const keys = [{ t: 0 }, { t: 0.5 }, { t: 0.75 }];
    expect(keyTimeBounds(keys, 1, 60, true)).toEqual([1 / 60, 0.75 - 1 / 60]);
    expect(placeKeyTime(keys, 1, 0.9, 60, true) * 60).toBeCloseTo(44, 9);
    expect(placeKeyTime(keys, 2, 1.3, 60, true) * 60).toBeCloseTo(59, 9);
    expect(placeKeyTime(keys, 2, 1.3, 60, false)).toBe(1);
    expect(placeKeyTime(keys, 0, -0.2, 60, true)).toBe(0);
  });

  test("no room between neighbours: the key keeps its time", () => {
    const keys = [{ t: 0 }, { t: 1 / 60 }, { t: 2 / 60 }];
    expect(placeKeyTime(keys, 1, 0.5, 60, true)).toBe(1 / 60);
  });

  test("a loop of 1200 ms at 50 frames/s has 60 frames, a one-shot move 61; wrap keeps loop times in [0, 1)", () => {
    expect(solvedFramesOf({ cycleMs: 1200, fps: 50, loop: true })).toBe(60);
    expect(solvedFramesOf({ cycleMs: 1200, fps: 50, loop: false })).toBe(61);
    expect(wrapTime(1.25)).toBeCloseTo(0.25, 12);
    expect(wrapTime(-0.25)).toBeCloseTo(0.75, 12);
    expect(wrapTime(1 - 1e-12)).toBe(0);
  });
});
