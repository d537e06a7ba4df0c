// Where a foot can be: the reach ring at a given height (for drawing) and the
// neutral stance (every foot on the ground at a comfortable mid-reach).
import { RAD_PER_DEG } from "./angles";
import { legConstants, type LegConstants } from "./leg-constants";
import { solveLegInto } from "./leg-kernel";
import { findLeg, type Robot, type Vec3 } from "./robot";
import { COXA_AXIS_CLEARANCE_MM, SOLVE_COXA_LIMIT } from "./solve-status";

export type ReachRing = {
  legId: string;
  footZMm: number;
  /** The ring's centre, the coxa axis, [x, y] mm in the body frame. */
  centerMm: [number, number];
  /** Distances from the coxa axis that the femur and tibia reach at this height, ignoring their limits. */
  geometricInnerMm: number;
  geometricOuterMm: number;
  /**
   * The same inside the femur and tibia limits; the span from the nearest to
   * the farthest such distance. Both 0 when no posture within limits reaches this height.
   */
  innerMm: number;
  outerMm: number;
  /** True when some posture within femur and tibia limits puts the foot at this height. */
  reachable: boolean;
  /** Directions (degrees, counter-clockwise from body forward) the coxa limits allow, from start to end. */
  startDeg: number;
  endDeg: number;
};

/** The leg's reach at foot height `footZMm` (body frame): an annulus about the coxa axis and the coxa's sector. */
export function reachRing(robot: Robot, legId: string, footZMm: number): ReachRing {
  const leg = findLeg(robot, legId);
  const k = legConstants(leg);
  if (k.problem !== null) throw new RangeError(`reachRing: leg ${legId} has no reach: ${k.problem} (a definition parseRobot would refuse)`);
  const height = Math.abs(footZMm - k.mountZMm);
  let geometricInnerMm = 0;
  let geometricOuterMm = 0;
  if (height <= k.reachMaxMm) {
    const outerSpan = Math.sqrt(k.reachMaxMm * k.reachMaxMm - height * height);
    geometricOuterMm = k.coxaMm + outerSpan;
    geometricInnerMm =
      height < k.reachMinMm ? k.coxaMm + Math.sqrt(k.reachMinMm * k.reachMinMm - height * height) : Math.max(COXA_AXIS_CLEARANCE_MM, k.coxaMm - outerSpan);
  }
  const limited = limitedSpan(k, footZMm, geometricInnerMm, geometricOuterMm);
  const sectorStartDeg = leg.mount.yawDeg + leg.joints.coxa.zeroOffsetDeg + leg.joints.coxa.minDeg;
  const sectorEndDeg = leg.mount.yawDeg + leg.joints.coxa.zeroOffsetDeg + leg.joints.coxa.maxDeg;
  return {
    legId,
    footZMm,
    centerMm: [k.mountXMm, k.mountYMm],
    geometricInnerMm,
    geometricOuterMm,
    innerMm: limited ? limited[0] : 0,
    outerMm: limited ? limited[1] : 0,
    reachable: limited !== null,
    startDeg: sectorStartDeg,
    endDeg: sectorEndDeg,
  };
}

const scratch = new Float64Array(3);

// Within femur and tibia limits at distance r from the coxa axis, along the coxa's zero direction.
function fitsAt(k: LegConstants, footZMm: number, radiusMm: number): boolean {
  const x = k.mountXMm + radiusMm * k.cosYaw;
  const y = k.mountYMm + radiusMm * k.sinYaw;
  return (solveLegInto(k, x, y, footZMm, scratch, 0) & ~SOLVE_COXA_LIMIT) === 0;
}

const TWO_PI = 2 * Math.PI;
const HALF_PI = Math.PI / 2;
// Angle slack when deciding whether an edge point lies on a limit arc: a
// point taken in error only splits a piece that is tested anyway.
const ANGLE_SLACK_RAD = 1e-9;
// Two tibia ranges at most (a limit arc meets [−90°, 90°] at both ends), four
// edge arcs each, two crossings an arc, and the scan's two ends.
const candidates = new Float64Array(2 * 4 * 2 + 2);
const tibiaRanges = new Float64Array(4);

