// solveSequence (DESIGN.md, "Core module contracts"): samples the sequence at
// its frame rate, solves every leg of every frame, runs the checks and sums
// up. Four passes over typed arrays made once per solve, so that sampling and
// solving allocate nothing:
//   1. sample and solve: travel, body offset, each leg's planned foot, IK;
//   2. legs out of reach keep their last reachable angles (round the seam of
//      a loop too), and where those angles put the foot;
//   3. pulses, the body's world pose, support polygon, margin;
//   4. the checks, then the summary.
// The frame objects are made last, from the arrays, and only when asked for
// (framesOf): the compact column layout and the checks never need them.
// Each pass is a function of its own: the optimiser handles small hot loops
// far better than one long function (the bench showed nearly half the time).
import {
  DEG_PER_RAD,
  JOINT_NAMES,
  SOLVE_UNREACHABLE,
  createLegSolver,
  neutralStance,
  poseRotation,
  type BodyPose,
  type JointAngles,
  type LegSolver,
  type Robot,
  type Vec3,
} from "../kinematics/index";
import { CHECKS, type SolveState } from "./checks/index";
import type { JointSpec } from "./checks/check";
import { compileBodyTrack, sampleBodyPiece, type BodyPiece } from "./interpolate/body";
import { TIME_EPSILON, compileLegTrack, pieceFraction, type LegTrackPlan } from "./interpolate/legs";
import { swingPoint } from "./interpolate/swing";
import { createPlanar, createTravel, headingToWorld, travelBy, worldToHeading, type Travel } from "./interpolate/travel";
import { GaitInputError, MAX_FPS, MAX_FRAMES, sequenceIssuesForRobot, sequenceRangeIssues, type Sequence } from "./sequence";
import { FLAG_KINDS, type Flag, type FlagKind, type SolveOptions, type SolveSummary, type SolvedFrame, type SolvedLeg, type SolvedSequence } from "./solved";
import { clampPulseUs, createPulseTable, rawPulseUs } from "./pulses";
import { convexHullInto, stabilityMargin } from "./support";
import { TEMPLATES, legLayout } from "./templates/index";

export const SOLVE_DEFAULTS = {
  marginThresholdMm: 10,
  slipToleranceMm: 0.5,
  clearanceMm: 20,
  groundToleranceMm: 0.01,
} as const;

const ORIGIN: Vec3 = [0, 0, 0];

function resolveFrameRate(sequence: Sequence, options: SolveOptions): number {
  const fps = options.fps ?? sequence.fps;
  if (!(fps > 0 && fps <= MAX_FPS)) throw new GaitInputError("cannot solve", [{ path: "fps", message: `must lie in (0, ${MAX_FPS}] (got ${fps})` }]);
  const frames = Math.round((sequence.cycleMs * fps) / 1000);
  // Written so that NaN fails too.
  if (!(frames >= 1 && frames <= MAX_FRAMES)) {
    throw new GaitInputError("cannot solve", [{ path: "fps", message: `gives ${frames} frames (cycleMs · fps / 1000), 1 to ${MAX_FRAMES} allowed` }]);
  }
  return fps;
}

/** Per frame, where pass 3 puts the body, the CoM and the support polygon in the world. */
export type WorldTrack = {
  /** x, y, z, roll, pitch, yaw of the body in the world. */
  bodyWorld: Float64Array;
  /** The CoM's ground projection, world x, y. */
  comWorld: Float64Array;
  /** The distinct support polygons (world [x, y], counter-clockwise), and which one each frame has. */
  polygons: [number, number][][];
  polygonIndex: Int32Array;
};

export type SolveRun = { state: SolveState; world: WorldTrack; flags: Flag[]; summary: SolveSummary };

/** What the passes share besides the checks' state. */
type Sampling = {
  state: SolveState;
  cycleFrames: number;
  travel: Travel;
  bodyHeightMm: number;
  plans: readonly LegTrackPlan[];
  bodyPieces: readonly BodyPiece[];
  /** Per frame: the heading frame's x, y, cos, sin. */
  heading: Float64Array;
  /** Per frame: the CoM's ground projection, world x, y. */
  comWorld: Float64Array;
};

