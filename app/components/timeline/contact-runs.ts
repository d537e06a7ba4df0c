// The gait diagram's bars: for each leg, the runs of consecutive stance
// frames of a solve, as [first, last + 1) frame ranges. Made once per solve.
import type { SolvedSequence } from "~/gait";

export type FrameRange = [number, number];

const cache = new WeakMap<SolvedSequence, Map<string, FrameRange[]>>();

export function stanceRuns(solved: SolvedSequence, legId: string): FrameRange[] {
  let byLeg = cache.get(solved);
  if (!byLeg) cache.set(solved, (byLeg = new Map()));
  const cached = byLeg.get(legId);
  if (cached) return cached;
  const runs: FrameRange[] = [];
  let start = -1;
  solved.frames.forEach((frame, index) => {
    const down = frame.legs[legId]?.contact === "stance";
    if (down && start < 0) start = index;
    if (!down && start >= 0) {
      runs.push([start, index]);
      start = -1;
    }
  });
  if (start >= 0) runs.push([start, solved.frames.length]);
  byLeg.set(legId, runs);
  return runs;
}