/**
 * The span [nearest, farthest] of the distances in [fromMm, toMm] from the
 * coxa axis at which the foot, at height footZMm along the coxa's zero, is
 * within the femur and tibia limits; null when there is none.
 *
 * In closed form, so a leg of 2 000 mm costs what a leg of 50 mm does. The
 * postures within limits, (φf, φt) in a box of geometric angles, map onto a
 * region of the leg plane whose boundary is the image of the box's edges:
 * with φf fixed the foot runs on a circle of radius t about the knee, with
 * φt fixed on a circle about the femur joint. The horizontal line at the
 * foot's height crosses those arcs at a handful of points, each found from
 * its circle with one arcsine; between two neighbouring crossings the line is wholly inside or
 * wholly outside, which one solve at the middle decides.
 */
function limitedSpan(k: LegConstants, footZMm: number, fromMm: number, toMm: number): [number, number] | null {
  if (toMm <= fromMm) return null;
  const height = footZMm - k.mountZMm;
  const f = k.femurMm;
  const t = k.tibiaMm;
  const femurLow = (k.femurMinDeg + k.femurOffsetDeg) * RAD_PER_DEG;
  const femurSpan = (k.femurMaxDeg - k.femurMinDeg) * RAD_PER_DEG;
  // Crossings as distances from the coxa axis; those outside (fromMm, toMm) are dropped below.
  let count = 0;
  const ranges = tibiaRangesInto(k, tibiaRanges);
  for (let range = 0; range < ranges; range += 1) {
    const tibiaLow = tibiaRanges[range * 2];
    const tibiaHigh = tibiaRanges[range * 2 + 1];
    // The femur at a limit: the foot on the circle of radius t about the knee, t·sin α = h − f·sin φf.
    for (let edge = 0; edge < 2; edge += 1) {
      const femur = edge === 0 ? femurLow : femurLow + femurSpan;
      const sine = (height - f * Math.sin(femur)) / t;
      if (!(Math.abs(sine) <= 1)) continue;
      const first = Math.asin(sine);
      for (let crossing = 0; crossing < 2; crossing += 1) {
        const direction = crossing === 0 ? first : Math.PI - first;
        // α = φf − 90° + φt
        const tibia = wrapPi(direction - femur + HALF_PI);
        if (tibia >= tibiaLow - ANGLE_SLACK_RAD && tibia <= tibiaHigh + ANGLE_SLACK_RAD) {
          candidates[count++] = k.coxaMm + f * Math.cos(femur) + t * Math.cos(direction);
        }
      }
    }
    // The tibia at a limit: the foot at R(φf)·(f + t·sin φt, −t·cos φt), a circle about the femur joint.
    for (let edge = 0; edge < 2; edge += 1) {
      const tibia = edge === 0 ? tibiaLow : tibiaHigh;
      const reachX = f + t * Math.sin(tibia);
      const reachZ = -t * Math.cos(tibia);
      const reach = Math.sqrt(reachX * reachX + reachZ * reachZ);
      if (!(reach > 0 && Math.abs(height) <= reach)) continue;
      const first = Math.asin(height / reach);
      const lag = Math.atan2(reachZ, reachX);
      for (let crossing = 0; crossing < 2; crossing += 1) {
        const direction = crossing === 0 ? first : Math.PI - first;
        let fromLow = (direction - lag - femurLow) % TWO_PI;
        if (fromLow < 0) fromLow += TWO_PI;
        if (fromLow <= femurSpan + ANGLE_SLACK_RAD || fromLow >= TWO_PI - ANGLE_SLACK_RAD) candidates[count++] = k.coxaMm + reach * Math.cos(direction);
      }
    }
  }
  let kept = 0;
  for (let i = 0; i < count; i += 1) if (candidates[i] > fromMm && candidates[i] < toMm) candidates[kept++] = candidates[i];
  candidates[kept++] = fromMm;
  candidates[kept++] = toMm;
  count = kept;
  // Insertion sort: a few numbers, no allocation.
  for (let i = 1; i < count; i += 1) {
    const value = candidates[i];
    let j = i - 1;
    while (j >= 0 && candidates[j] > value) {
      candidates[j + 1] = candidates[j];
      j -= 1;
    }
    candidates[j + 1] = value;
  }
  let inner = Number.NaN;
  let outer = Number.NaN;
  for (let i = 0; i + 1 < count; i += 1) {
    const start = candidates[i];
    const end = candidates[i + 1];
    if (end <= start) continue;
    if (fitsAt(k, footZMm, (start + end) / 2)) {
      if (Number.isNaN(inner)) inner = start;
      outer = end;
    }
  }
  // A limit range that only touches the line (the straight knee, say) fits at single crossings.
  for (let i = 0; i < count; i += 1) {
    const radius = candidates[i];
    if (radius >= inner && radius <= outer) continue;
    if (!fitsAt(k, footZMm, radius)) continue;
    if (!(radius >= inner)) inner = radius;
    if (!(radius <= outer)) outer = radius;
  }
  return Number.isNaN(inner) ? null : [inner, outer];
}

