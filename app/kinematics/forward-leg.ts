// forwardLeg: where the foot is for given servo angles, the exact inverse of
// solveLeg; forwardLegJoints: where every joint is, for drawing the leg. Both
// come from the kernel's one forward solve (leg-kernel.ts).
import { createPoseRotationCache } from "./body-pose";
import { cachedLegConstants, type LegConstants } from "./leg-constants";
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

const POSE_FIELDS = ["x", "y", "z", "roll", "pitch", "yaw"] as const;
const JOINTS = ["coxa", "femur", "tibia"] as const;
const footScratch = new Float64Array(3);
// The coxa joint (the mount), then the femur joint, knee and foot as legJointsInto writes them.
const jointsScratch = new Float64Array(12);
const rotationOf = createPoseRotationCache();

/**
 * The foot (mm) in the neutral body frame for servo angles `angles` (degrees),
 * the body moved by `bodyPose` if given: R·p + t of the foot p in the moved body frame.
 */
export function forwardLeg(robot: Robot, legId: string, angles: JointAngles, bodyPose?: BodyPose): Vec3 {
  const k = postableConstants("forwardLeg", robot, legId);
  forwardLegInto(k, angles.coxa, angles.femur, angles.tibia, footScratch, 0);
  const foot = toNeutral(footScratch, 0, bodyPose);
  if (!isFinitePoint(foot)) refuseNonFinite("forwardLeg", legId, angles, bodyPose);
  return foot;
}

/**
 * Every joint of the leg and its foot (mm, neutral body frame) for servo
 * angles `angles` (degrees), moved with the body by `bodyPose` if given; the
 * foot is forwardLeg's.
 */
export function forwardLegJoints(robot: Robot, legId: string, angles: JointAngles, bodyPose?: BodyPose): LegJointPoints {
  const k = postableConstants("forwardLegJoints", robot, legId);
  jointsScratch[0] = k.mountXMm;
  jointsScratch[1] = k.mountYMm;
  jointsScratch[2] = k.mountZMm;
  legJointsInto(k, angles.coxa, angles.femur, angles.tibia, jointsScratch, 3);
  const joints = {
    coxa: toNeutral(jointsScratch, 0, bodyPose),
    femur: toNeutral(jointsScratch, 3, bodyPose),
    knee: toNeutral(jointsScratch, 6, bodyPose),
    foot: toNeutral(jointsScratch, 9, bodyPose),
  };
  if (!(isFinitePoint(joints.coxa) && isFinitePoint(joints.femur) && isFinitePoint(joints.knee) && isFinitePoint(joints.foot))) {
    refuseNonFinite("forwardLegJoints", legId, angles, bodyPose);
  }
  return joints;
}

function postableConstants(what: string, robot: Robot, legId: string): LegConstants {
  const k = cachedLegConstants(findLeg(robot, legId));
  if (k.problem !== null) throw new RangeError(`${what}: leg ${legId} cannot be posed: ${k.problem} (a definition parseRobot would refuse)`);
  return k;
}

// v·0 is 0 for a finite v and NaN for NaN or an infinity: one test on the way out.
function isFinitePoint(p: Vec3): boolean {
  return p[0] * 0 + p[1] * 0 + p[2] * 0 === 0;
}

/**
 * A point of NaN or infinity has no meaning, and the contract has no other
 * way to say so than a RangeError (a caller's bug, as findLeg's): this finds
 * which input made it. Checked on the way out, so a finite call pays one test.
 */
function refuseNonFinite(what: string, legId: string, angles: JointAngles, bodyPose: BodyPose | undefined): never {
  const joint = JOINTS.find((name) => !Number.isFinite(angles[name]));
  if (joint) throw new RangeError(`${what}: leg ${legId}: the ${joint} angle is ${angles[joint]}; servo angles must be finite numbers of degrees`);
  const field = bodyPose && POSE_FIELDS.find((name) => !Number.isFinite(bodyPose[name]));
  if (bodyPose && field) throw new RangeError(`${what}: leg ${legId}: the body pose's ${field} is ${bodyPose[field]}; it must be a finite number`);
  // Finite inputs: only a translation near the largest double can overflow.
  const translation = bodyPose ? `(${bodyPose.x}, ${bodyPose.y}, ${bodyPose.z})` : "(0, 0, 0)";
  throw new RangeError(`${what}: leg ${legId}: the body pose's translation ${translation} mm takes the leg past the largest number`);
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
