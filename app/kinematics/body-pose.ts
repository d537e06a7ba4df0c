// Body pose → rotation. R = Rz(yaw)·Ry(pitch)·Rx(roll): fixed-axis roll, pitch,
// yaw as in ROS REP 103 (positive pitch lowers the nose, positive roll raises
// the left side). Entries written out from the product of the three
// elementary rotations (e.g. Craig, Introduction to Robotics, X-Y-Z fixed angles).
import { RAD_PER_DEG } from "./angles";
import type { BodyPose, Vec3 } from "./robot";

export const NEUTRAL_POSE: Readonly<BodyPose> = Object.freeze({ x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 });

/** Row-major 3×3 rotation of the pose into `out` (9 numbers). */
export function poseRotation(pose: BodyPose, out: Float64Array = new Float64Array(9)): Float64Array {
  const cr = Math.cos(pose.roll * RAD_PER_DEG);
  const sr = Math.sin(pose.roll * RAD_PER_DEG);
  const cp = Math.cos(pose.pitch * RAD_PER_DEG);
  const sp = Math.sin(pose.pitch * RAD_PER_DEG);
  const cy = Math.cos(pose.yaw * RAD_PER_DEG);
  const sy = Math.sin(pose.yaw * RAD_PER_DEG);
  out[0] = cy * cp;
  out[1] = cy * sp * sr - sy * cr;
  out[2] = cy * sp * cr + sy * sr;
  out[3] = sy * cp;
  out[4] = sy * sp * sr + cy * cr;
  out[5] = sy * sp * cr - cy * sr;
  out[6] = -sp;
  out[7] = cp * sr;
  out[8] = cp * cr;
  return out;
}

/** p in the moved body frame → neutral body frame: R·p + t. */
export function poseApply(pose: BodyPose, point: Vec3): Vec3 {
  const r = poseRotation(pose);
  const [x, y, z] = point;
  return [r[0] * x + r[1] * y + r[2] * z + pose.x, r[3] * x + r[4] * y + r[5] * z + pose.y, r[6] * x + r[7] * y + r[8] * z + pose.z];
}

/** p in the neutral body frame → moved body frame: Rᵀ(p − t). */
export function poseUnapply(pose: BodyPose, point: Vec3): Vec3 {
  const r = poseRotation(pose);
  const x = point[0] - pose.x;
  const y = point[1] - pose.y;
  const z = point[2] - pose.z;
  return [r[0] * x + r[3] * y + r[6] * z, r[1] * x + r[4] * y + r[7] * z, r[2] * x + r[5] * y + r[8] * z];
}

/**
 * A rotation matrix remembered for the last roll, pitch and yaw asked for:
 * the legs of one frame share a pose, so it is worked out once, not per leg.
 */
export function createPoseRotationCache(): (pose: BodyPose) => Float64Array {
  const rotation = new Float64Array(9);
  let rollDeg = Number.NaN;
  let pitchDeg = Number.NaN;
  let yawDeg = Number.NaN;
  return (pose) => {
    if (pose.roll !== rollDeg || pose.pitch !== pitchDeg || pose.yaw !== yawDeg) {
      poseRotation(pose, rotation);
      rollDeg = pose.roll;
      pitchDeg = pose.pitch;
      yawDeg = pose.yaw;
    }
    return rotation;
  };
}
