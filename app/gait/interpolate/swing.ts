// Swing (DESIGN.md, "Gait sequence"): from the lift-off point to the touch-down
// point; horizontal progress is the eased time fraction, the height above the
// straight path apexMm·(1 − cos 2πs)/2 of the plain time fraction s, so the
// foot leaves and meets the ground with zero vertical speed. Interpolated in
// the world (a frame fixed while the foot is in the air), so the step is a
// straight line over the ground even when the body turns. Endpoints off the
// ground (explicit keys, entry moves) share the eased progress in height too.
import type { EasingFunction } from "./easing";

const TWO_PI = 2 * Math.PI;

/** Swing height profile: apexMm·(1 − cos 2πs)/2 for the plain time fraction s in [0, 1]. */
export function swingLift(apexMm: number, fraction: number): number {
  return (apexMm * (1 - Math.cos(TWO_PI * fraction))) / 2;
}

/**
 * The swinging foot at plain time fraction `fraction` between world points
 * `from` and `to` (out[offset..offset+2] ← world mm). No allocation.
 */
export function swingPoint(
  from: Float64Array,
  fromOffset: number,
  to: Float64Array,
  toOffset: number,
  fraction: number,
  easing: EasingFunction,
  apexMm: number,
  out: Float64Array,
  offset: number,
): void {
  const s = fraction < 0 ? 0 : fraction > 1 ? 1 : fraction;
  const progress = easing(s);
  out[offset] = from[fromOffset] + (to[toOffset] - from[fromOffset]) * progress;
  out[offset + 1] = from[fromOffset + 1] + (to[toOffset + 1] - from[fromOffset + 1]) * progress;
  out[offset + 2] = from[fromOffset + 2] + (to[toOffset + 2] - from[fromOffset + 2]) * progress + swingLift(apexMm, s);
}
