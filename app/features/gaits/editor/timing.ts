// Time on the timeline: t is a fraction of the cycle, frames sit at i/N
// (DESIGN.md, "Gait sequence"). Keys snap to frames, or to tenths of a frame
// when fine placement is asked for (Shift), and never pass their neighbours.
import { frameCount } from "../../../gait/index";

/** Tenths of a frame: fine enough to shape a curve, coarse enough to type. */
export const FINE_STEPS_PER_FRAME = 10;
const EPSILON = 1e-9;

type Timing = { cycleMs: number; fps: number; loop: boolean };

/** N = round(cycleMs · fps / 1000). */
export const cycleFramesOf = (sequence: Pick<Timing, "cycleMs" | "fps">) => frameCount(sequence);

/** How many frames the solve has: N for a loop, N + 1 for a one-shot move. */
export const solvedFramesOf = (sequence: Timing) => cycleFramesOf(sequence) + (sequence.loop ? 0 : 1);

export const frameOfTime = (t: number, cycleFrames: number) => Math.round(t * cycleFrames);

/** When frame i plays, ms. */
export const msOfFrame = (frame: number, fps: number) => (frame * 1000) / fps;

export function snapTime(t: number, cycleFrames: number, fine = false): number {
  const steps = cycleFrames * (fine ? FINE_STEPS_PER_FRAME : 1);
  return Math.round(t * steps) / steps;
}

/** Where the key at `index` may go: after the previous key and before the next by one step, inside the cycle. */
export function keyTimeBounds(keys: readonly { t: number }[], index: number, cycleFrames: number, loop: boolean, fine = false): [number, number] {
  const gap = 1 / (cycleFrames * (fine ? FINE_STEPS_PER_FRAME : 1));
  const min = index > 0 ? keys[index - 1].t + gap : 0;
  const max = index + 1 < keys.length ? keys[index + 1].t - gap : loop ? 1 - gap : 1;
  return [min, max];
}

/** The snapped time nearest `t` that keeps the key between its neighbours; the key's own time when there is no room. */
export function placeKeyTime(keys: readonly { t: number }[], index: number, t: number, cycleFrames: number, loop: boolean, fine = false): number {
  const steps = cycleFrames * (fine ? FINE_STEPS_PER_FRAME : 1);
  const [min, max] = keyTimeBounds(keys, index, cycleFrames, loop, fine);
  let placed = snapTime(t, cycleFrames, fine);
  if (placed < min - EPSILON) placed = Math.ceil(min * steps - EPSILON) / steps;
  if (placed > max + EPSILON) placed = Math.floor(max * steps + EPSILON) / steps;
  if (placed < min - EPSILON || placed > max + EPSILON) return keys[index].t;
  // Rounding up from just below zero gives −0, which would print as "-0".
  return placed + 0;
}

/** Wraps a time into a loop's [0, 1). */
export const wrapTime = (t: number) => {
  const wrapped = t - Math.floor(t);
  return wrapped >= 1 - EPSILON ? 0 : wrapped;
};