/**
 * The geometric tibia angles (radians) the knee-up solve can give, [−90°, 90°],
 * that lie within the tibia's limits (servo limits plus the zero offset, a turn
 * of 360° apart): one or two ranges, written as [low, high] pairs; returns how many.
 */
function tibiaRangesInto(k: LegConstants, out: Float64Array): number {
  const low = k.tibiaMinDeg + k.tibiaOffsetDeg;
  const high = k.tibiaMaxDeg + k.tibiaOffsetDeg;
  let ranges = 0;
  for (let turn = -2; turn <= 2 && ranges < 2; turn += 1) {
    const from = Math.max(-90, low + 360 * turn);
    const to = Math.min(90, high + 360 * turn);
    if (from > to) continue;
    out[ranges * 2] = from * RAD_PER_DEG;
    out[ranges * 2 + 1] = to * RAD_PER_DEG;
    ranges += 1;
  }
  return ranges;
}

// The angle modulo a full turn, in (−π, π].
function wrapPi(angleRad: number): number {
  const wrapped = angleRad - TWO_PI * Math.round(angleRad / TWO_PI);
  return wrapped === -Math.PI ? Math.PI : wrapped;
}

/**
 * Feet on the ground (z = −bodyHeightMm in the body frame) in the direction of
 * each mount's yaw (turned into the coxa limits if the coxa's zero lies outside
 * them), halfway out along the reach ring inside the femur and tibia limits. The
 * ring's inner edge counts as no nearer than the femur joint (the coxa length):
 * a foot tucked under the coxa is reachable but not a stance anyone walks in.
 */
export function neutralStance(robot: Robot, bodyHeightMm: number = robot.standHeight): Record<string, Vec3> {
  const feet: Record<string, Vec3> = {};
  const footZMm = -bodyHeightMm;
  for (const leg of robot.legs) {
    const ring = reachRing(robot, leg.id, footZMm);
    const radiusMm = ring.reachable
      ? (Math.max(ring.innerMm, Math.min(leg.coxa, ring.outerMm)) + ring.outerMm) / 2
      : ring.geometricOuterMm > 0
        ? (ring.geometricInnerMm + ring.geometricOuterMm) / 2
        : leg.coxa + leg.femur;
    const { minDeg, maxDeg, zeroOffsetDeg } = leg.joints.coxa;
    const coxaServoDeg = Math.min(maxDeg, Math.max(minDeg, -zeroOffsetDeg));
    const directionRad = (leg.mount.yawDeg + zeroOffsetDeg + coxaServoDeg) * RAD_PER_DEG;
    feet[leg.id] = [leg.mount.x + radiusMm * Math.cos(directionRad), leg.mount.y + radiusMm * Math.sin(directionRad), footZMm];
  }
  return feet;
}