/**
 * Frames, flags and summary of a parsed sequence on a robot. Frames sit at
 * t = i/N of the cycle (N = round(cycleMs · fps / 1000)) and play at
 * i · 1000/fps ms; a loop has frames 0..N−1, a one-shot move 0..N.
 * Throws GaitInputError when the sequence's legs do not match the robot's.
 */
export function solveSequence(robot: Robot, sequence: Sequence, options: SolveOptions = {}): SolvedSequence {
  const run = runSolve(robot, sequence, options);
  return { frames: framesOf(run), flags: run.flags, summary: run.summary };
}

/**
 * The solve without its frame objects: every number in the typed arrays of
 * `state` and `world`, with the flags and summary. solveSequence builds
 * the frames from it; the column layout reads it directly (columns.ts).
 */
export function runSolve(robot: Robot, sequence: Sequence, options: SolveOptions = {}): SolveRun {
  // A parsed sequence has none; one built or changed in code might, and NaN in means NaN out.
  const outOfRange = sequenceRangeIssues(sequence);
  if (outOfRange.length > 0) throw new GaitInputError("sequence holds numbers outside the format's ranges", outOfRange);
  const issues = sequenceIssuesForRobot(robot, sequence);
  if (issues.length > 0) throw new GaitInputError(`sequence does not fit robot "${robot.name}"`, issues);
  const sampling = prepare(robot, sequence, options);
  sampleAndSolve(sampling);
  keepReachableAngles(sampling);
  const world = placeInWorld(sampling);
  const flags = runChecks(sampling.state, options.checks);
  return { state: sampling.state, world, flags, summary: summarize(sampling.state, sampling.plans, flags, sequence.generator.strideMm, sequence.cycleMs) };
}

function prepare(robot: Robot, sequence: Sequence, options: SolveOptions): Sampling {
  const fps = resolveFrameRate(sequence, options);
  const cycleFrames = Math.round((sequence.cycleMs * fps) / 1000);
  const loop = sequence.loop;
  const frameCount = loop ? cycleFrames : cycleFrames + 1;
  const generator = sequence.generator;
  const bodyHeightMm = generator.bodyHeightMm ?? robot.standHeight;
  const travel = createTravel(generator.strideMm, generator.directionDeg, generator.turnDegPerCycle, bodyHeightMm);
  // Only keys without a foot need the neutral stance, and it costs a reach scan per leg.
  const needsNeutral = Object.values(sequence.legs).some((track) => track.keys.some((key) => !key.foot));
  const neutral = needsNeutral ? neutralStance(robot, bodyHeightMm) : null;
  const solver = createLegSolver(robot);
  const legIds = solver.legIds;
  const legCount = legIds.length;
  const plans = legIds.map((legId) =>
    compileLegTrack(sequence.legs[legId].keys, { loop, travel, neutral: neutral?.[legId] ?? ORIGIN, defaultApexMm: generator.stepHeightMm }),
  );
  const template = generator.template ? TEMPLATES[generator.template] : undefined;

  const joints = jointSpecs(robot, solver);
  const layout = legLayout(robot);
  const neighbours: [number, number][] = [];
  for (const side of [layout.left, layout.right]) {
    for (let row = 0; row + 1 < side.length; row += 1) neighbours.push([legIds.indexOf(side[row]), legIds.indexOf(side[row + 1])]);
  }

  const slots = frameCount * legCount;
  const state: SolveState = {
    robot,
    solver,
    legIds,
    legCount,
    frameCount,
    loop,
    dynamic: template?.dynamic ?? false,
    fps,
    options: {
      marginThresholdMm: options.marginThresholdMm ?? SOLVE_DEFAULTS.marginThresholdMm,
      slipToleranceMm: options.slipToleranceMm ?? SOLVE_DEFAULTS.slipToleranceMm,
      clearanceMm: options.clearanceMm ?? SOLVE_DEFAULTS.clearanceMm,
      groundToleranceMm: options.groundToleranceMm ?? SOLVE_DEFAULTS.groundToleranceMm,
    },
    joints,
    neighbours,
    cycleTravel: travelBy(travel, 1, createPlanar()),
    status: new Int32Array(slots),
    stance: new Uint8Array(slots),
    angles: new Float64Array(slots * 3),
    targetNeutral: new Float64Array(slots * 3),
    targetBody: new Float64Array(slots * 3),
    achievedWorld: new Float64Array(slots * 3),
    pulses: new Float64Array(slots * 3),
    pulseClamped: new Uint8Array(slots * 3),
    offsets: new Float64Array(frameCount * 6),
    resting: new Uint8Array(frameCount),
    stanceCount: new Uint8Array(frameCount),
    margin: new Float64Array(frameCount),
  };
  return {
    state,
    cycleFrames,
    travel,
    bodyHeightMm,
    plans,
    bodyPieces: compileBodyTrack(sequence.body.keys, loop),
    heading: new Float64Array(frameCount * 4),
    comWorld: new Float64Array(frameCount * 2),
  };
}

