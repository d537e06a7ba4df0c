// Per-leg joint curves of a solve: servo angle and speed of each joint over
// the frames, made once per solve and leg. Speed is the change from the frame
// before (round the seam for a loop), as the joint-speed check measures it.
import { JOINT_NAMES, type JointName } from "~/kinematics";
import type { SolvedSequence } from "~/gait";

export type JointSeries = {
  joint: JointName;
  /** Servo degrees per frame. */
  angleDeg: Float64Array;
  /** Degrees per second per frame. */
  speedDegS: Float64Array;
  minAngleDeg: number;
  maxAngleDeg: number;
  peakSpeedDegS: number;
};

const cache = new WeakMap<SolvedSequence, Map<string, JointSeries[]>>();

export function jointSeries(solved: SolvedSequence, legId: string, loop: boolean): JointSeries[] {
  let byLeg = cache.get(solved);
  if (!byLeg) cache.set(solved, (byLeg = new Map()));
  const cached = byLeg.get(legId);
  if (cached) return cached;
  const count = solved.frames.length;
  const fps = solved.summary.fps;
  const series = JOINT_NAMES.map((joint) => {
    const angleDeg = new Float64Array(count);
    const speedDegS = new Float64Array(count);
    let minAngleDeg = Infinity;
    let maxAngleDeg = -Infinity;
    for (let frame = 0; frame < count; frame += 1) {
      const value = solved.frames[frame].legs[legId]?.angles[joint] ?? 0;
      angleDeg[frame] = value;
      if (value < minAngleDeg) minAngleDeg = value;
      if (value > maxAngleDeg) maxAngleDeg = value;
    }
    let peakSpeedDegS = 0;
    for (let frame = 0; frame < count; frame += 1) {
      const before = frame > 0 ? angleDeg[frame - 1] : loop ? angleDeg[count - 1] : angleDeg[0];
      const speed = Math.abs(angleDeg[frame] - before) * fps;
      speedDegS[frame] = speed;
      if (speed > peakSpeedDegS) peakSpeedDegS = speed;
    }
    return { joint, angleDeg, speedDegS, minAngleDeg, maxAngleDeg, peakSpeedDegS };
  });
  byLeg.set(legId, series);
  return series;
}
