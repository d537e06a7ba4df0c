// Where each leg's joints are for the views: the mount (coxa axis), the femur
// joint, the knee and the foot, from servo angles, by the leg-plane formulas of
// DESIGN.md ("Conventions of the math"). Pure; the foot agrees with forwardLeg.
import {
  poseApply,
  RAD_PER_DEG,
  solveLeg,
  type BodyPose,
  type JointAngles,
  type JointLimitViolation,
  type Leg,
  type Robot,
  type Vec3,
} from "~/kinematics";

export type LegPoints = { mount: Vec3; hip: Vec3; knee: Vec3; foot: Vec3 };

export type LegPosture = {
  legId: string;
  /** Position of the leg in robot.legs, which picks its colour. */
  index: number;
  points: LegPoints;
  reachable: boolean;
  reason?: string;
  violations: JointLimitViolation[];
};

/** Joint points in the neutral body frame for servo angles; moved with the body when a pose is given. */
export function legPoints(leg: Leg, angles: JointAngles, bodyPose?: BodyPose): LegPoints {
  const direction = (leg.mount.yawDeg + angles.coxa + leg.joints.coxa.zeroOffsetDeg) * RAD_PER_DEG;
  const femurRad = (angles.femur + leg.joints.femur.zeroOffsetDeg) * RAD_PER_DEG;
  const tibiaRad = femurRad - Math.PI / 2 + (angles.tibia + leg.joints.tibia.zeroOffsetDeg) * RAD_PER_DEG;
  const ux = Math.cos(direction);
  const uy = Math.sin(direction);
  const { x, y, z } = leg.mount;
  const hipR = leg.coxa;
  const kneeR = hipR + leg.femur * Math.cos(femurRad);
  const kneeZ = leg.femur * Math.sin(femurRad);
  const footR = kneeR + leg.tibia * Math.cos(tibiaRad);
  const footZ = kneeZ + leg.tibia * Math.sin(tibiaRad);
  const points: LegPoints = {
    mount: [x, y, z],
    hip: [x + hipR * ux, y + hipR * uy, z],
    knee: [x + kneeR * ux, y + kneeR * uy, z + kneeZ],
    foot: [x + footR * ux, y + footR * uy, z + footZ],
  };
  if (!bodyPose) return points;
  return {
    mount: poseApply(bodyPose, points.mount),
    hip: poseApply(bodyPose, points.hip),
    knee: poseApply(bodyPose, points.knee),
    foot: poseApply(bodyPose, points.foot),
  };
}

/**
 * Every leg's posture: from the given servo angles where a leg has them,
 * else solved for its foot target (neutral body frame). Legs with neither are left out.
 */
export function legPostures(
  robot: Robot,
  feet: Readonly<Record<string, Vec3>>,
  angles?: Readonly<Record<string, JointAngles>>,
  bodyPose?: BodyPose,
): LegPosture[] {
  const out: LegPosture[] = [];
  robot.legs.forEach((leg, index) => {
    const given = angles?.[leg.id];
    if (given) {
      out.push({ legId: leg.id, index, points: legPoints(leg, given, bodyPose), reachable: true, violations: [] });
      return;
    }
    const foot = feet[leg.id];
    if (!foot) return;
    const solution = solveLeg(robot, leg.id, foot, bodyPose);
    out.push({
      legId: leg.id,
      index,
      points: legPoints(leg, solution.angles, bodyPose),
      reachable: solution.reachable,
      reason: solution.reason,
      violations: solution.violations,
    });
  });
  return out;
}