/** Every joint's limits and speed, leg by leg in the solver's order (coxa, femur, tibia): what the checks read. */
export function jointSpecs(robot: Robot, solver: LegSolver): JointSpec[] {
  const joints: JointSpec[] = [];
  for (const legId of solver.legIds) {
    const leg = robot.legs[solver.legIndex(legId)];
    for (const name of JOINT_NAMES) {
      const joint = leg.joints[name];
      joints.push({ legId, name, joint, minDeg: joint.minDeg, maxDeg: joint.maxDeg, maxSpeedDegS: joint.maxSpeedDegS });
    }
  }
  return joints;
}

// Pass 1: travel, body offset, each leg's planned foot, IK. No allocation per frame.
function sampleAndSolve(sampling: Sampling): void {
  const { state, travel, bodyHeightMm, plans, bodyPieces, heading, comWorld, cycleFrames } = sampling;
  const { solver, legCount, frameCount, offsets, status, stance, angles, targetNeutral, targetBody, achievedWorld } = state;
  const [comX, comY, comZ] = state.robot.body.com;
  const frameTravel = createPlanar();
  const offset: BodyPose = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
  const rotation = new Float64Array(9);
  const world = new Float64Array(3);
  const piece = new Int32Array(legCount);
  let bodyPiece = 0;
  let lastRoll = 0;
  let lastPitch = 0;
  let lastYaw = 0;
  // Targets go to the solver already in the moved body frame, so the rotation is made once a frame.
  solver.setBodyPose(undefined);
  for (let frame = 0; frame < frameCount; frame += 1) {
    const time = frame / cycleFrames;
    travelBy(travel, time, frameTravel);
    const h = frame * 4;
    heading[h] = frameTravel.x;
    heading[h + 1] = frameTravel.y;
    heading[h + 2] = frameTravel.cos;
    heading[h + 3] = frameTravel.sin;
    while (bodyPiece + 1 < bodyPieces.length && bodyPieces[bodyPiece + 1].from <= time + TIME_EPSILON) bodyPiece += 1;
    sampleBodyPiece(bodyPieces[bodyPiece], time, offset);
    state.resting[frame] = bodyPieces[bodyPiece].resting ? 1 : 0;
    const o = frame * 6;
    offsets[o] = offset.x;
    offsets[o + 1] = offset.y;
    offsets[o + 2] = offset.z;
    offsets[o + 3] = offset.roll;
    offsets[o + 4] = offset.pitch;
    offsets[o + 5] = offset.yaw;
    // Body keys are few: most frames keep the previous frame's rotation.
    if (frame === 0 || offset.roll !== lastRoll || offset.pitch !== lastPitch || offset.yaw !== lastYaw) {
      poseRotation(offset, rotation);
      lastRoll = offset.roll;
      lastPitch = offset.pitch;
      lastYaw = offset.yaw;
    }
    // CoM: body frame → world, T_world←body · com, then its ground projection.
    const cx = rotation[0] * comX + rotation[1] * comY + rotation[2] * comZ + offset.x;
    const cy = rotation[3] * comX + rotation[4] * comY + rotation[5] * comZ + offset.y;
    comWorld[frame * 2] = frameTravel.x + frameTravel.cos * cx - frameTravel.sin * cy;
    comWorld[frame * 2 + 1] = frameTravel.y + frameTravel.sin * cx + frameTravel.cos * cy;
    for (let leg = 0; leg < legCount; leg += 1) {
      const pieces = plans[leg].pieces;
      let index = piece[leg];
      while (index + 1 < pieces.length && pieces[index + 1].from <= time + TIME_EPSILON) index += 1;
      piece[leg] = index;
      const current = pieces[index];
      const slot = frame * legCount + leg;
      const t = slot * 3;
      if (current.worldFixed) {
        world[0] = current.worldFrom[0];
        world[1] = current.worldFrom[1];
        world[2] = current.worldFrom[2];
      } else {
        swingPoint(current.worldFrom, 0, current.worldTo, 0, pieceFraction(current, time), current.easing, current.apexMm, world, 0);
      }
      stance[slot] = current.contact === "stance" ? 1 : 0;
      worldToHeading(frameTravel, bodyHeightMm, world[0], world[1], world[2], targetNeutral, t);
      // The planned foot in the moved body frame, Rᵀ(p − t), as the frame reports it.
      const px = targetNeutral[t] - offset.x;
      const py = targetNeutral[t + 1] - offset.y;
      const pz = targetNeutral[t + 2] - offset.z;
      const bx = rotation[0] * px + rotation[3] * py + rotation[6] * pz;
      const by = rotation[1] * px + rotation[4] * py + rotation[7] * pz;
      const bz = rotation[2] * px + rotation[5] * py + rotation[8] * pz;
      targetBody[t] = bx;
      targetBody[t + 1] = by;
      targetBody[t + 2] = bz;
      status[slot] = solver.solve(leg, bx, by, bz, angles, t);
      achievedWorld[t] = world[0];
      achievedWorld[t + 1] = world[1];
      achievedWorld[t + 2] = world[2];
    }
  }
}

