// Entry and exit moves: one-shot sequences from the robot's rest pose (body
// on the ground, legs folded, servo angles in the robot's `rest`) up into a
// gait's first frame, and back down. The first frames after power-on are
// where servos slam, so every stage eases in and out (CSS ease-in-out) and is
// timed so that no joint turns faster than a safe fraction of its
// maxSpeedDegS. The result is an ordinary sequence, solved and checked like
// any other.
//   Entry: (unfold) the body rests; the legs unfold to standing points on the
//   ground, on the line from the mount through the gait's first footprints,
//   as near the footprint as the joint limits allow both lying and standing
//   (a leg folded against a low body may need its foot farther out or in). (rise) The body
//   rises into the gait's first pose, feet fixed. (step) One leg at a time
//   steps out to its first footprint, legs that are in the air in the gait's
//   first frame last.
//   Exit: the same backwards, from the gait's first frame (which is also the
//   frame after its last).
import { findLeg, forwardLeg, poseApply, solveLeg, type BodyPose, type Robot, type Vec3 } from "../kinematics/index";
import { easingFor } from "./interpolate/easing";
import { swingLift } from "./interpolate/swing";
import { CSS_EASE_IN_OUT, GaitInputError, SEQUENCE_FORMAT, parseSequence, type BodyKey, type Ease, type LegKey, type Sequence } from "./sequence";
import { solveSequence } from "./solve";

export type MoveOptions = {
  /** Fraction of each joint's maxSpeedDegS the move may use (default 0.5). */
  speedFraction?: number;
  /**
   * Height of the body origin when the robot rests on its belly, mm. Default:
   * just high enough that no folded foot of the rest pose is below the ground.
   */
  restBodyHeightMm?: number;
};

/** Defaults of the moves. */
export const MOVE_DEFAULTS = { speedFraction: 0.5, firstGuessStageMs: 1000, shortestStageMs: 100, timingRounds: 8 } as const;

// A foot this far (mm) from its standing point needs a step; this far above the ground it is in the air.
const STEP_NEEDED_MM = 0.5;
const IN_AIR_MM = 0.01;
// Folding and unfolding follow the joints, not a straight line: a folded leg
// sits near its inner reach, and a straight line from there to the ground cuts
// through it. The joint path is sampled into `steps` keys; mid-way the foot
// aims to clear the ground by `clearanceMm`, lifting the femur in steps of
// `femurLiftStepDeg` up to `femurLiftMaxDeg` if needed.
const UNFOLD = { steps: 16, clearanceMm: 10, femurLiftStepDeg: 2.5, femurLiftMaxDeg: 45 } as const;
// Planned angles keep this far (degrees) inside the joint limits: sampled paths follow them only closely.
const LIMIT_MARGIN_DEG = 1;
// Standing points are tried at these fractions of the way from the mount to the footprint, nearest the footprint first.
const STANDING_FRACTIONS = Array.from({ length: 35 }, (_, i) => 1 + (i % 2 === 0 ? 1 : -1) * Math.ceil(i / 2) * 0.05).filter((f) => f >= 0.3);
// Body heights (fractions of the rise) at which a standing point must be solvable.
const RISE_SAMPLES = [0, 0.25, 0.5, 0.75, 1];
const EASE_IN: Ease = [0.42, 0, 1, 1];
const EASE_OUT: Ease = [0, 0, 0.58, 1];
const LINEAR: Ease = [0, 0, 1, 1];

type Stage = "unfold" | "rise" | "step";
type Timing = Record<Stage, number>;

type MoveLeg = {
  legId: string;
  /** Unfold path from the rest foot (first) to the standing point (last), neutral body frame. */
  unfold: Vec3[];
  /** Where the foot stands while the body rises, neutral body frame. */
  standing: Vec3;
  /** The foot in the gait's first frame, neutral body frame. */
  first: Vec3;
  firstContact: "stance" | "swing";
  firstInAir: boolean;
  steps: boolean;
};

type Plan = {
  restOffset: BodyPose;
  startOffset: BodyPose;
  legs: MoveLeg[];
  /** Legs that step between their standing point and first footprint, in the entry's order. */
  steppers: MoveLeg[];
  bodyHeightMm: number;
  stepHeightMm: number;
};

