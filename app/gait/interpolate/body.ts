// The body track (DESIGN.md, "Gait sequence"): pose offsets (translation in
// the heading frame, then roll, pitch, yaw) eased between keys with the
// leaving key's curve, riding on top of the travel:
//   T_world←body = Trans(x, y, bodyHeight) · Rz(heading) · T_offset.
// Each of the six numbers is eased on its own; the offsets of a gait are a
// few degrees, where this and any rotation interpolation agree closely.
import type { BodyPose } from "../../kinematics/index";
import { CSS_EASE, type BodyKey, type BodyOffset, type Sequence } from "../sequence";
import { easingFor, type EasingFunction } from "./easing";
import { TIME_EPSILON } from "./legs";

export type BodyPiece = {
  from: number;
  to: number;
  startTime: number;
  endTime: number;
  /** x, y, z, roll, pitch, yaw at the start and end of the segment. */
  start: Float64Array;
  end: Float64Array;
  easing: EasingFunction;
  /** The body lies on the ground (its weight off the feet). */
  resting: boolean;
};

function poseNumbers(key: BodyKey | undefined): Float64Array {
  const pose = key?.pose;
  return Float64Array.of(pose?.x ?? 0, pose?.y ?? 0, pose?.z ?? 0, pose?.roll ?? 0, pose?.pitch ?? 0, pose?.yaw ?? 0);
}

/** Compiles the body keys (strictly increasing t) into pieces in time order. */
export function compileBodyTrack(keys: readonly BodyKey[], loop: boolean): BodyPiece[] {
  const linear = easingFor([0, 0, 1, 1]);
  if (keys.length === 0) {
    const zero = poseNumbers(undefined);
    return [{ from: 0, to: Number.POSITIVE_INFINITY, startTime: 0, endTime: 0, start: zero, end: zero, easing: linear, resting: false }];
  }
  const count = keys.length;
  const pieces: BodyPiece[] = [];
  const segment = (index: number, from: number, to: number, shift: number): BodyPiece => {
    const key = keys[index];
    const nextIndex = (index + 1) % count;
    const endTime = index + 1 < count ? keys[nextIndex].t : loop ? keys[0].t + 1 : key.t;
    return {
      from,
      to,
      startTime: key.t + shift,
      endTime: endTime + shift,
      start: poseNumbers(key),
      end: poseNumbers(index + 1 < count || loop ? keys[nextIndex] : key),
      easing: easingFor(key.ease ?? CSS_EASE),
      resting: key.resting ?? false,
    };
  };
  if (keys[0].t > TIME_EPSILON) {
    if (loop) {
      pieces.push(segment(count - 1, 0, keys[0].t, -1));
    } else {
      const hold = poseNumbers(keys[0]);
      const restingAtStart = keys[0].resting ?? false;
      pieces.push({ from: 0, to: keys[0].t, startTime: 0, endTime: 0, start: hold, end: hold, easing: linear, resting: restingAtStart });
    }
  }
  for (let index = 0; index < count; index += 1) {
    const to = index + 1 < count ? keys[index + 1].t : loop ? 1 : Number.POSITIVE_INFINITY;
    pieces.push(segment(index, keys[index].t, to, 0));
  }
  return pieces;
}

/** The pose offset at time t on `piece`, written into `out`. No allocation. */
export function sampleBodyPiece(piece: BodyPiece, time: number, out: BodyPose): BodyPose {
  const span = piece.endTime - piece.startTime;
  let fraction = span > 0 ? (time - piece.startTime) / span : 0;
  fraction = fraction < 0 ? 0 : fraction > 1 ? 1 : fraction;
  const progress = piece.easing(fraction);
  const a = piece.start;
  const b = piece.end;
  out.x = a[0] + (b[0] - a[0]) * progress;
  out.y = a[1] + (b[1] - a[1]) * progress;
  out.z = a[2] + (b[2] - a[2]) * progress;
  out.roll = a[3] + (b[3] - a[3]) * progress;
  out.pitch = a[4] + (b[4] - a[4]) * progress;
  out.yaw = a[5] + (b[5] - a[5]) * progress;
  return out;
}

/**
 * The body's pose offset at cycle time t (a fraction of the cycle), sampled as
 * the solve samples it: for an editor that shows one time, not a whole solve.
 */
export function bodyOffsetAt(sequence: Sequence, time: number): BodyOffset {
  const pieces = compileBodyTrack(sequence.body.keys, sequence.loop);
  let index = 0;
  while (index + 1 < pieces.length && pieces[index + 1].from <= time + TIME_EPSILON) index += 1;
  return sampleBodyPiece(pieces[index], time, { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 });
}