// Pass 2: a leg out of reach keeps its last reachable angles; before its first
// reachable frame a loop looks back round the seam, while a one-shot move (or
// a leg never in reach) keeps the solver's clamped solution, finite, never
// NaN. Then where those angles put the foot.
function keepReachableAngles(sampling: Sampling): void {
  const { state, heading, bodyHeightMm } = sampling;
  const { solver, legCount, frameCount, status, angles, offsets, achievedWorld } = state;
  const offset: BodyPose = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
  const frameTravel = createPlanar();
  const world = new Float64Array(3);
  for (let leg = 0; leg < legCount; leg += 1) {
    let lastReachable = -1;
    if (state.loop) {
      for (let frame = frameCount - 1; frame >= 0; frame -= 1) {
        if ((status[frame * legCount + leg] & SOLVE_UNREACHABLE) === 0) {
          lastReachable = frame;
          break;
        }
      }
    }
    for (let frame = 0; frame < frameCount; frame += 1) {
      const slot = frame * legCount + leg;
      if ((status[slot] & SOLVE_UNREACHABLE) === 0) {
        lastReachable = frame;
        continue;
      }
      const t = slot * 3;
      if (lastReachable >= 0) {
        const from = (lastReachable * legCount + leg) * 3;
        angles[t] = angles[from];
        angles[t + 1] = angles[from + 1];
        angles[t + 2] = angles[from + 2];
      }
      const o = frame * 6;
      offset.x = offsets[o];
      offset.y = offsets[o + 1];
      offset.z = offsets[o + 2];
      offset.roll = offsets[o + 3];
      offset.pitch = offsets[o + 4];
      offset.yaw = offsets[o + 5];
      // Moved body frame → neutral body frame (the solver applies the pose) → world.
      solver.setBodyPose(offset);
      solver.forward(leg, angles[t], angles[t + 1], angles[t + 2], world, 0);
      const h = frame * 4;
      frameTravel.x = heading[h];
      frameTravel.y = heading[h + 1];
      frameTravel.cos = heading[h + 2];
      frameTravel.sin = heading[h + 3];
      headingToWorld(frameTravel, bodyHeightMm, world[0], world[1], world[2], achievedWorld, t);
    }
  }
  solver.setBodyPose(undefined);
}