// Share of the unfold spent lifting the femur before the other joints move, and lowering it at the end.
const UNFOLD_LIFT_SHARE = 0.25;

function smoothStep(fraction: number): number {
  const x = fraction < 0 ? 0 : fraction > 1 ? 1 : fraction;
  return (1 - Math.cos(Math.PI * x)) / 2;
}

/**
 * Joint-space path from the rest angles to the angles that put the foot on
 * `ground` (body at the rest offset), sampled at eased fractions s. The femur
 * first lifts (within its limit), the joints then move together, and the
 * femur comes down onto the ground point at the end: lifting the femur keeps
 * the knee angle, so the path stays as far inside the leg's reach as the
 * plain joint path, while the foot clears the ground. Of the lifts tried, the
 * least that keeps the foot `clearanceMm` up mid-way wins; failing that, the
 * one that keeps it highest above the ground.
 */
function unfoldPath(robot: Robot, legId: string, ground: Vec3, restOffset: BodyPose, bodyHeightMm: number, clearanceMm: number): Vec3[] {
  const rest = robot.rest![legId];
  const restFoot = forwardLeg(robot, legId, rest, restOffset);
  const target = solveLeg(robot, legId, ground, restOffset);
  // Out of reach: the straight line, and the checks say why.
  if (!target.reachable) return [restFoot, ground];
  const femurMaxDeg = findLeg(robot, legId).joints.femur.maxDeg;
  const easeInOut = easingFor(CSS_EASE_IN_OUT);
  let best: Vec3[] = [restFoot, ground];
  let bestScore = Number.NEGATIVE_INFINITY;
  for (let liftDeg = 0; liftDeg <= UNFOLD.femurLiftMaxDeg; liftDeg += UNFOLD.femurLiftStepDeg) {
    const path: Vec3[] = [];
    // Worst shortfall below the wanted height (negative: short of it).
    let score = Number.POSITIVE_INFINITY;
    for (let step = 0; step <= UNFOLD.steps; step += 1) {
      const s = easeInOut(step / UNFOLD.steps);
      const lift = s < UNFOLD_LIFT_SHARE ? smoothStep(s / UNFOLD_LIFT_SHARE) : smoothStep((1 - s) / UNFOLD_LIFT_SHARE);
      const move = smoothStep((s - UNFOLD_LIFT_SHARE) / (1 - 2 * UNFOLD_LIFT_SHARE));
      const plainFemur = rest.femur + (target.angles.femur - rest.femur) * move;
      const angles = {
        coxa: rest.coxa + (target.angles.coxa - rest.coxa) * move,
        // The lift stops short of the femur's maximum (the plain path itself is left alone):
        // the keys are joined by straight lines, which the femur follows only roughly.
        femur: Math.min(plainFemur + liftDeg * lift, Math.max(femurMaxDeg - LIMIT_MARGIN_DEG, plainFemur)),
        tibia: rest.tibia + (target.angles.tibia - rest.tibia) * move,
      };
      const foot = step === 0 ? restFoot : step === UNFOLD.steps ? ground : forwardLeg(robot, legId, angles, restOffset);
      if (step > 0 && step < UNFOLD.steps) score = Math.min(score, foot[2] + bodyHeightMm - clearanceMm * Math.min(lift, swingLift(1, s) * 2));
      path.push(foot);
    }
    if (score >= 0) return path;
    if (score > bestScore) {
      bestScore = score;
      best = path;
    }
  }
  return best;
}

function blendPose(a: BodyPose, b: BodyPose, s: number): BodyPose {
  return {
    x: a.x + (b.x - a.x) * s,
    y: a.y + (b.y - a.y) * s,
    z: a.z + (b.z - a.z) * s,
    roll: a.roll + (b.roll - a.roll) * s,
    pitch: a.pitch + (b.pitch - a.pitch) * s,
    yaw: a.yaw + (b.yaw - a.yaw) * s,
  };
}

/** Solvable within the joint limits (less the margin) for the body at each of the poses. */
function fitsAll(robot: Robot, legId: string, foot: Vec3, poses: readonly BodyPose[]): boolean {
  const leg = findLeg(robot, legId);
  return poses.every((pose) => {
    const solution = solveLeg(robot, legId, foot, pose);
    if (!solution.reachable) return false;
    return (["coxa", "femur", "tibia"] as const).every(
      (joint) => solution.angles[joint] >= leg.joints[joint].minDeg + LIMIT_MARGIN_DEG && solution.angles[joint] <= leg.joints[joint].maxDeg - LIMIT_MARGIN_DEG,
    );
  });
}

