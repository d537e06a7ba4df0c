// What every check is: one flag kind, and a function from the solve's context
// to its flags, in frame order. Each check walks the frames in a loop of its
// own, so the loop stays monomorphic and fast (one shared loop calling eleven
// checks per frame cost more than the checks). A new check is one new file
// with this shape and one line in checks/index.ts. The context reads the
// solve's typed arrays; frame f, leg l, joint j live at [f·legs + l] and
// [(f·legs + l)·3 + j].
import type { Joint, JointName, LegSolver, Robot } from "../../kinematics/index";
import type { Planar } from "../interpolate/travel";
import type { Flag, FlagKind, Severity } from "../solved";

export type ResolvedSolveOptions = {
  marginThresholdMm: number;
  slipToleranceMm: number;
  clearanceMm: number;
  groundToleranceMm: number;
};

export type JointSpec = { legId: string; name: JointName; joint: Joint; minDeg: number; maxDeg: number; maxSpeedDegS: number };

export type SolveState = {
  robot: Robot;
  solver: LegSolver;
  legIds: readonly string[];
  legCount: number;
  /** Frames solved: N for a loop, N + 1 for a one-shot move. */
  frameCount: number;
  loop: boolean;
  /** Static support flags are warnings. */
  dynamic: boolean;
  fps: number;
  options: ResolvedSolveOptions;
  /** Per leg × joint (legCount · 3). */
  joints: readonly JointSpec[];
  /** Leg index pairs that are neighbours on the same side (rows r and r + 1). */
  neighbours: readonly (readonly [number, number])[];
  /** The heading frame's travel over one whole cycle, E(1): frame N of a loop is frame 0 moved by it. */
  cycleTravel: Planar;
  // Per frame × leg.
  status: Int32Array;
  stance: Uint8Array;
  // Per frame × leg × 3.
  angles: Float64Array;
  /** The planned foot in the neutral body frame (the solver's input). */
  targetNeutral: Float64Array;
  /** The planned foot in the moved body frame. */
  targetBody: Float64Array;
  /** Where the foot is with the angles in the table, world mm. */
  achievedWorld: Float64Array;
  /** Pulse widths (µs), clamped to the servo's range. */
  pulses: Float64Array;
  pulseClamped: Uint8Array;
  // Per frame.
  /** x, y, z, roll, pitch, yaw of the body pose offset (neutral body frame). */
  offsets: Float64Array;
  resting: Uint8Array;
  stanceCount: Uint8Array;
  /** NaN where the margin is null. */
  margin: Float64Array;
};

export type CheckContext = { state: SolveState };

export type Check = { kind: FlagKind; run(context: CheckContext): Flag[] };

/** Error for static gaits, warning for dynamic ones (DESIGN.md): the support checks' severity. */
export function supportSeverity(state: SolveState): Severity {
  return state.dynamic ? "warning" : "error";
}

/** A number for a message: fixed decimals, no "-0". */
export function formatNumber(value: number, decimals = 1): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}
