// Joint angle curves of two versions on one time axis, for the overlaid joint
// plots: both resampled by linear interpolation onto the same cycle fractions,
// so the gap between them can be shaded and measured. Pure.
import type { Flag, FlagKind, Severity } from "../../gait/index";
import { JOINT_NAMES, type JointAngles, type JointName } from "../../kinematics/index";
import { jointFlags } from "../gaits/index";

/** The angles of one solve, frame by frame: what the plots need of a SolvedSequence. */
export type AngleFrames = {
  loop: boolean;
  frames: readonly { legs: Readonly<Record<string, { angles: JointAngles }>> }[];
  /** The version's flags, for the marks under its curves. */
  flags?: readonly Flag[];
  /** How many frames the flags' frame numbers count (the version's own solve; `frames` may be fewer, for display). */
  flagFrameCount?: number;
  /** Each leg's joint limits (servo degrees), for the shaded bands. */
  limits?: Readonly<Record<string, Readonly<Record<JointName, { minDeg: number; maxDeg: number }>>>>;
};

/** A flagged frame of one side, at its place on the shared cycle axis. */
export type OverlayFlagMark = { fraction: number; frame: number; kind: FlagKind; severity: Severity };

export type JointOverlay = {
  legId: string;
  joint: JointName;
  /** Cycle fractions 0..1 of the samples. */
  fractions: number[];
  /** Servo degrees of A and B at those fractions. */
  a: number[];
  b: number[];
  /** Largest |B − A| over the samples, degrees. */
  maxDifferenceDeg: number;
  /** The joint's limits in A's robot revision (B's where A gives none); null when neither does. */
  limits: { minDeg: number; maxDeg: number } | null;
  /** Flagged frames of A and of B on this joint (its own flags and its leg's that name no joint). */
  flags: { a: OverlayFlagMark[]; b: OverlayFlagMark[] };
};

function marksOf(side: AngleFrames, legId: string, joint: JointName): OverlayFlagMark[] {
  if (!side.flags) return [];
  const count = side.flagFrameCount ?? side.frames.length;
  const span = Math.max(1, side.loop ? count : count - 1);
  return jointFlags(side.flags, legId, joint).map((flagged) => ({ ...flagged, fraction: flagged.frame / span }));
}

/**
 * Value at cycle fraction `fraction` of per-frame values: a loop has frames at
 * i/N for i < N and wraps to frame 0 at 1; a one-shot move has frames at i/(N−1).
 */
export function sampleAt(values: readonly number[], loop: boolean, fraction: number): number {
  const count = values.length;
  if (count === 0) return Number.NaN;
  if (count === 1) return values[0];
  const span = loop ? count : count - 1;
  const position = Math.min(Math.max(fraction, 0), 1) * span;
  const index = Math.floor(position);
  const weight = position - index;
  const here = values[loop ? index % count : Math.min(index, count - 1)];
  const next = values[loop ? (index + 1) % count : Math.min(index + 1, count - 1)];
  return here + (next - here) * weight;
}

/** The fractions both curves are drawn at: the finer of the two frame grids, closing the loop at 1. */
export function sampleFractions(framesA: number, framesB: number, loop: boolean): number[] {
  const intervals = Math.max(1, loop ? Math.max(framesA, framesB) : Math.max(framesA, framesB) - 1);
  return Array.from({ length: intervals + 1 }, (_, index) => index / intervals);
}

/** One overlay per leg both solves have and per joint, in A's leg order. */
export function jointOverlays(a: AngleFrames, b: AngleFrames): JointOverlay[] {
  const legsA = Object.keys(a.frames[0]?.legs ?? {});
  const legsB = new Set(Object.keys(b.frames[0]?.legs ?? {}));
  const loop = a.loop && b.loop;
  const fractions = sampleFractions(a.frames.length, b.frames.length, loop);
  const overlays: JointOverlay[] = [];
  for (const legId of legsA.filter((id) => legsB.has(id))) {
    for (const joint of JOINT_NAMES) {
      const valuesA = a.frames.map((frame) => frame.legs[legId].angles[joint]);
      const valuesB = b.frames.map((frame) => frame.legs[legId].angles[joint]);
      const sampledA = fractions.map((fraction) => sampleAt(valuesA, a.loop, fraction));
      const sampledB = fractions.map((fraction) => sampleAt(valuesB, b.loop, fraction));
      let maxDifferenceDeg = 0;
      for (let index = 0; index < fractions.length; index += 1) {
        maxDifferenceDeg = Math.max(maxDifferenceDeg, Math.abs(sampledB[index] - sampledA[index]));
      }
      const limits = a.limits?.[legId]?.[joint] ?? b.limits?.[legId]?.[joint] ?? null;
      overlays.push({
        legId,
        joint,
        fractions,
        a: sampledA,
        b: sampledB,
        maxDifferenceDeg,
        limits: limits && { minDeg: limits.minDeg, maxDeg: limits.maxDeg },
        flags: { a: marksOf(a, legId, joint), b: marksOf(b, legId, joint) },
      });
    }
  }
  return overlays;
}
