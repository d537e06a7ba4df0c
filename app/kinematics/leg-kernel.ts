// The closed-form leg solve and its forward twin, side by side so that the
// inverse relation can be read off line by line. Inputs are in the (possibly
// moved) body frame, mm; outputs servo degrees. No allocation.
//
// Conventions (DESIGN.md, "Conventions of the math"): the leg frame sits at the
// mount, turned by the mount yaw about z. Coxa zero points along the mount yaw,
// positive counter-clockwise from above. In the (r, z) leg plane femur and tibia
// turn counter-clockwise; with coxa c, femur f, tibia t:
//   knee = (c + f·cos φf, f·sin φf),  foot = knee + t·(cos α, sin α),  α = φf − 90° + φt.
// servoDeg = geometricDeg − zeroOffsetDeg.
import { DEG_PER_RAD, wrapNear } from "./angles";
import type { LegConstants } from "./leg-constants";
import {
  COXA_AXIS_CLEARANCE_MM,
  SOLVE_BEYOND_REACH,
  SOLVE_COXA_LIMIT,
  SOLVE_FEMUR_LIMIT,
  SOLVE_INSIDE_FOLD,
  SOLVE_INVALID_LEG,
  SOLVE_NOT_FINITE,
  SOLVE_ON_COXA_AXIS,
  SOLVE_TIBIA_LIMIT,
} from "./solve-status";

type NumberSink = { [index: number]: number };

const HALF_PI = Math.PI / 2;
// Round-off allowance when a target sits exactly at full extension or full fold.
const REACH_TOLERANCE_MM = 1e-9;
// Round-off allowance when a solved angle sits exactly on a joint limit.
const LIMIT_TOLERANCE_DEG = 1e-9;

/**
 * Solves one leg for a foot at (x, y, z) in the body frame; writes servo degrees
 * (coxa, femur, tibia) to out[offset..offset+2] and returns the SOLVE_* bits.
 * Unreachable targets get the clamped solution: finite angles, never NaN,
 * whatever the target; a leg whose own numbers are out of range (k.problem)
 * gets zeros and SOLVE_INVALID_LEG.
 */
export function solveLegInto(k: LegConstants, x: number, y: number, z: number, out: NumberSink, offset: number): number {
  if (k.problem !== null) return invalidLeg(out, offset);
  // Into the leg frame: translate to the mount, turn by −yaw.
  const dx = x - k.mountXMm;
  const dy = y - k.mountYMm;
  const legX = k.cosYaw * dx + k.sinYaw * dy;
  const legY = k.cosYaw * dy - k.sinYaw * dx;
  const legZ = z - k.mountZMm;
  const radius = Math.sqrt(legX * legX + legY * legY);
  // NaN fails every comparison, so this also catches NaN targets; a finite
  // target whose squares overflow (beyond about 1e154 mm) takes the far path.
  if (!(radius < Infinity && Math.abs(legZ) < Infinity)) {
    return Number.isFinite(x) && Number.isFinite(y) && Number.isFinite(z) ? farTarget(k, x, y, z, out, offset) : notFinite(k, out, offset);
  }
  let bits = 0;
  if (radius < COXA_AXIS_CLEARANCE_MM) bits |= SOLVE_ON_COXA_AXIS;
  const coxaRad = Math.atan2(legY, legX);

  // Planar two-link solve with the coxa removed, by the law of cosines
  // (Craig, Introduction to Robotics, the planar two-link arm):
  // d² = f² + t² − 2ft·cos γ, γ the interior knee angle.
  const u = radius - k.coxaMm;
  const distanceSquared = u * u + legZ * legZ;
  const distance = Math.sqrt(distanceSquared);
  if (distance > k.reachMaxMm + REACH_TOLERANCE_MM) bits |= SOLVE_BEYOND_REACH;
  else if (distance < k.reachMinMm - REACH_TOLERANCE_MM) bits |= SOLVE_INSIDE_FOLD;
  let cosKnee = (k.linkSquaresSum - distanceSquared) / k.twiceFemurTibia;
  // Clamped, and written so that a NaN would come out as the straight leg.
  if (cosKnee > 1) cosKnee = 1;
  else if (!(cosKnee >= -1)) cosKnee = -1;
  const kneeRad = Math.acos(cosKnee);
  const sinKnee = Math.sqrt(1 - cosKnee * cosKnee);
  // Knee-up branch: φt = γ − 90° ∈ [−90°, 90°]. The foot seen from the femur
  // joint along the femur is (f − t·cos γ, −t·sin γ), so the femur sits that
  // far above the line to the foot.
  const femurRad = Math.atan2(legZ, u) + Math.atan2(k.tibiaMm * sinKnee, k.femurMm - k.tibiaMm * cosKnee);
  const tibiaRad = kneeRad - HALF_PI;

  const coxaDeg = wrapNear((coxaRad - k.coxaOffsetRad) * DEG_PER_RAD, k.coxaMidDeg);
  const femurDeg = wrapNear((femurRad - k.femurOffsetRad) * DEG_PER_RAD, k.femurMidDeg);
  const tibiaDeg = wrapNear((tibiaRad - k.tibiaOffsetRad) * DEG_PER_RAD, k.tibiaMidDeg);
  out[offset] = coxaDeg;
  out[offset + 1] = femurDeg;
  out[offset + 2] = tibiaDeg;

  return bits | limitBits(k, coxaDeg, femurDeg, tibiaDeg);
}

