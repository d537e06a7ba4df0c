// What the Robot view draws for one solved frame, made the first time the
// frame is shown and kept with the solve: scrubbing back and forth costs a
// lookup. Everything is in the frame's own body frame (x forward, y left),
// seen from above; world points (support polygon, CoM) are brought into it.
import type { SolvedSequence } from "~/gait";
import type { LegPosture } from "~/components/robot-view/leg-postures";
import { RAD_PER_DEG, forwardLegJoints, type JointLimitViolation, type Robot } from "~/kinematics";

export type FrameGeometry = {
  postures: LegPosture[];
  /** Support polygon of the stance feet in the body frame, [x, y] mm; empty with fewer than three feet down. */
  support: [number, number][];
  /** The CoM's ground projection in the body frame, mm. */
  com: [number, number];
  marginMm: number | null;
  /** Height of the body origin above the ground, mm. */
  bodyHeightMm: number;
  stanceLegs: string[];
};

const cache = new WeakMap<SolvedSequence, (FrameGeometry | undefined)[]>();

export function frameGeometry(robot: Robot, solved: SolvedSequence, index: number): FrameGeometry | null {
  const frame = solved.frames[index];
  if (!frame) return null;
  let frames = cache.get(solved);
  if (!frames) cache.set(solved, (frames = new Array(solved.frames.length)));
  const cached = frames[index];
  if (cached) return cached;

  const violations = new Map<string, JointLimitViolation[]>();
  for (const flag of flagsAt(solved, index)) {
    if (flag.kind !== "joint-limit" || !flag.leg || !flag.joint) continue;
    const joint = robot.legs.find((leg) => leg.id === flag.leg)?.joints[flag.joint];
    if (!joint) continue;
    const list = violations.get(flag.leg) ?? [];
    list.push({ joint: flag.joint, valueDeg: flag.value, minDeg: joint.minDeg, maxDeg: joint.maxDeg });
    violations.set(flag.leg, list);
  }
  const postures: LegPosture[] = [];
  const stanceLegs: string[] = [];
  robot.legs.forEach((leg, legIndex) => {
    const solvedLeg = frame.legs[leg.id];
    if (!solvedLeg) return;
    if (solvedLeg.contact === "stance") stanceLegs.push(leg.id);
    postures.push({
      legId: leg.id,
      index: legIndex,
      points: forwardLegJoints(robot, leg.id, solvedLeg.angles),
      reachable: solvedLeg.reachable,
      violations: violations.get(leg.id) ?? [],
    });
  });
  // World → body frame, on the ground plane: undo the body's position and heading.
  const cos = Math.cos(-frame.body.yaw * RAD_PER_DEG);
  const sin = Math.sin(-frame.body.yaw * RAD_PER_DEG);
  const toBody = ([x, y]: readonly [number, number]): [number, number] => {
    const dx = x - frame.body.x;
    const dy = y - frame.body.y;
    return [cos * dx - sin * dy, sin * dx + cos * dy];
  };
  const geometry: FrameGeometry = {
    postures,
    support: frame.support.length >= 3 ? frame.support.map(toBody) : [],
    com: toBody(frame.com),
    marginMm: frame.marginMm,
    bodyHeightMm: frame.body.z,
    stanceLegs,
  };
  frames[index] = geometry;
  return geometry;
}

const flagIndex = new WeakMap<SolvedSequence, Map<number, SolvedSequence["flags"]>>();

/** The flags of one frame, from an index made once per solve. */
export function flagsAt(solved: SolvedSequence, frame: number): SolvedSequence["flags"] {
  let byFrame = flagIndex.get(solved);
  if (!byFrame) {
    byFrame = new Map();
    for (const flag of solved.flags) {
      const list = byFrame.get(flag.frame);
      if (list) list.push(flag);
      else byFrame.set(flag.frame, [flag]);
    }
    flagIndex.set(solved, byFrame);
  }
  return byFrame.get(frame) ?? [];
}
