// A solved result made from servo angles given frame by frame, for tables that
// are not walks: the robot sits on a stand with its legs free, so there is no
// foot on the ground, no support polygon and no body travel. The gait engine's
// checkAngleFrames checks the frames (joint limits, joint speed, pulse range)
// and sums them up; the frames are filled here as solveSequence fills them.
import { checkAngleFrames, type SolvedFrame, type SolvedLeg, type SolvedSequence } from "../gait/index";
import { JOINT_NAMES, NEUTRAL_POSE, angleToPulse, createLegSolver, type JointAngles, type Robot } from "../kinematics/index";

/**
 * A SolvedSequence of the robot on a stand: `angles` holds frame × leg × joint
 * servo degrees (legs in robot.legs order, joints coxa, femur, tibia), frames
 * played at `fps` once (not as a loop).
 */
export function solveStandFrames(robot: Robot, angles: Float64Array, fps: number): SolvedSequence {
  const { flags, summary } = checkAngleFrames(robot, angles, { fps, loop: false });
  const solver = createLegSolver(robot);
  const legIds = solver.legIds;
  const legCount = legIds.length;
  const frameCount = angles.length / (legCount * 3);
  const feet = new Float64Array(3);
  const [comX, comY] = robot.body.com;
  const frames: SolvedFrame[] = new Array(frameCount);
  for (let frame = 0; frame < frameCount; frame += 1) {
    const legs: Record<string, SolvedLeg> = {};
    for (let leg = 0; leg < legCount; leg += 1) {
      const t = (frame * legCount + leg) * 3;
      const values: JointAngles = { coxa: angles[t], femur: angles[t + 1], tibia: angles[t + 2] };
      const pulses: JointAngles = { coxa: 0, femur: 0, tibia: 0 };
      const { joints } = robot.legs[leg];
      for (const name of JOINT_NAMES) pulses[name] = angleToPulse(joints[name], values[name]).us;
      solver.forward(leg, values.coxa, values.femur, values.tibia, feet, 0);
      legs[legIds[leg]] = { contact: "swing", foot: [feet[0], feet[1], feet[2]], reachable: true, angles: values, pulses };
    }
    frames[frame] = {
      index: frame,
      timeMs: (frame * 1000) / fps,
      // The body stands still at its stand height.
      body: { ...NEUTRAL_POSE, z: robot.standHeight },
      legs,
      support: [],
      com: [comX, comY],
      marginMm: null,
    };
  }
  return { frames, flags, summary };
}
