// The planned foot of a solved frame brought back into the neutral body frame
// (where keys keep their feet), with the body's pose offset sampled as the
// solver samples it (the gait engine's bodyOffsetAt).
import { bodyOffsetAt, type Sequence, type SolvedSequence } from "../../../gait/index";
import { poseApply, type Vec3 } from "../../../kinematics/index";

export { bodyOffsetAt };

/** The leg's planned foot at a solved frame, in the neutral body frame, rounded to 0.01 mm. */
export function plannedFoot(sequence: Sequence, solved: SolvedSequence, legId: string, frame: number, cycleFrames: number): Vec3 | undefined {
  const leg = solved.frames[frame]?.legs[legId];
  if (!leg) return undefined;
  const neutral = poseApply(bodyOffsetAt(sequence, frame / cycleFrames), leg.foot);
  return neutral.map((value) => Math.round(value * 100) / 100) as Vec3;
}