// Pass 3: pulses, the body's world pose, support polygon and margin, into
// typed arrays; each distinct support polygon is made once.
function placeInWorld(sampling: Sampling): WorldTrack {
  const { state, heading, comWorld, bodyHeightMm, travel, cycleFrames } = sampling;
  const { legCount, frameCount, offsets, angles, stance, achievedWorld, pulseClamped, pulses } = state;
  const table = createPulseTable(state.joints.map((spec) => spec.joint));
  const bodyWorld = new Float64Array(frameCount * 6);
  const polygons: [number, number][][] = [];
  const polygonIndex = new Int32Array(frameCount);
  const xs = new Float64Array(legCount);
  const ys = new Float64Array(legCount);
  const order = new Int32Array(legCount);
  const hull = new Int32Array(legCount + 1);
  const previousXs = new Float64Array(legCount);
  const previousYs = new Float64Array(legCount);
  let previousCount = -1;
  let hullSize = 0;
  const turnDegPerCycle = travel.turnRad * DEG_PER_RAD;
  for (let frame = 0; frame < frameCount; frame += 1) {
    const o = frame * 6;
    const h = frame * 4;
    const cos = heading[h + 2];
    const sin = heading[h + 3];
    bodyWorld[o] = heading[h] + cos * offsets[o] - sin * offsets[o + 1];
    bodyWorld[o + 1] = heading[h + 1] + sin * offsets[o] + cos * offsets[o + 1];
    bodyWorld[o + 2] = bodyHeightMm + offsets[o + 2];
    bodyWorld[o + 3] = offsets[o + 3];
    bodyWorld[o + 4] = offsets[o + 4];
    bodyWorld[o + 5] = (turnDegPerCycle * frame) / cycleFrames + offsets[o + 5];
    let stanceCount = 0;
    for (let leg = 0; leg < legCount; leg += 1) {
      const slot = frame * legCount + leg;
      const t = slot * 3;
      for (let j = 0; j < 3; j += 1) {
        const raw = rawPulseUs(table, leg * 3 + j, angles[t + j]);
        pulses[t + j] = clampPulseUs(table, leg * 3 + j, raw);
        pulseClamped[t + j] = pulses[t + j] !== raw ? 1 : 0;
      }
      if (stance[slot] === 1) {
        xs[stanceCount] = achievedWorld[t];
        ys[stanceCount] = achievedWorld[t + 1];
        stanceCount += 1;
      }
    }
    state.stanceCount[frame] = stanceCount;
    // Feet fixed in the world keep their polygon: frames with the very same
    // stance feet share one (the result is read-only).
    let sameFeet = frame > 0 && stanceCount === previousCount;
    for (let i = 0; sameFeet && i < stanceCount; i += 1) sameFeet = xs[i] === previousXs[i] && ys[i] === previousYs[i];
    if (!sameFeet) {
      hullSize = convexHullInto(xs, ys, stanceCount, order, hull);
      const polygon = new Array<[number, number]>(hullSize);
      for (let i = 0; i < hullSize; i += 1) polygon[i] = [xs[hull[i]], ys[hull[i]]];
      polygons.push(polygon);
      previousCount = stanceCount;
      previousXs.set(xs);
      previousYs.set(ys);
    }
    polygonIndex[frame] = polygons.length - 1;
    state.margin[frame] = stanceCount >= 3 ? stabilityMargin(xs, ys, hull, hullSize, comWorld[frame * 2], comWorld[frame * 2 + 1]) : Number.NaN;
  }
  return { bodyWorld, comWorld, polygons, polygonIndex };
}

/** The frame objects of DESIGN.md's result, made from a run's typed arrays. */
export function framesOf(run: SolveRun): SolvedFrame[] {
  const { state, world } = run;
  const { legIds, legCount, frameCount, angles, pulses, status, stance, targetBody } = state;
  const { bodyWorld, comWorld, polygons, polygonIndex } = world;
  const msPerFrame = 1000 / state.fps;
  const frames: SolvedFrame[] = new Array(frameCount);
  for (let frame = 0; frame < frameCount; frame += 1) {
    const o = frame * 6;
    const legs: Record<string, SolvedLeg> = {};
    for (let leg = 0; leg < legCount; leg += 1) {
      const slot = frame * legCount + leg;
      const t = slot * 3;
      legs[legIds[leg]] = {
        contact: stance[slot] === 1 ? "stance" : "swing",
        foot: [targetBody[t], targetBody[t + 1], targetBody[t + 2]],
        reachable: (status[slot] & SOLVE_UNREACHABLE) === 0,
        angles: { coxa: angles[t], femur: angles[t + 1], tibia: angles[t + 2] },
        pulses: { coxa: pulses[t], femur: pulses[t + 1], tibia: pulses[t + 2] },
      };
    }
    const margin = state.margin[frame];
    frames[frame] = {
      index: frame,
      timeMs: frame * msPerFrame,
      body: { x: bodyWorld[o], y: bodyWorld[o + 1], z: bodyWorld[o + 2], roll: bodyWorld[o + 3], pitch: bodyWorld[o + 4], yaw: bodyWorld[o + 5] },
      legs,
      support: polygons[polygonIndex[frame]],
      com: [comWorld[frame * 2], comWorld[frame * 2 + 1]],
      marginMm: Number.isNaN(margin) ? null : margin,
    };
  }
  return frames;
}

