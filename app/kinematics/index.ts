// Public surface of the kinematics core: the robot definition, leg IK/FK,
// servo mapping, reach, leg copy helpers and URDF import. Re-exports only.
export {
  JOINT_NAMES,
  MAX_LEGS,
  ROBOT_FORMAT,
  findLeg,
  legRow,
  legSide,
  parseRobot,
  robotJsonSchema,
  type BodyPose,
  type DefinitionIssue,
  type Joint,
  type JointAngles,
  type JointName,
  type Leg,
  type LegSide,
  type Robot,
  type Servo,
  type Vec3,
} from "./robot";
export { formatIssues, formatPath, issueProblem } from "./issues";
// Every bound of the formats is public: the sequence schema and the forms read them too.
export * from "./bounds";
export { DEG_PER_RAD, RAD_PER_DEG } from "./angles";
export { NEUTRAL_POSE, poseApply, poseRotation, poseUnapply } from "./body-pose";
export { solveLeg, type JointLimitViolation } from "./solve-leg";
export { forwardLeg, forwardLegJoints, type LegJointPoints } from "./forward-leg";
export { createLegSolver, type LegSolver } from "./leg-solver";
export { SOLVE_BEYOND_REACH, SOLVE_COXA_LIMIT, SOLVE_FEMUR_LIMIT, SOLVE_INSIDE_FOLD, SOLVE_TIBIA_LIMIT, SOLVE_UNREACHABLE } from "./solve-status";
export { angleToPulse, pulseToAngle } from "./servo";
export { neutralStance, reachRing, type ReachRing } from "./reach";
export { copyLegGeometry, mirrorLeg } from "./mirror";
export { importUrdf } from "./urdf";