function planMove(robot: Robot, gait: Sequence, options: MoveOptions): Plan {
  if (!robot.rest) {
    throw new GaitInputError(`robot "${robot.name}" has no rest pose`, [{ path: "rest", message: "is needed for entry and exit moves" }]);
  }
  const rest = robot.rest;
  const bodyHeightMm = gait.generator.bodyHeightMm ?? robot.standHeight;
  // The gait's first frame; the heading frame at t = 0 is the world at the body height.
  const first = solveSequence(robot, gait, { checks: [] }).frames[0];
  const startOffset: BodyPose = {
    x: first.body.x,
    y: first.body.y,
    z: first.body.z - bodyHeightMm,
    roll: first.body.roll,
    pitch: first.body.pitch,
    yaw: first.body.yaw,
  };
  const restFeet = robot.legs.map((leg) => forwardLeg(robot, leg.id, rest[leg.id]));
  const restBodyHeightMm = options.restBodyHeightMm ?? Math.max(0, ...restFeet.map((foot) => -foot[2]));
  const restOffset: BodyPose = { x: 0, y: 0, z: restBodyHeightMm - bodyHeightMm, roll: 0, pitch: 0, yaw: 0 };
  const risePoses = RISE_SAMPLES.map((s) => blendPose(restOffset, startOffset, s));
  const stepHeightMm = gait.generator.stepHeightMm;
  const clearanceMm = Math.min(stepHeightMm, UNFOLD.clearanceMm);
  const legs = robot.legs.map((leg): MoveLeg => {
    const solved = first.legs[leg.id];
    const firstFoot = poseApply(startOffset, solved.foot);
    const footprint: Vec3 = [firstFoot[0], firstFoot[1], -bodyHeightMm];
    // The point nearest the footprint that suits lying and standing; the footprint itself if none does (the checks will say why).
    let standing = footprint;
    for (const fraction of STANDING_FRACTIONS) {
      const candidate: Vec3 = [leg.mount.x + (footprint[0] - leg.mount.x) * fraction, leg.mount.y + (footprint[1] - leg.mount.y) * fraction, -bodyHeightMm];
      if (fitsAll(robot, leg.id, candidate, risePoses)) {
        standing = candidate;
        break;
      }
    }
    const firstInAir = firstFoot[2] + bodyHeightMm > IN_AIR_MM;
    return {
      legId: leg.id,
      unfold: unfoldPath(robot, leg.id, standing, restOffset, bodyHeightMm, clearanceMm),
      standing,
      first: firstFoot,
      firstContact: solved.contact,
      firstInAir,
      steps: firstInAir || Math.hypot(standing[0] - footprint[0], standing[1] - footprint[1]) > STEP_NEEDED_MM,
    };
  });
  const steppers = [...legs.filter((leg) => leg.steps && !leg.firstInAir), ...legs.filter((leg) => leg.steps && leg.firstInAir)];
  return { restOffset, startOffset, legs, steppers, bodyHeightMm, stepHeightMm };
}

/** Swing keys along a sampled path over [from, to) of the move, easing in at the start and out at the end. */
function pathKeys(path: readonly Vec3[], from: number, to: number): LegKey[] {
  const segments = path.length - 1;
  const keys: LegKey[] = [];
  for (let index = 0; index < segments; index += 1) {
    const ease = segments === 1 ? CSS_EASE_IN_OUT : index === 0 ? EASE_IN : index === segments - 1 ? EASE_OUT : LINEAR;
    keys.push({ t: from + ((to - from) * index) / segments, contact: "swing", foot: path[index], ease: [...ease], apexMm: 0 });
  }
  return keys;
}

/** Time span [start, end) of the i-th of n steps within [from, to). */
function stepSpan(index: number, count: number, from: number, to: number): [number, number] {
  return [from + ((to - from) * index) / count, from + ((to - from) * (index + 1)) / count];
}

function stepApex(plan: Plan, leg: MoveLeg): number {
  // A step between two ground points lifts by the gait's step height; one to or from the air needs no more lift.
  return leg.firstInAir ? 0 : plan.stepHeightMm;
}