/** The SOLVE_*_LIMIT bits of servo degrees: a value on its limit, to round-off, is inside it. */
export function limitBits(k: LegConstants, coxaDeg: number, femurDeg: number, tibiaDeg: number): number {
  let bits = 0;
  if (coxaDeg < k.coxaMinDeg - LIMIT_TOLERANCE_DEG || coxaDeg > k.coxaMaxDeg + LIMIT_TOLERANCE_DEG) bits |= SOLVE_COXA_LIMIT;
  if (femurDeg < k.femurMinDeg - LIMIT_TOLERANCE_DEG || femurDeg > k.femurMaxDeg + LIMIT_TOLERANCE_DEG) bits |= SOLVE_FEMUR_LIMIT;
  if (tibiaDeg < k.tibiaMinDeg - LIMIT_TOLERANCE_DEG || tibiaDeg > k.tibiaMaxDeg + LIMIT_TOLERANCE_DEG) bits |= SOLVE_TIBIA_LIMIT;
  return bits;
}

// A target so far out that its squares overflow, though every coordinate is
// finite: the straight leg pointing at it (cos γ = −1, the femur along the line
// to the foot), worked out on the target scaled down by 2^−1000 so that
// nothing overflows. Such a target is always beyond full extension.
const FAR_SCALE = 2 ** -1000;
function farTarget(k: LegConstants, x: number, y: number, z: number, out: NumberSink, offset: number): number {
  const dx = x * FAR_SCALE - k.mountXMm * FAR_SCALE;
  const dy = y * FAR_SCALE - k.mountYMm * FAR_SCALE;
  const legX = k.cosYaw * dx + k.sinYaw * dy;
  const legY = k.cosYaw * dy - k.sinYaw * dx;
  const legZ = z * FAR_SCALE - k.mountZMm * FAR_SCALE;
  const u = Math.sqrt(legX * legX + legY * legY) - k.coxaMm * FAR_SCALE;
  const coxaDeg = wrapNear((Math.atan2(legY, legX) - k.coxaOffsetRad) * DEG_PER_RAD, k.coxaMidDeg);
  const femurDeg = wrapNear((Math.atan2(legZ, u) - k.femurOffsetRad) * DEG_PER_RAD, k.femurMidDeg);
  const tibiaDeg = wrapNear((HALF_PI - k.tibiaOffsetRad) * DEG_PER_RAD, k.tibiaMidDeg);
  out[offset] = coxaDeg;
  out[offset + 1] = femurDeg;
  out[offset + 2] = tibiaDeg;
  return SOLVE_BEYOND_REACH | limitBits(k, coxaDeg, femurDeg, tibiaDeg);
}

