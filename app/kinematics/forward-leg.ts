// forwardLeg: where the foot is for given servo angles, the exact inverse of
// solveLeg; forwardLegJoints: where every joint is, for drawing the leg. Both
// come from the kernel's one forward solve (leg-kernel.ts).
import { createPoseRotationCache } from "./body-pose";
import { cachedLegConstants } from "./leg-constants";
import { forwardLegInto, legJointsInto } from "./leg-kernel";
import { findLeg, type BodyPose, type JointAngles, type Robot, type Vec3 } from "./robot";

/** The joints of one leg and its foot tip (mm, neutral body frame). */
export type LegJointPoints = {
  /** The coxa joint: the leg's mount point. */
  coxa: Vec3;
  /** The femur joint, one coxa length out from the mount. */
  femur: Vec3;
  /** The knee: the tibia joint, one femur length on. */
  knee: Vec3;
  /** The foot tip, one tibia length on. */
  foot: Vec3;
};

const footScratch = new Float64Array(3);
// The coxa joint (the mount), then the femur joint, knee and foot as legJointsInto writes them.
const jointsScratch = new Float64Array(12);
const rotationOf = createPoseRotationCache();

/**
 * The foot (mm) in the neutral body frame for servo angles `angles` (degrees),
 * the body moved by `bodyPose` if given: R·p + t of the foot p in the moved body frame.
 */
export function forwardLeg(robot: Robot, legId: string, angles: JointAngles, bodyPose?: BodyPose): Vec3 {
  const k = cachedLegConstants(findLeg(robot, legId));
  forwardLegInto(k, angles.coxa, angles.femur, angles.tibia, footScratch, 0);
  return toNeutral(footScratch, 0, bodyPose);
}

/**
 * Every joint of the leg and its foot (mm, neutral body frame) for servo
 * angles `angles` (degrees), moved with the body by `bodyPose` if given; the
 * foot is forwardLeg's.
 */
export function forwardLegJoints(robot: Robot, legId: string, angles: JointAngles, bodyPose?: BodyPose): LegJointPoints {
  const k = cachedLegConstants(findLeg(robot, legId));
  jointsScratch[0] = k.mountXMm;
  jointsScratch[1] = k.mountYMm;
  jointsScratch[2] = k.mountZMm;
  legJointsInto(k, angles.coxa, angles.femur, angles.tibia, jointsScratch, 3);
  return {
    coxa: toNeutral(jointsScratch, 0, bodyPose),
    femur: toNeutral(jointsScratch, 3, bodyPose),
    knee: toNeutral(jointsScratch, 6, bodyPose),
    foot: toNeutral(jointsScratch, 9, bodyPose),
  };
}

// p = point[offset..offset+2] in the moved body frame → neutral body frame, R·p + t (p itself without a pose).
function toNeutral(point: Float64Array, offset: number, bodyPose: BodyPose | undefined): Vec3 {
  const x = point[offset];
  const y = point[offset + 1];
  const z = point[offset + 2];
  if (!bodyPose) return [x, y, z];
  const r = rotationOf(bodyPose);
  return [r[0] * x + r[1] * y + r[2] * z + bodyPose.x, r[3] * x + r[4] * y + r[5] * z + bodyPose.y, r[6] * x + r[7] * y + r[8] * z + bodyPose.z];
}
