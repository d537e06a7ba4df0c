// Why a target is out of a leg's reach, in words: the SOLVE_* bits of a solve
// explained with the leg's id and the distances, for solveLeg and the hot-path
// solver's reason().
import type { LegConstants } from "./leg-constants";
import { COXA_AXIS_CLEARANCE_MM, SOLVE_BEYOND_REACH, SOLVE_INSIDE_FOLD, SOLVE_INVALID_LEG, SOLVE_NOT_FINITE, SOLVE_ON_COXA_AXIS } from "./solve-status";

/** The human reason for an unreachable target (body-frame mm), naming the leg and the distance. */
export function unreachableReason(k: LegConstants, x: number, y: number, z: number, bits: number): string {
  if (bits & SOLVE_INVALID_LEG) return `leg ${k.id}: cannot be solved: ${k.problem ?? "its numbers are out of range"} (a definition parseRobot would refuse)`;
  if (bits & SOLVE_NOT_FINITE) return `leg ${k.id}: the target (${x}, ${y}, ${z}) is not a finite point`;
  const radius = Math.hypot(x - k.mountXMm, y - k.mountYMm);
  if (bits & SOLVE_ON_COXA_AXIS) {
    return `leg ${k.id}: the foot is ${mm(radius)} from the coxa axis, where the coxa angle is undefined (${mm(COXA_AXIS_CLEARANCE_MM)} needed)`;
  }
  const distance = Math.hypot(radius - k.coxaMm, z - k.mountZMm);
  if (bits & SOLVE_BEYOND_REACH) {
    return `leg ${k.id}: the foot is ${mm(distance)} from the femur joint, beyond full extension (${mm(k.reachMaxMm)})`;
  }
  if (bits & SOLVE_INSIDE_FOLD) {
    return `leg ${k.id}: the foot is ${mm(distance)} from the femur joint, inside full fold (${mm(k.reachMinMm)})`;
  }
  return `leg ${k.id}: reachable`;
}

function mm(value: number): string {
  // A finite target far enough out has a distance past the largest double.
  return value < Infinity ? `${value.toFixed(1)} mm` : "over 1e308 mm";
}
