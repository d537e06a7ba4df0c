// solveLeg: the public, one-call leg solve (DESIGN.md, "Core module contracts").
// For thousands of solves use createLegSolver, which keeps the per-leg constants.
import { createPoseRotationCache } from "./body-pose";
import { cachedLegConstants } from "./leg-constants";
import { solveLegInto } from "./leg-kernel";
import { findLeg, type BodyPose, type JointAngles, type JointName, type Robot, type Vec3 } from "./robot";
import { SOLVE_COXA_LIMIT, SOLVE_FEMUR_LIMIT, SOLVE_TIBIA_LIMIT, SOLVE_UNREACHABLE } from "./solve-status";
import { unreachableReason } from "./unreachable-reason";

/** A joint outside its limits, all in servo degrees. */
export type JointLimitViolation = { joint: JointName; valueDeg: number; minDeg: number; maxDeg: number };

export type LegSolution = {
  /** False when no leg posture puts the foot there; `angles` then hold the clamped solution. */
  reachable: boolean;
  reason?: string;
  /** Servo degrees. */
  angles: JointAngles;
  violations: JointLimitViolation[];
};

const anglesScratch = new Float64Array(3);
const rotationOf = createPoseRotationCache();

/**
 * Joint angles (servo degrees) that put the leg's foot at `foot` (mm, neutral
 * body frame), the body moved by `bodyPose` if given: the target is brought
 * into the moved body frame by Rᵀ(foot − t) first.
 */
export function solveLeg(robot: Robot, legId: string, foot: Vec3, bodyPose?: BodyPose): LegSolution {
  const k = cachedLegConstants(findLeg(robot, legId));
  let x = foot[0];
  let y = foot[1];
  let z = foot[2];
  if (bodyPose) {
    const r = rotationOf(bodyPose);
    const px = x - bodyPose.x;
    const py = y - bodyPose.y;
    const pz = z - bodyPose.z;
    x = r[0] * px + r[3] * py + r[6] * pz;
    y = r[1] * px + r[4] * py + r[7] * pz;
    z = r[2] * px + r[5] * py + r[8] * pz;
  }
  const bits = solveLegInto(k, x, y, z, anglesScratch, 0);
  const angles = { coxa: anglesScratch[0], femur: anglesScratch[1], tibia: anglesScratch[2] };
  const violations: JointLimitViolation[] = [];
  if (bits & SOLVE_COXA_LIMIT) violations.push({ joint: "coxa", valueDeg: angles.coxa, minDeg: k.coxaMinDeg, maxDeg: k.coxaMaxDeg });
  if (bits & SOLVE_FEMUR_LIMIT) violations.push({ joint: "femur", valueDeg: angles.femur, minDeg: k.femurMinDeg, maxDeg: k.femurMaxDeg });
  if (bits & SOLVE_TIBIA_LIMIT) violations.push({ joint: "tibia", valueDeg: angles.tibia, minDeg: k.tibiaMinDeg, maxDeg: k.tibiaMaxDeg });
  if ((bits & SOLVE_UNREACHABLE) === 0) return { reachable: true, angles, violations };
  return { reachable: false, reason: unreachableReason(k, x, y, z, bits), angles, violations };
}