// A leg whose own numbers are out of range: zeros, the one posture that needs none of them.
function invalidLeg(out: NumberSink, offset: number): number {
  out[offset] = 0;
  out[offset + 1] = 0;
  out[offset + 2] = 0;
  return SOLVE_INVALID_LEG;
}

// A target with NaN or infinite coordinates: the joints' geometric zero, so no NaN leaves.
function notFinite(k: LegConstants, out: NumberSink, offset: number): number {
  const coxaDeg = wrapNear(-k.coxaOffsetDeg, k.coxaMidDeg);
  const femurDeg = wrapNear(-k.femurOffsetDeg, k.femurMidDeg);
  const tibiaDeg = wrapNear(-k.tibiaOffsetDeg, k.tibiaMidDeg);
  out[offset] = coxaDeg;
  out[offset + 1] = femurDeg;
  out[offset + 2] = tibiaDeg;
  return SOLVE_NOT_FINITE | limitBits(k, coxaDeg, femurDeg, tibiaDeg);
}

/** Foot position (body frame, mm) for servo degrees, written to out[offset..offset+2]. */
export function forwardLegInto(k: LegConstants, coxaServoDeg: number, femurServoDeg: number, tibiaServoDeg: number, out: NumberSink, offset: number): void {
  forwardInto(k, coxaServoDeg, femurServoDeg, tibiaServoDeg, false, out, offset);
}

/**
 * Femur joint, knee and foot (body frame, mm) for servo degrees, written to
 * out[offset..offset+8] in that order; the coxa joint is the mount itself.
 */
export function legJointsInto(k: LegConstants, coxaServoDeg: number, femurServoDeg: number, tibiaServoDeg: number, out: NumberSink, offset: number): void {
  forwardInto(k, coxaServoDeg, femurServoDeg, tibiaServoDeg, true, out, offset);
}

// The one forward solve. In the (r, z) leg plane knee = (c + f·cos φf, f·sin φf)
// and foot = knee + t·(cos α, sin α); each point is then turned by the coxa and
// the mount yaw and moved to the mount. Without `joints` only the foot is
// written, the figure a solve needs many times.
function forwardInto(
  k: LegConstants,
  coxaServoDeg: number,
  femurServoDeg: number,
  tibiaServoDeg: number,
  joints: boolean,
  out: NumberSink,
  offset: number,
): void {
  const coxaRad = coxaServoDeg / DEG_PER_RAD + k.coxaOffsetRad;
  const femurRad = femurServoDeg / DEG_PER_RAD + k.femurOffsetRad;
  const tibiaRad = tibiaServoDeg / DEG_PER_RAD + k.tibiaOffsetRad;
  const tibiaDirectionRad = femurRad - HALF_PI + tibiaRad;
  const kneeRadius = k.coxaMm + k.femurMm * Math.cos(femurRad);
  const kneeHeight = k.femurMm * Math.sin(femurRad);
  const footRadius = kneeRadius + k.tibiaMm * Math.cos(tibiaDirectionRad);
  const footHeight = kneeHeight + k.tibiaMm * Math.sin(tibiaDirectionRad);
  const cosCoxa = Math.cos(coxaRad);
  const sinCoxa = Math.sin(coxaRad);
  let at = offset;
  if (joints) {
    planeToBody(k, k.coxaMm, 0, cosCoxa, sinCoxa, out, at);
    planeToBody(k, kneeRadius, kneeHeight, cosCoxa, sinCoxa, out, at + 3);
    at += 6;
  }
  planeToBody(k, footRadius, footHeight, cosCoxa, sinCoxa, out, at);
}

// A point (radius, height) of the leg plane, turned by the coxa and the mount yaw, moved to the mount.
function planeToBody(k: LegConstants, radius: number, height: number, cosCoxa: number, sinCoxa: number, out: NumberSink, offset: number): void {
  const legX = radius * cosCoxa;
  const legY = radius * sinCoxa;
  out[offset] = k.mountXMm + k.cosYaw * legX - k.sinYaw * legY;
  out[offset + 1] = k.mountYMm + k.sinYaw * legX + k.cosYaw * legY;
  out[offset + 2] = k.mountZMm + height;
}