function entrySequence(plan: Plan, gait: Sequence, timing: Timing, name: string): Sequence {
  const total = timing.unfold + timing.rise + timing.step;
  const tRise = timing.unfold / total;
  const tStep = (timing.unfold + timing.rise) / total;
  const ease: Ease = [...CSS_EASE_IN_OUT];
  const legs: Record<string, { keys: LegKey[] }> = {};
  for (const leg of plan.legs) {
    const keys: LegKey[] = [...pathKeys(leg.unfold, 0, tRise), { t: tRise, contact: "stance", foot: leg.standing, ease }];
    const order = plan.steppers.indexOf(leg);
    if (order >= 0) {
      const [stepStart, stepEnd] = stepSpan(order, plan.steppers.length, tStep, 1);
      keys.push({ t: stepStart, contact: "swing", foot: leg.standing, ease, apexMm: stepApex(plan, leg) });
      // A foot that lands bears weight until the move ends, even if the gait's first frame lifts it off there.
      keys.push({ t: stepEnd, contact: leg.firstInAir ? "swing" : "stance", foot: leg.first, ease, apexMm: 0 });
    }
    // The last frame is the gait's first frame, contact and all (a later key at the same time wins).
    keys.push({ t: 1, contact: leg.firstContact, foot: leg.first, ease, apexMm: 0 });
    legs[leg.legId] = { keys: dedupeFinal(keys) };
  }
  const body: BodyKey[] = [
    { t: 0, pose: plan.restOffset, ease, resting: true },
    { t: tRise, pose: plan.restOffset, ease, resting: false },
    { t: tStep, pose: plan.startOffset, ease },
  ];
  if (tStep < 1) body.push({ t: 1, pose: plan.startOffset, ease });
  return moveSequence(plan, gait, total, legs, body, name);
}

/** Keys strictly in time order: a later key at the same time replaces the earlier one. */
function dedupeFinal(keys: LegKey[]): LegKey[] {
  const out: LegKey[] = [];
  for (const key of keys) {
    if (out.length > 0 && Math.abs(out[out.length - 1].t - key.t) < 1e-12) out[out.length - 1] = key;
    else out.push(key);
  }
  return out;
}

function exitSequence(plan: Plan, gait: Sequence, timing: Timing, name: string): Sequence {
  const total = timing.unfold + timing.rise + timing.step;
  const tLower = timing.step / total;
  const tFold = (timing.step + timing.rise) / total;
  const ease: Ease = [...CSS_EASE_IN_OUT];
  // Backwards: legs in the air come down first.
  const steppers = [...plan.steppers].reverse();
  const legs: Record<string, { keys: LegKey[] }> = {};
  for (const leg of plan.legs) {
    const order = steppers.indexOf(leg);
    const keys: LegKey[] = [];
    if (order >= 0) {
      const [stepStart, stepEnd] = stepSpan(order, steppers.length, 0, tLower);
      keys.push({ t: 0, contact: leg.firstInAir ? "swing" : "stance", foot: leg.first, ease, apexMm: 0 });
      keys.push({ t: stepStart, contact: "swing", foot: leg.first, ease, apexMm: stepApex(plan, leg) });
      keys.push({ t: stepEnd, contact: "stance", foot: leg.standing, ease });
    } else {
      keys.push({ t: 0, contact: "stance", foot: leg.first, ease });
    }
    const fold = [...leg.unfold].reverse();
    keys.push(...pathKeys(fold, tFold, 1));
    keys.push({ t: 1, contact: "swing", foot: fold[fold.length - 1], ease, apexMm: 0 });
    legs[leg.legId] = { keys: dedupeFinal(keys) };
  }
  const body: BodyKey[] = [{ t: 0, pose: plan.startOffset, ease }];
  if (tLower > 0) body.push({ t: tLower, pose: plan.startOffset, ease });
  body.push({ t: tFold, pose: plan.restOffset, ease, resting: true });
  body.push({ t: 1, pose: plan.restOffset, ease, resting: true });
  return moveSequence(plan, gait, total, legs, body, name);
}

