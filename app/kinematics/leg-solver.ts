// The hot-path solver for the gait engine: per-leg constants computed once,
// the body pose's rotation once per frame, results written into the caller's
// arrays. No allocation per call.
import { poseRotation } from "./body-pose";
import { robotProblem } from "./definition-check";
import { legConstants, type LegConstants } from "./leg-constants";
import { forwardLegInto, limitBits, solveLegInto } from "./leg-kernel";
import type { BodyPose, Robot } from "./robot";
import { unreachableReason } from "./unreachable-reason";

type NumberSink = { [index: number]: number };

export interface LegSolver {
  /** Leg ids in the robot's order; a leg's index is its place here. */
  readonly legIds: readonly string[];
  /** Index of a leg id; throws for an unknown id. */
  legIndex(legId: string): number;
  /**
   * Sets the body pose for the following solve/forward calls (undefined = neutral).
   * Targets of `solve` are then in the neutral body frame, as with solveLeg.
   */
  setBodyPose(pose: BodyPose | undefined): void;
  /**
   * Servo degrees (coxa, femur, tibia) into out[offset..offset+2] for a foot
   * at (x, y, z) mm; returns the SOLVE_* bits (0 = reachable, inside limits).
   */
  solve(legIndex: number, footXMm: number, footYMm: number, footZMm: number, out: NumberSink, offset?: number): number;
  /** The SOLVE_*_LIMIT bits of servo degrees given rather than solved, with the solve's own tolerance. */
  limits(legIndex: number, coxaDeg: number, femurDeg: number, tibiaDeg: number): number;
  /** Foot (mm, neutral body frame) into out[offset..offset+2] for servo degrees. */
  forward(legIndex: number, coxaDeg: number, femurDeg: number, tibiaDeg: number, out: NumberSink, offset?: number): void;
  /** The human reason for a status from `solve` with the same target and pose. */
  reason(legIndex: number, footXMm: number, footYMm: number, footZMm: number, status: number): string;
}

/**
 * Throws a RangeError for a robot with a number outside the format's ranges (a
 * definition parseRobot would refuse): the hot path trusts its constants.
 */
export function createLegSolver(robot: Robot): LegSolver {
  const problem = robotProblem(robot);
  if (problem !== null) throw new RangeError(`robot "${robot.name}" cannot be solved: ${problem} (a definition parseRobot would refuse)`);
  const constants: LegConstants[] = robot.legs.map(legConstants);
  const legIds = Object.freeze(robot.legs.map((leg) => leg.id));
  const rotation = new Float64Array(9);
  let posed = false;
  let tx = 0;
  let ty = 0;
  let tz = 0;

  // The target brought into the moved body frame, Rᵀ(p − t), kept in three slots.
  let bodyX = 0;
  let bodyY = 0;
  let bodyZ = 0;
  function intoBody(x: number, y: number, z: number): void {
    if (!posed) {
      bodyX = x;
      bodyY = y;
      bodyZ = z;
      return;
    }
    const px = x - tx;
    const py = y - ty;
    const pz = z - tz;
    bodyX = rotation[0] * px + rotation[3] * py + rotation[6] * pz;
    bodyY = rotation[1] * px + rotation[4] * py + rotation[7] * pz;
    bodyZ = rotation[2] * px + rotation[5] * py + rotation[8] * pz;
  }

  return {
    legIds,
    legIndex(legId) {
      const index = legIds.indexOf(legId);
      if (index < 0) throw new RangeError(`robot "${robot.name}" has no leg "${legId}" (legs: ${legIds.join(", ")})`);
      return index;
    },
    setBodyPose(pose) {
      posed = pose !== undefined;
      if (!pose) return;
      poseRotation(pose, rotation);
      tx = pose.x;
      ty = pose.y;
      tz = pose.z;
    },
    solve(legIndex, x, y, z, out, offset = 0) {
      intoBody(x, y, z);
      return solveLegInto(constants[legIndex], bodyX, bodyY, bodyZ, out, offset);
    },
    limits(legIndex, coxaDeg, femurDeg, tibiaDeg) {
      return limitBits(constants[legIndex], coxaDeg, femurDeg, tibiaDeg);
    },
    forward(legIndex, coxaDeg, femurDeg, tibiaDeg, out, offset = 0) {
      forwardLegInto(constants[legIndex], coxaDeg, femurDeg, tibiaDeg, out, offset);
      if (!posed) return;
      const px = out[offset];
      const py = out[offset + 1];
      const pz = out[offset + 2];
      out[offset] = rotation[0] * px + rotation[1] * py + rotation[2] * pz + tx;
      out[offset + 1] = rotation[3] * px + rotation[4] * py + rotation[5] * pz + ty;
      out[offset + 2] = rotation[6] * px + rotation[7] * py + rotation[8] * pz + tz;
    },
    reason(legIndex, x, y, z, status) {
      intoBody(x, y, z);
      return unreachableReason(constants[legIndex], bodyX, bodyY, bodyZ, status);
    },
  };
}
