// The body's pose offset at a time, sampled as the solver samples it, and the
// planned foot of a solved frame brought back into the neutral body frame
// (where keys keep their feet).
import { compileBodyTrack, sampleBodyPiece } from "../../../gait/interpolate/body";
import type { BodyOffset, Sequence, SolvedSequence } from "../../../gait/index";
import { poseApply, type Vec3 } from "../../../kinematics/index";

export function bodyOffsetAt(sequence: Sequence, t: number): BodyOffset {
  const pieces = compileBodyTrack(sequence.body.keys, sequence.loop);
  let index = 0;
  while (index + 1 < pieces.length && pieces[index + 1].from <= t + 1e-9) index += 1;
  return sampleBodyPiece(pieces[index], t, { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 });
}

/** The leg's planned foot at a solved frame, in the neutral body frame, rounded to 0.01 mm. */
export function plannedFoot(sequence: Sequence, solved: SolvedSequence, legId: string, frame: number, cycleFrames: number): Vec3 | undefined {
  const leg = solved.frames[frame]?.legs[legId];
  if (!leg) return undefined;
  const neutral = poseApply(bodyOffsetAt(sequence, frame / cycleFrames), leg.foot);
  return neutral.map((value) => Math.round(value * 100) / 100) as Vec3;
}
