// A solved result made from servo angles given frame by frame, for tables that
// are not walks: the robot sits on a stand with its legs free, so there is no
// foot on the ground, no support polygon and no body travel. The frames are
// checked for speed like any sequence — by the gait engine's own joint-limit,
// joint-speed and pulse-range checks run over them — and the summary is
// filled as solveSequence fills it. Support, slip and ground checks do not
// apply to a robot on a stand and are not run.
import {
  SOLVE_DEFAULTS,
  runChecks,
  summarize,
  type CheckContext,
  type FlagKind,
  type SolvedFrame,
  type SolvedLeg,
  type SolvedSequence,
} from "../gait/index";
import {
  JOINT_NAMES,
  NEUTRAL_POSE,
  SOLVE_COXA_LIMIT,
  SOLVE_FEMUR_LIMIT,
  SOLVE_TIBIA_LIMIT,
  angleToPulse,
  createLegSolver,
  type JointAngles,
  type Robot,
} from "../kinematics/index";

type SolveState = CheckContext["state"];

/** The checks of a joint's own motion: what a bench table is checked with. */
export const STAND_CHECKS: readonly FlagKind[] = ["joint-limit", "joint-speed", "pulse-range"];

const LIMIT_BITS = [SOLVE_COXA_LIMIT, SOLVE_FEMUR_LIMIT, SOLVE_TIBIA_LIMIT];
// The leg solver's tolerance: a value on its limit is inside it.
const LIMIT_TOLERANCE_DEG = 1e-9;

/**
 * A SolvedSequence of the robot on a stand: `angles` holds frame × leg × joint
 * servo degrees (legs in robot.legs order, joints coxa, femur, tibia), frames
 * played at `fps` once (not as a loop).
 */
export function solveStandFrames(robot: Robot, angles: Float64Array, fps: number): SolvedSequence {
  const solver = createLegSolver(robot);
  const legIds = solver.legIds;
  const legCount = legIds.length;
  const frameCount = angles.length / (legCount * 3);
  if (!Number.isInteger(frameCount) || frameCount < 1) throw new RangeError(`angles must hold whole frames of ${legCount * 3} values (got ${angles.length})`);
  const slots = frameCount * legCount;
  const joints: SolveState["joints"][number][] = [];
  for (const leg of robot.legs) {
    for (const name of JOINT_NAMES) {
      const joint = leg.joints[name];
      joints.push({ legId: leg.id, name, joint, minDeg: joint.minDeg, maxDeg: joint.maxDeg, maxSpeedDegS: joint.maxSpeedDegS });
    }
  }
  const status = new Int32Array(slots);
  const pulseClamped = new Uint8Array(slots * 3);
  const pulseUs = new Float64Array(slots * 3);
  const feet = new Float64Array(slots * 3);
  const achievedWorld = new Float64Array(slots * 3);
  const [comX, comY] = robot.body.com;
  const frames: SolvedFrame[] = new Array(frameCount);
  for (let frame = 0; frame < frameCount; frame += 1) {
    const legs: Record<string, SolvedLeg> = {};
    for (let leg = 0; leg < legCount; leg += 1) {
      const slot = frame * legCount + leg;
      const t = slot * 3;
      const values: JointAngles = { coxa: angles[t], femur: angles[t + 1], tibia: angles[t + 2] };
      const pulses: JointAngles = { coxa: 0, femur: 0, tibia: 0 };
      for (let j = 0; j < 3; j += 1) {
        const spec = joints[leg * 3 + j];
        const value = angles[t + j];
        if (value < spec.minDeg - LIMIT_TOLERANCE_DEG || value > spec.maxDeg + LIMIT_TOLERANCE_DEG) status[slot] |= LIMIT_BITS[j];
        const pulse = angleToPulse(spec.joint, value);
        pulseClamped[t + j] = pulse.clamped ? 1 : 0;
        pulseUs[t + j] = pulse.us;
        pulses[JOINT_NAMES[j]] = pulse.us;
      }
      solver.forward(leg, values.coxa, values.femur, values.tibia, feet, t);
      // The body stands still at its stand height: world = body frame lifted by standHeight.
      achievedWorld[t] = feet[t];
      achievedWorld[t + 1] = feet[t + 1];
      achievedWorld[t + 2] = feet[t + 2] + robot.standHeight;
      legs[legIds[leg]] = { contact: "swing", foot: [feet[t], feet[t + 1], feet[t + 2]], reachable: true, angles: values, pulses };
    }
    frames[frame] = {
      index: frame,
      timeMs: (frame * 1000) / fps,
      body: { ...NEUTRAL_POSE, z: robot.standHeight },
      legs,
      support: [],
      com: [comX, comY],
      marginMm: null,
    };
  }

  const state: SolveState = {
    robot,
    solver,
    legIds,
    legCount,
    frameCount,
    loop: false,
    dynamic: false,
    fps,
    options: { ...SOLVE_DEFAULTS },
    joints,
    neighbours: [],
    cycleTravel: { x: 0, y: 0, cos: 1, sin: 0, headingRad: 0 },
    status,
    stance: new Uint8Array(slots),
    angles,
    targetNeutral: feet,
    targetBody: feet,
    achievedWorld,
    pulses: pulseUs,
    pulseClamped,
    offsets: new Float64Array(frameCount * 6),
    resting: new Uint8Array(frameCount).fill(1),
    stanceCount: new Uint8Array(frameCount),
    margin: new Float64Array(frameCount).fill(Number.NaN),
  };
  const flags = runChecks(state, STAND_CHECKS);
  // No foot is ever down: no duty factor, no stride; the frames play once.
  const stand = legIds.map(() => ({ dutyFactor: 0 }));
  return { frames, flags, summary: summarize(state, stand, flags, 0, (frameCount * 1000) / fps) };
}
