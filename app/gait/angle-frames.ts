// checkAngleFrames: servo angles given frame by frame — a bench table, frames
// from elsewhere — checked by the engine's own checks of a joint's motion,
// with the summary solveSequence would give. Nothing here knows where the
// feet are, so only the checks that read the angles alone run: the ground,
// support, slip, clearance and reach checks need a planned walk.
import { createLegSolver, type Robot } from "../kinematics/index";
import { createPlanar } from "./interpolate/travel";
import { clampPulseUs, createPulseTable, rawPulseUs } from "./pulses";
import type { SolveState } from "./checks/index";
import { SOLVE_DEFAULTS, jointSpecs, runChecks, summarize } from "./solve";
import type { Flag, FlagKind, SolveSummary } from "./solved";

/** The checks that read only the angles: what checkAngleFrames can run. */
export const ANGLE_CHECKS = ["joint-limit", "joint-speed", "pulse-range", "loop-jump"] as const satisfies readonly FlagKind[];
export type AngleCheckKind = (typeof ANGLE_CHECKS)[number];

export type AngleFrameOptions = {
  /** Frames per second the angles play at. */
  fps: number;
  /** True when the last frame is followed by the first again (loop-jump checks that step); default false. */
  loop?: boolean;
  /** Run only these checks (default all of ANGLE_CHECKS). */
  checks?: readonly AngleCheckKind[];
};

/**
 * Flags and summary for `angles`: frame × leg × joint servo degrees (legs in
 * robot.legs order, joints coxa, femur, tibia). No foot is on the ground, so
 * the summary has no margin, stride or duty factor (0 for every leg); its
 * cycle is the frames' own length, frameCount / fps.
 */
export function checkAngleFrames(robot: Robot, angles: Float64Array, options: AngleFrameOptions): { flags: Flag[]; summary: SolveSummary } {
  const { fps } = options;
  const solver = createLegSolver(robot);
  const legCount = solver.legIds.length;
  const frameCount = angles.length / (legCount * 3);
  if (!Number.isInteger(frameCount) || frameCount < 1) throw new RangeError(`angles must hold whole frames of ${legCount * 3} values (got ${angles.length})`);
  if (!(Number.isFinite(fps) && fps > 0)) throw new RangeError(`fps must be positive (got ${fps})`);
  const checks = options.checks ?? ANGLE_CHECKS;
  for (const kind of checks) if (!(ANGLE_CHECKS as readonly string[]).includes(kind)) throw new RangeError(`${kind} needs the feet, not only the angles`);

  const joints = jointSpecs(robot, solver);
  const slots = frameCount * legCount;
  const status = new Int32Array(slots);
  const pulses = new Float64Array(slots * 3);
  const pulseClamped = new Uint8Array(slots * 3);
  const table = createPulseTable(joints.map((spec) => spec.joint));
  for (let slot = 0; slot < slots; slot += 1) {
    const leg = slot % legCount;
    const t = slot * 3;
    status[slot] = solver.limits(leg, angles[t], angles[t + 1], angles[t + 2]);
    for (let j = 0; j < 3; j += 1) {
      const raw = rawPulseUs(table, leg * 3 + j, angles[t + j]);
      pulses[t + j] = clampPulseUs(table, leg * 3 + j, raw);
      pulseClamped[t + j] = pulses[t + j] !== raw ? 1 : 0;
    }
  }
  // The angle checks read the angles, limits and pulses; the feet and the body stay empty.
  const feet = new Float64Array(slots * 3);
  const state: SolveState = {
    robot,
    solver,
    legIds: solver.legIds,
    legCount,
    frameCount,
    loop: options.loop ?? false,
    dynamic: false,
    fps,
    options: { ...SOLVE_DEFAULTS },
    joints,
    neighbours: [],
    cycleTravel: createPlanar(),
    status,
    stance: new Uint8Array(slots),
    angles,
    targetNeutral: feet,
    targetBody: feet,
    achievedWorld: feet,
    pulses,
    pulseClamped,
    offsets: new Float64Array(frameCount * 6),
    resting: new Uint8Array(frameCount).fill(1),
    stanceCount: new Uint8Array(frameCount),
    margin: new Float64Array(frameCount).fill(Number.NaN),
  };
  const flags = runChecks(state, checks);
  const noStance = solver.legIds.map(() => ({ dutyFactor: 0 }));
  return { flags, summary: summarize(state, noStance, flags, 0, (frameCount * 1000) / fps) };
}
