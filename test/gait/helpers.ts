// Shared by the gait tests: an independent reading of the CSS cubic-bezier
// definition, and world-frame helpers built on three.js (an outside 3-D
// library working in doubles) rather than on the engine's own math.
import { Euler, Matrix4, Vector3 } from "three";
import type { BodyPose, Vec3 } from "~/kinematics/index";
import type { SolvedFrame } from "~/gait/index";

/**
 * cubic-bezier(x1, y1, x2, y2) as W3C CSS Easing Functions Level 1 defines it:
 * the curve through P0 = (0, 0), P1, P2, P3 = (1, 1); the output for input x is
 * the curve's y where its x equals the input, found here by bisection on the
 * curve parameter (x(u) is monotonic for x1, x2 in [0, 1]).
 */
export function cssCubicBezier(x1: number, y1: number, x2: number, y2: number): (x: number) => number {
  const bezier = (a: number, b: number, u: number): number => 3 * a * u * (1 - u) ** 2 + 3 * b * u * u * (1 - u) + u ** 3;
  return (x) => {
    if (x <= 0) return 0;
    if (x >= 1) return 1;
    let low = 0;
    let high = 1;
    for (let i = 0; i < 200 && high - low > 1e-15; i += 1) {
      const middle = (low + high) / 2;
      if (bezier(x1, x2, middle) < x) low = middle;
      else high = middle;
    }
    return bezier(y1, y2, (low + high) / 2);
  };
}

/** T_world←body of a solved frame's body pose, with three.js: translation, then R = Rz·Ry·Rx (Euler order 'ZYX'). */
export function bodyMatrix(body: BodyPose): Matrix4 {
  const radians = Math.PI / 180;
  const rotation = new Matrix4().makeRotationFromEuler(new Euler(body.roll * radians, body.pitch * radians, body.yaw * radians, "ZYX"));
  return new Matrix4().makeTranslation(body.x, body.y, body.z).multiply(rotation);
}

/** The world foot of a leg in a solved frame: T(body) · foot. */
export function worldFoot(frame: SolvedFrame, legId: string): Vec3 {
  const v = new Vector3(...frame.legs[legId].foot).applyMatrix4(bodyMatrix(frame.body));
  return [v.x, v.y, v.z];
}

export function distance(a: readonly number[], b: readonly number[]): number {
  return Math.hypot(...a.map((value, index) => value - b[index]));
}

/** Every number anywhere inside a value (for the no-NaN checks). */
export function numbersIn(value: unknown, out: number[] = []): number[] {
  if (typeof value === "number") out.push(value);
  else if (Array.isArray(value)) for (const item of value) numbersIn(item, out);
  else if (value && typeof value === "object") for (const item of Object.values(value)) numbersIn(item, out);
  return out;
}

/** Frames of the result that carry a flag of `kind` (for `leg`, if given), in order. */
export function flaggedFrames(flags: readonly { frame: number; kind: string; leg?: string }[], kind: string, leg?: string): number[] {
  return [...new Set(flags.filter((flag) => flag.kind === kind && (leg === undefined || flag.leg === leg)).map((flag) => flag.frame))].sort((a, b) => a - b);
}

/** Per frame, the legs in swing (sorted), from a solve without checks. */
export function swingingLegs(frames: readonly SolvedFrame[]): string[][] {
  return frames.map((frame) =>
    Object.entries(frame.legs)
      .filter(([, leg]) => leg.contact === "swing")
      .map(([legId]) => legId)
      .sort(),
  );
}

/** F(x) = x − ⌊x⌋, with values within 1e-9 of 1 taken as 0. */
export function cycleFraction(value: number): number {
  const fraction = value - Math.floor(value);
  return fraction > 1 - 1e-9 ? 0 : fraction;
}

export type StraightWalk = {
  /** The leg's neutral foot, body frame, mm. */
  neutral: Vec3;
  /** Lift-off time (our phase). */
  liftOff: number;
  dutyFactor: number;
  strideMm: number;
  stepHeightMm: number;
  ease: (fraction: number) => number;
};

/**
 * The planned foot of straight walking with no body keys, in the body frame at
 * time t, written from DESIGN.md's text alone: the body moves strideMm per
 * cycle along x; the stance foot is world-fixed, passing its neutral point
 * half-way through the stance (so ±β·stride/2 at its ends); the swing goes in
 * the world from lift-off to touch-down with eased progress and the lift
 * apex·(1 − cos 2πs)/2.
 */
export function straightWalkFoot(walk: StraightWalk, t: number): Vec3 {
  const { neutral, liftOff, dutyFactor: beta, strideMm: stride, stepHeightMm: apex, ease } = walk;
  const sinceLiftOff = cycleFraction(t - liftOff);
  const swingTime = 1 - beta;
  if (sinceLiftOff < swingTime) {
    const s = sinceLiftOff / swingTime;
    // World: lift-off point + stride · ease(s); body: moved stride · sinceLiftOff since lift-off.
    const x = neutral[0] - (beta * stride) / 2 + stride * ease(s) - stride * sinceLiftOff;
    return [x, neutral[1], neutral[2] + (apex * (1 - Math.cos(2 * Math.PI * s))) / 2];
  }
  const sinceTouchDown = sinceLiftOff - swingTime;
  return [neutral[0] + (beta * stride) / 2 - stride * sinceTouchDown, neutral[1], neutral[2]];
}
