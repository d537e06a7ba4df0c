// The numbers a lead weighs when comparing two versions, A against B: timing,
// travel, stability, joint speed and flags, each with its change and which side
// is better where "better" has a direction. Pure.
import { FLAG_KINDS, type FlagKind, type SolveSummary } from "../../gait/index";
import { JOINT_NAMES, type JointName } from "../../kinematics/index";
import { FLAG_LABELS } from "../gaits/index";

/** What a version keeps of its solve (app/features/versions/versions.server.ts VersionSummary); older rows may lack fields. */
export type MetricSummary = Partial<
  Pick<
    SolveSummary,
    "frames" | "fps" | "flagsByKind" | "errors" | "warnings" | "worstMarginMm" | "peakSpeedDegS" | "strideMm" | "bodySpeedMmS" | "speedHeadroom"
  >
> & {
  cycleMs?: number;
};

export type MetricId =
  | "cycleMs"
  | "strideMm"
  | "bodySpeedMmS"
  | "worstMarginMm"
  | "peakJointSpeedDegS"
  | `peakSpeedDegS.${JointName}`
  | "speedHeadroom"
  | "errors"
  | "warnings"
  | `flags.${FlagKind}`;

export type MetricRow = {
  id: MetricId;
  label: string;
  unit: string;
  a: number | null;
  b: number | null;
  /** b − a; null when either side has no value. */
  delta: number | null;
  /** Which side is better, when the metric has a direction and the two differ. */
  better: "a" | "b" | null;
  /** Where the value sits, e.g. "LF femur" for a peak speed. */
  whereA?: string;
  whereB?: string;
  /** Decimal places to show. */
  digits: number;
};

type Direction = "higher" | "lower" | null;

/** The fastest joint over every leg: its speed and where it is. */
export function peakJointSpeed(peaks: SolveSummary["peakSpeedDegS"] | undefined, joint?: JointName): { degS: number; legId: string; joint: JointName } | null {
  let best: { degS: number; legId: string; joint: JointName } | null = null;
  for (const [legId, speeds] of Object.entries(peaks ?? {})) {
    for (const name of joint ? [joint] : JOINT_NAMES) {
      const degS = speeds[name];
      if (typeof degS === "number" && Number.isFinite(degS) && (best === null || degS > best.degS)) best = { degS, legId, joint: name };
    }
  }
  return best;
}

const EQUAL = 1e-9;

function row(
  id: MetricId,
  label: string,
  unit: string,
  digits: number,
  a: number | null | undefined,
  b: number | null | undefined,
  direction: Direction,
): MetricRow {
  const valueA = typeof a === "number" && Number.isFinite(a) ? a : null;
  const valueB = typeof b === "number" && Number.isFinite(b) ? b : null;
  const delta = valueA !== null && valueB !== null ? valueB - valueA : null;
  let better: MetricRow["better"] = null;
  if (delta !== null && Math.abs(delta) > EQUAL && direction) better = (direction === "higher") === delta > 0 ? "b" : "a";
  return { id, label, unit, a: valueA, b: valueB, delta, better, digits };
}

/**
 * One row per metric, A against B. Flag kinds appear when either side has
 * some; a metric's `better` says which side wins (larger margin and headroom,
 * fewer flags, slower peak joints); timing and travel have no direction.
 */
export function metricDeltas(a: MetricSummary, b: MetricSummary): MetricRow[] {
  const peakA = peakJointSpeed(a.peakSpeedDegS);
  const peakB = peakJointSpeed(b.peakSpeedDegS);
  const where = (peak: ReturnType<typeof peakJointSpeed>) => (peak ? `${peak.legId} ${peak.joint}` : undefined);
  const rows: MetricRow[] = [
    row("cycleMs", "Cycle time", "ms", 0, a.cycleMs, b.cycleMs, null),
    row("strideMm", "Stride", "mm", 1, a.strideMm, b.strideMm, null),
    row("bodySpeedMmS", "Body speed", "mm/s", 1, a.bodySpeedMmS, b.bodySpeedMmS, null),
    row("worstMarginMm", "Worst stability margin", "mm", 1, a.worstMarginMm, b.worstMarginMm, "higher"),
    { ...row("peakJointSpeedDegS", "Peak joint speed", "°/s", 0, peakA?.degS, peakB?.degS, "lower"), whereA: where(peakA), whereB: where(peakB) },
  ];
  for (const joint of JOINT_NAMES) {
    const jointA = peakJointSpeed(a.peakSpeedDegS, joint);
    const jointB = peakJointSpeed(b.peakSpeedDegS, joint);
    rows.push({
      ...row(`peakSpeedDegS.${joint}`, `Peak ${joint} speed`, "°/s", 0, jointA?.degS, jointB?.degS, "lower"),
      whereA: jointA?.legId,
      whereB: jointB?.legId,
    });
  }
  rows.push(
    row("speedHeadroom", "Speed headroom", "×", 2, a.speedHeadroom, b.speedHeadroom, "higher"),
    row("errors", "Error flags", "", 0, a.errors ?? 0, b.errors ?? 0, "lower"),
    row("warnings", "Warning flags", "", 0, a.warnings ?? 0, b.warnings ?? 0, "lower"),
  );
  for (const kind of FLAG_KINDS) {
    const countA = a.flagsByKind?.[kind] ?? 0;
    const countB = b.flagsByKind?.[kind] ?? 0;
    if (countA === 0 && countB === 0) continue;
    rows.push(row(`flags.${kind}`, FLAG_LABELS[kind], "", 0, countA, countB, "lower"));
  }
  return rows;
}
