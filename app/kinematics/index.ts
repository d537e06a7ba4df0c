// Public surface of the kinematics core: the robot definition, leg IK/FK,
// servo mapping, reach, leg copy helpers and URDF import. Re-exports only.
export {
  JOINT_NAMES,
  MAX_LEGS,
  MIN_LEGS,
  ROBOT_FORMAT,
  findLeg,
  legRow,
  legSide,
  parseRobot,
  robotJsonSchema,
  robotSchema,
  type BodyPose,
  type DefinitionIssue,
  type Joint,
  type JointAngles,
  type JointName,
  type Leg,
  type LegSide,
  type ParseRobotResult,
  type Robot,
  type Servo,
  type Vec3,
} from "./robot";
export { formatIssues, formatPath } from "./issues";
export { DEG_PER_RAD, RAD_PER_DEG, wrapNear } from "./angles";
export { NEUTRAL_POSE, poseApply, poseRotation, poseUnapply } from "./body-pose";
export { solveLeg, type JointLimitViolation, type LegSolution } from "./solve-leg";
export { forwardLeg, forwardLegJoints, type LegJointPoints } from "./forward-leg";
export { createLegSolver, type LegSolver } from "./leg-solver";
export {
  COXA_AXIS_CLEARANCE_MM,
  SOLVE_BEYOND_REACH,
  SOLVE_COXA_LIMIT,
  SOLVE_FEMUR_LIMIT,
  SOLVE_INSIDE_FOLD,
  SOLVE_JOINT_LIMIT,
  SOLVE_NOT_FINITE,
  SOLVE_OK,
  SOLVE_ON_COXA_AXIS,
  SOLVE_TIBIA_LIMIT,
  SOLVE_UNREACHABLE,
} from "./solve-status";
export { angleToPulse, pulseToAngle, type PulseWidth } from "./servo";
export { neutralStance, reachRing, type ReachRing } from "./reach";
export { copyLegGeometry, mirrorLeg, type ServoChannels } from "./mirror";
export {
  importUrdf,
  URDF_DEFAULT_MASS_KG,
  URDF_DEFAULT_SPEED_DEG_S,
  URDF_SERVO_DEFAULTS,
  type UrdfImportOptions,
  type UrdfImportResult,
} from "./urdf";
