// forwardLeg: where the foot is for given servo angles, the exact inverse of solveLeg.
import { createPoseRotationCache } from "./body-pose";
import { cachedLegConstants } from "./leg-constants";
import { forwardLegInto } from "./leg-kernel";
import { findLeg, type BodyPose, type JointAngles, type Robot, type Vec3 } from "./robot";

const footScratch = new Float64Array(3);
const rotationOf = createPoseRotationCache();

/**
 * The foot (mm) in the neutral body frame for servo angles `angles` (degrees),
 * the body moved by `bodyPose` if given: R·p + t of the foot p in the moved body frame.
 */
export function forwardLeg(robot: Robot, legId: string, angles: JointAngles, bodyPose?: BodyPose): Vec3 {
  const k = cachedLegConstants(findLeg(robot, legId));
  forwardLegInto(k, angles.coxa, angles.femur, angles.tibia, footScratch, 0);
  const x = footScratch[0];
  const y = footScratch[1];
  const z = footScratch[2];
  if (!bodyPose) return [x, y, z];
  const r = rotationOf(bodyPose);
  return [
    r[0] * x + r[1] * y + r[2] * z + bodyPose.x,
    r[3] * x + r[4] * y + r[5] * z + bodyPose.y,
    r[6] * x + r[7] * y + r[8] * z + bodyPose.z,
  ];
}