// Pass 4: every enabled check, each over all frames; flags in frame order,
// and within a frame in the order of the check list.
export function runChecks(state: SolveState, kinds: readonly FlagKind[] | undefined): Flag[] {
  const enabled = kinds ? new Set<FlagKind>(kinds) : null;
  const checks = enabled ? CHECKS.filter((check) => enabled.has(check.kind)) : CHECKS;
  const context = { state };
  const flags: Flag[] = [];
  for (const check of checks) for (const flag of check.run(context)) flags.push(flag);
  // Array.prototype.sort is stable: equal frames keep the check order.
  return flags.sort((a, b) => a.frame - b.frame);
}

/** The summary of a solve's state and flags; `plans` give each leg's duty factor. */
export function summarize(
  state: SolveState,
  plans: readonly { dutyFactor: number }[],
  flags: readonly Flag[],
  strideMm: number,
  cycleMs: number,
): SolveSummary {
  const flagsByKind: Partial<Record<FlagKind, number>> = {};
  let errors = 0;
  for (const flag of flags) {
    flagsByKind[flag.kind] = (flagsByKind[flag.kind] ?? 0) + 1;
    if (flag.severity === "error") errors += 1;
  }
  // Keep FLAG_KINDS order in the object, so summaries print alike.
  const ordered: Partial<Record<FlagKind, number>> = {};
  for (const kind of FLAG_KINDS) if (flagsByKind[kind] !== undefined) ordered[kind] = flagsByKind[kind];

  let worstMarginMm: number | null = null;
  let worstMarginFrame: number | null = null;
  for (let frame = 0; frame < state.frameCount; frame += 1) {
    const margin = state.margin[frame];
    if (state.resting[frame] || Number.isNaN(margin)) continue;
    if (worstMarginMm === null || margin < worstMarginMm) {
      worstMarginMm = margin;
      worstMarginFrame = frame;
    }
  }

  const { legCount, fps } = state;
  const peaks = new Float64Array(legCount * 3);
  for (let frame = 1; frame < state.frameCount; frame += 1) {
    const here = frame * legCount * 3;
    const before = here - legCount * 3;
    for (let i = 0; i < legCount * 3; i += 1) {
      const speed = Math.abs(state.angles[here + i] - state.angles[before + i]) * fps;
      if (speed > peaks[i]) peaks[i] = speed;
    }
  }
  const peakSpeedDegS: Record<string, JointAngles> = {};
  const dutyFactor: Record<string, number> = {};
  let speedHeadroom: number | null = null;
  state.legIds.forEach((legId, leg) => {
    peakSpeedDegS[legId] = { coxa: peaks[leg * 3], femur: peaks[leg * 3 + 1], tibia: peaks[leg * 3 + 2] };
    // Rounded to 1e-9: sums of key times carry round-off (0.6666666666669999).
    dutyFactor[legId] = Math.round(plans[leg].dutyFactor * 1e9) / 1e9;
    for (let j = 0; j < 3; j += 1) {
      const peak = peaks[leg * 3 + j];
      if (peak <= 0) continue;
      const headroom = state.joints[leg * 3 + j].maxSpeedDegS / peak;
      // A peak of round-off (5e-324 °/s) would give an infinite headroom: no joint moves that little.
      if (!(headroom < Infinity)) continue;
      if (speedHeadroom === null || headroom < speedHeadroom) speedHeadroom = headroom;
    }
  });

  return {
    frames: state.frameCount,
    fps,
    flagsByKind: ordered,
    errors,
    warnings: flags.length - errors,
    worstMarginMm,
    worstMarginFrame,
    peakSpeedDegS,
    dutyFactor,
    strideMm,
    bodySpeedMmS: strideMm / (cycleMs / 1000),
    speedHeadroom,
    dynamic: state.dynamic,
  };
}
