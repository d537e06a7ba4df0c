// Each leg's posture for the views: where its joints are (forwardLegJoints,
// the kinematics' own forward solve) and whether its foot target was reached.
import {
  forwardLegJoints,
  solveLeg,
  type BodyPose,
  type JointAngles,
  type JointLimitViolation,
  type LegJointPoints,
  type Robot,
  type Vec3,
} from "~/kinematics";

export type LegPosture = {
  legId: string;
  /** Position of the leg in robot.legs, which picks its colour. */
  index: number;
  points: LegJointPoints;
  reachable: boolean;
  reason?: string;
  violations: JointLimitViolation[];
};

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
      out.push({ legId: leg.id, index, points: forwardLegJoints(robot, leg.id, given, bodyPose), reachable: true, violations: [] });
      return;
    }
    const foot = feet[leg.id];
    if (!foot) return;
    const solution = solveLeg(robot, leg.id, foot, bodyPose);
    out.push({
      legId: leg.id,
      index,
      points: forwardLegJoints(robot, leg.id, solution.angles, bodyPose),
      reachable: solution.reachable,
      reason: solution.reason,
      violations: solution.violations,
    });
  });
  return out;
}
