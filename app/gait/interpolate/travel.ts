// The body's travel over the ground (DESIGN.md, "Gait sequence", Motion): the
// body moves `strideMm` per cycle in the body-frame direction `directionDeg`
// and turns `turnDegPerCycle` about its centre, both at a constant rate. A
// constant body-frame velocity and turn rate is a constant planar twist, so
// the heading frame after a fraction Δ of the cycle is
//   E(Δ) = Trans(p(Δ)) · Rz(ψΔ),  p(Δ) = D·Δ · sinc(ψΔ/2) · (cos(θ + ψΔ/2), sin(θ + ψΔ/2)),
// the chord of the arc of length D·Δ (sin a − sin b = 2 cos((a+b)/2) sin((a−b)/2)),
// which stays exact as the turn goes to zero. E depends only on Δ, so a point
// fixed in the world is carried between any two times by E alone.
import { RAD_PER_DEG } from "../../kinematics/index";

export type Travel = {
  strideMm: number;
  directionRad: number;
  turnRad: number;
  bodyHeightMm: number;
};

/** A planar rigid transform: x' = c·x − s·y + x0, y' = s·x + c·y + y0. */
export type Planar = { x: number; y: number; cos: number; sin: number; headingRad: number };

export function createTravel(strideMm: number, directionDeg: number, turnDegPerCycle: number, bodyHeightMm: number): Travel {
  return { strideMm, directionRad: directionDeg * RAD_PER_DEG, turnRad: turnDegPerCycle * RAD_PER_DEG, bodyHeightMm };
}

export function createPlanar(): Planar {
  return { x: 0, y: 0, cos: 1, sin: 0, headingRad: 0 };
}

function sinc(u: number): number {
  // Taylor series near 0, where sin(u)/u loses digits.
  if (Math.abs(u) < 1e-4) return 1 - (u * u) / 6;
  return Math.sin(u) / u;
}

/** E(Δ): the heading frame after a fraction Δ of the cycle, relative to where it started; Δ may be negative. */
export function travelBy(travel: Travel, delta: number, out: Planar): Planar {
  const heading = travel.turnRad * delta;
  const half = heading / 2;
  const chord = travel.strideMm * delta * sinc(half);
  out.x = chord * Math.cos(travel.directionRad + half);
  out.y = chord * Math.sin(travel.directionRad + half);
  out.headingRad = heading;
  out.cos = Math.cos(heading);
  out.sin = Math.sin(heading);
  return out;
}

/** World point of a point (x, y, z) given in the heading frame `frame` at body height h: Trans(0, 0, h)·E·p. */
export function headingToWorld(frame: Planar, bodyHeightMm: number, x: number, y: number, z: number, out: Float64Array, offset: number): void {
  out[offset] = frame.cos * x - frame.sin * y + frame.x;
  out[offset + 1] = frame.sin * x + frame.cos * y + frame.y;
  out[offset + 2] = z + bodyHeightMm;
}

/** The inverse: a world point into the heading frame `frame`. */
export function worldToHeading(frame: Planar, bodyHeightMm: number, x: number, y: number, z: number, out: Float64Array, offset: number): void {
  const dx = x - frame.x;
  const dy = y - frame.y;
  out[offset] = frame.cos * dx + frame.sin * dy;
  out[offset + 1] = -frame.sin * dx + frame.cos * dy;
  out[offset + 2] = z - bodyHeightMm;
}
