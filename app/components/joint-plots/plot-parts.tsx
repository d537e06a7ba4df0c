// Parts of a joint plot that the editor's plots and the comparison's overlays
// share, so the two read the same: the bands past a joint's limits (shaded,
// with a dashed edge) and a mark under the curve at each flagged frame (▲ an
// error, ◆ a warning, its title naming the flag).
import type { FlagKind, Severity } from "~/gait";
import { FLAG_LABELS } from "~/features/gaits/flag-labels";

export type Limits = { minDeg: number; maxDeg: number };

/** The angle range a plot shows: the curve's, with a limit within 15° of it included, padded by a tenth. */
export function angleRange(lowDeg: number, highDeg: number, limits: Limits | null): [number, number] {
  let low = lowDeg;
  let high = highDeg;
  if (limits && limits.minDeg > low - 15) low = Math.min(low, limits.minDeg);
  if (limits && limits.maxDeg < high + 15) high = Math.max(high, limits.maxDeg);
  const pad = Math.max(2, (high - low) * 0.1);
  return [low - pad, high + pad];
}

/** Shaded bands past the limits and a dashed line at each limit inside the plot. `angle` maps degrees to y. */
export function LimitBands({
  limits,
  angle,
  left,
  right,
  top,
  bottom,
}: {
  limits: Limits;
  angle: { (value: number): number; domain(): number[] };
  left: number;
  right: number;
  top: number;
  bottom: number;
}) {
  const [domainLow, domainHigh] = angle.domain();
  return (
    <g>
      {limits.maxDeg < domainHigh ? (
        <rect data-limit-band="max" x={left} y={top} width={right - left} height={Math.max(0, angle(limits.maxDeg) - top)} className="fill-danger-soft" />
      ) : null}
      {limits.minDeg > domainLow ? (
        <rect
          data-limit-band="min"
          x={left}
          y={angle(limits.minDeg)}
          width={right - left}
          height={Math.max(0, bottom - angle(limits.minDeg))}
          className="fill-danger-soft"
        />
      ) : null}
      {[limits.minDeg, limits.maxDeg]
        .filter((limit) => limit > domainLow && limit < domainHigh)
        .map((limit) => (
          <line key={limit} x1={left} x2={right} y1={angle(limit)} y2={angle(limit)} className="stroke-danger" strokeDasharray="4 3" strokeWidth={1} />
        ))}
    </g>
  );
}

// Whole class names, so the stylesheet has them.
const MARK_LOOKS = {
  error: { solid: "fill-danger stroke-danger", hollow: "fill-surface stroke-danger" },
  warning: { solid: "fill-warning stroke-warning", hollow: "fill-surface stroke-warning" },
} as const;

export type PlotFlagMark = { x: number; frame: number; kind: FlagKind; severity: Severity };

/**
 * A small ▲ (error) or ◆ (warning) at `y` for each flagged frame; `prefix`
 * names whose flags they are ("A: "), `hollow` draws them as outlines (the
 * comparison's B). `side` goes into each mark's data attribute.
 */
export function FlagMarks({
  marks,
  y,
  prefix = "",
  hollow = false,
  side,
}: {
  marks: readonly PlotFlagMark[];
  y: number;
  prefix?: string;
  hollow?: boolean;
  side?: string;
}) {
  return (
    <g>
      {marks.map((mark) => {
        const error = mark.severity === "error";
        const shape = error ? `M${mark.x},${y - 4} l4,7 h-8 z` : `M${mark.x},${y - 4} l4,4 l-4,4 l-4,-4 z`;
        return (
          <path
            key={`${mark.frame}-${mark.kind}`}
            d={shape}
            data-flag-mark={side ? `${side}:${mark.kind}` : mark.kind}
            className={MARK_LOOKS[mark.severity][hollow ? "hollow" : "solid"]}
            strokeWidth={1}
          >
            <title>{`${prefix}${FLAG_LABELS[mark.kind]}, frame ${mark.frame}`}</title>
          </path>
        );
      })}
    </g>
  );
}