function moveSequence(plan: Plan, gait: Sequence, cycleMs: number, legs: Record<string, { keys: LegKey[] }>, body: BodyKey[], name: string): Sequence {
  const parsed = parseSequence({
    format: SEQUENCE_FORMAT,
    name,
    cycleMs,
    fps: gait.fps,
    loop: false,
    generator: { strideMm: 0, directionDeg: 0, turnDegPerCycle: 0, stepHeightMm: plan.stepHeightMm, bodyHeightMm: plan.bodyHeightMm },
    legs,
    body: { keys: body.map((key) => ({ ...key, pose: { ...key.pose } })) },
  });
  if (!parsed.ok) throw new GaitInputError("the generated move is not valid", parsed.issues);
  return parsed.sequence;
}

/**
 * Stretches or shrinks each stage until its fastest joint turns at most
 * `speedFraction` of its limit: joint speed along a fixed path scales with
 * 1/duration, so one round nearly lands; a few more absorb the frame rounding.
 */
function timeStages(robot: Robot, plan: Plan, build: (timing: Timing) => Sequence, order: readonly Stage[], speedFraction: number): Sequence {
  const guess = MOVE_DEFAULTS.firstGuessStageMs;
  const timing: Timing = { unfold: guess, rise: guess, step: plan.steppers.length * guess };
  const limits = robot.legs.flatMap((leg) => [leg.joints.coxa.maxSpeedDegS, leg.joints.femur.maxSpeedDegS, leg.joints.tibia.maxSpeedDegS]);
  let sequence = build(timing);
  for (let round = 0; round < MOVE_DEFAULTS.timingRounds; round += 1) {
    const solved = solveSequence(robot, sequence, { checks: [] });
    const total = order.reduce((sum, stage) => sum + timing[stage], 0);
    const ratio: Timing = { unfold: 0, rise: 0, step: 0 };
    const last = solved.frames.length - 1;
    for (let frame = 1; frame <= last; frame += 1) {
      // The stage that holds the middle of the step between the two frames.
      const middleMs = ((frame - 0.5) / last) * total;
      let stage = order[order.length - 1];
      let end = 0;
      for (const candidate of order) {
        end += timing[candidate];
        if (middleMs < end) {
          stage = candidate;
          break;
        }
      }
      const before = solved.frames[frame - 1].legs;
      const here = solved.frames[frame].legs;
      robot.legs.forEach((leg, legIndex) => {
        const a = before[leg.id].angles;
        const b = here[leg.id].angles;
        [b.coxa - a.coxa, b.femur - a.femur, b.tibia - a.tibia].forEach((delta, j) => {
          const used = (Math.abs(delta) * solved.summary.fps) / (speedFraction * limits[legIndex * 3 + j]);
          if (used > ratio[stage]) ratio[stage] = used;
        });
      });
    }
    const settled = order.every(
      (stage) => timing[stage] === 0 || (ratio[stage] <= 1 && (ratio[stage] > 0.9 || timing[stage] <= MOVE_DEFAULTS.shortestStageMs)),
    );
    if (settled) break;
    for (const stage of order) {
      if (timing[stage] === 0) continue;
      const scaled = timing[stage] * (ratio[stage] > 1 ? ratio[stage] * 1.02 : Math.max(ratio[stage] * 1.02, 0.05));
      timing[stage] = Math.ceil(Math.max(MOVE_DEFAULTS.shortestStageMs, scaled));
    }
    sequence = build(timing);
  }
  return sequence;
}

/** One-shot move (loop: false) from the robot's rest pose into the gait's first frame. */
export function generateEntryMove(robot: Robot, gait: Sequence, options: MoveOptions = {}): Sequence {
  const plan = planMove(robot, gait, options);
  const name = `Entry into ${gait.name ?? "the gait"}`;
  const fraction = options.speedFraction ?? MOVE_DEFAULTS.speedFraction;
  return timeStages(robot, plan, (timing) => entrySequence(plan, gait, timing, name), ["unfold", "rise", "step"], fraction);
}

/** One-shot move (loop: false) from the gait's first frame back down to the robot's rest pose. */
export function generateExitMove(robot: Robot, gait: Sequence, options: MoveOptions = {}): Sequence {
  const plan = planMove(robot, gait, options);
  const name = `Exit from ${gait.name ?? "the gait"}`;
  const fraction = options.speedFraction ?? MOVE_DEFAULTS.speedFraction;
  return timeStages(robot, plan, (timing) => exitSequence(plan, gait, timing, name), ["step", "rise", "unfold"], fraction);
}
