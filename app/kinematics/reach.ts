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

// Scan step for the limit-aware radii; the edges are then refined by bisection.
const SCAN_STEP_MM = 0.5;
const EDGE_TOLERANCE_MM = 1e-3;

/** The leg's reach at foot height `footZMm` (body frame): an annulus about the coxa axis and the coxa's sector. */
export function reachRing(robot: Robot, legId: string, footZMm: number): ReachRing {
  const leg = findLeg(robot, legId);
  const k = legConstants(leg);
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

function limitedSpan(k: LegConstants, footZMm: number, fromMm: number, toMm: number): [number, number] | null {
  if (toMm <= fromMm) return null;
  let first = -1;
  let last = -1;
  const steps = Math.ceil((toMm - fromMm) / SCAN_STEP_MM);
  for (let step = 0; step <= steps; step += 1) {
    const radius = Math.min(toMm, fromMm + step * SCAN_STEP_MM);
    if (fitsAt(k, footZMm, radius)) {
      if (first < 0) first = radius;
      last = radius;
    }
  }
  if (first < 0) return null;
  const inner = first === fromMm ? first : bisectEdge(k, footZMm, Math.max(fromMm, first - SCAN_STEP_MM), first);
  const outer = last === toMm ? last : bisectEdge(k, footZMm, Math.min(toMm, last + SCAN_STEP_MM), last);
  return [inner, outer];
}

// Narrows [outside, inside] to the edge of the fitting region.
function bisectEdge(k: LegConstants, footZMm: number, outsideMm: number, insideMm: number): number {
  let outside = outsideMm;
  let inside = insideMm;
  while (Math.abs(inside - outside) > EDGE_TOLERANCE_MM) {
    const middle = (inside + outside) / 2;
    if (fitsAt(k, footZMm, middle)) inside = middle;
    else outside = middle;
  }
  return inside;
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
