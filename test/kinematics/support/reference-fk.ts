// Forward kinematics composed with three.js Matrix4 (doubles), written from the
// DESIGN.md conventions and not from our solver, as the outside reference.
import { Euler, Matrix4, Vector3 } from "three";
import type { BodyPose, JointAngles, Leg, Vec3 } from "../../../app/kinematics";

const RAD = Math.PI / 180;
// Our femur and tibia turn counter-clockwise in the (r, z) plane: about the leg frame's −y.
const LEG_PLANE_AXIS = new Vector3(0, -1, 0);
const Z_AXIS = new Vector3(0, 0, 1);

/** Body pose as a Matrix4: Trans(x, y, z) · Rz(yaw)·Ry(pitch)·Rx(roll), three.js Euler order 'ZYX'. */
export function poseMatrix(pose: BodyPose): Matrix4 {
  const rotation = new Matrix4().makeRotationFromEuler(new Euler(pose.roll * RAD, pose.pitch * RAD, pose.yaw * RAD, "ZYX"));
  return new Matrix4().makeTranslation(pose.x, pose.y, pose.z).multiply(rotation);
}

/** The coxa joint, femur joint, knee and foot in the neutral body frame for servo angles, composed link by link. */
export function referenceJoints(leg: Leg, servo: JointAngles, pose?: BodyPose): { coxa: Vec3; femur: Vec3; knee: Vec3; foot: Vec3 } {
  const coxaRad = (servo.coxa + leg.joints.coxa.zeroOffsetDeg) * RAD;
  const femurRad = (servo.femur + leg.joints.femur.zeroOffsetDeg) * RAD;
  const tibiaRad = (servo.tibia + leg.joints.tibia.zeroOffsetDeg) * RAD;
  const chain = pose ? poseMatrix(pose) : new Matrix4();
  const position = (): Vec3 => {
    const point = new Vector3().setFromMatrixPosition(chain);
    return [point.x, point.y, point.z];
  };
  chain.multiply(new Matrix4().makeTranslation(leg.mount.x, leg.mount.y, leg.mount.z));
  const coxa = position();
  chain
    .multiply(new Matrix4().makeRotationAxis(Z_AXIS, leg.mount.yawDeg * RAD))
    .multiply(new Matrix4().makeRotationAxis(Z_AXIS, coxaRad))
    .multiply(new Matrix4().makeTranslation(leg.coxa, 0, 0));
  const femur = position();
  chain.multiply(new Matrix4().makeRotationAxis(LEG_PLANE_AXIS, femurRad)).multiply(new Matrix4().makeTranslation(leg.femur, 0, 0));
  const knee = position();
  // Tibia zero is at a right angle to the femur, pointing down.
  chain.multiply(new Matrix4().makeRotationAxis(LEG_PLANE_AXIS, tibiaRad - Math.PI / 2)).multiply(new Matrix4().makeTranslation(leg.tibia, 0, 0));
  return { coxa, femur, knee, foot: position() };
}

/** Foot in the neutral body frame for servo angles, composed link by link. */
export function referenceFoot(leg: Leg, servo: JointAngles, pose?: BodyPose): Vec3 {
  return referenceJoints(leg, servo, pose).foot;
}

export function distanceMm(a: Vec3, b: Vec3): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}
