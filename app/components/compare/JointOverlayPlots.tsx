// Joint angles of A and B overlaid, one small plot per leg and joint, the
// gap between the curves shaded; A solid, B dashed, so the two read apart
// without colour. As in the editor's plots (the same plot parts), the bands
// past the joint's limits are shaded and flagged frames are marked under the
// curves: A's filled, B's hollow, on two rows. A line marks where the playback is.
import { area, line } from "d3-shape";
import { scaleLinear } from "d3-scale";
import { memo, useMemo, useState } from "react";
import { angleRange, FlagMarks, LimitBands } from "~/components/joint-plots/plot-parts";
import type { JointOverlay } from "~/features/compare";

const WIDTH = 240;
const HEIGHT = 104;
const PAD = { left: 34, right: 6, top: 6, bottom: 22 };

const Plot = memo(function Plot({ overlay }: { overlay: JointOverlay }) {
  const { paths, ticks, y, marks } = useMemo(() => {
    const values = [...overlay.a, ...overlay.b];
    const [low, high] = angleRange(Math.min(...values), Math.max(...values), overlay.limits);
    const x = scaleLinear()
      .domain([0, 1])
      .range([PAD.left, WIDTH - PAD.right]);
    const y = scaleLinear()
      .domain([low, high])
      .nice(3)
      .range([HEIGHT - PAD.bottom, PAD.top]);
    const marks = {
      a: overlay.flags.a.map((mark) => ({ ...mark, x: x(mark.fraction) })),
      b: overlay.flags.b.map((mark) => ({ ...mark, x: x(mark.fraction) })),
    };
    const indices = overlay.fractions.map((_, index) => index);
    const lineOf = (series: number[]) =>
      line<number>()
        .x((index) => x(overlay.fractions[index]))
        .y((index) => y(series[index]))(indices) ?? "";
    const gap =
      area<number>()
        .x((index) => x(overlay.fractions[index]))
        .y0((index) => y(overlay.a[index]))
        .y1((index) => y(overlay.b[index]))(indices) ?? "";
    return { paths: { a: lineOf(overlay.a), b: lineOf(overlay.b), gap }, ticks: y.ticks(3).map((value) => ({ value, y: y(value) })), y, marks };
  }, [overlay]);
  const bottom = HEIGHT - PAD.bottom;
  return (
    <>
      {overlay.limits ? <LimitBands limits={overlay.limits} angle={y} left={PAD.left} right={WIDTH - PAD.right} top={PAD.top} bottom={bottom} /> : null}
      {ticks.map((tick) => (
        <g key={tick.value}>
          <line x1={PAD.left} x2={WIDTH - PAD.right} y1={tick.y} y2={tick.y} className="stroke-line" strokeWidth={0.5} />
          <text x={PAD.left - 4} y={tick.y + 3} textAnchor="end" className="fill-ink-muted text-[9px] tabular-nums">
            {tick.value}°
          </text>
        </g>
      ))}
      <path d={paths.gap} className="fill-warning" opacity={0.3} />
      <path d={paths.a} className="fill-none stroke-ink" strokeWidth={1.5} />
      <path d={paths.b} className="fill-none stroke-accent" strokeWidth={1.5} strokeDasharray="4 2" />
      <line x1={PAD.left} x2={WIDTH - PAD.right} y1={bottom} y2={bottom} className="stroke-ink-muted" strokeWidth={0.5} />
      <FlagMarks marks={marks.a} y={bottom + 7} prefix="A: " side="a" />
      <FlagMarks marks={marks.b} y={bottom + 15} prefix="B: " hollow side="b" />
    </>
  );
});

export function JointOverlayPlots({ overlays, fraction, labels }: { overlays: readonly JointOverlay[]; fraction: number; labels: { a: string; b: string } }) {
  const [onlyDifferent, setOnlyDifferent] = useState(false);
  const shown = onlyDifferent ? overlays.filter((overlay) => overlay.maxDifferenceDeg >= 0.5) : overlays;
  const playheadX = PAD.left + fraction * (WIDTH - PAD.left - PAD.right);
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <span className="flex items-center gap-1">
          <svg width="24" height="8" aria-hidden="true">
            <line x1="0" x2="24" y1="4" y2="4" className="stroke-ink" strokeWidth={2} />
          </svg>
          A: {labels.a}
        </span>
        <span className="flex items-center gap-1">
          <svg width="24" height="8" aria-hidden="true">
            <line x1="0" x2="24" y1="4" y2="4" className="stroke-accent" strokeWidth={2} strokeDasharray="4 2" />
          </svg>
          B: {labels.b}
        </span>
        <span className="flex items-center gap-1">
          <span aria-hidden="true" className="inline-block h-3 w-5 bg-warning opacity-30" />
          difference
        </span>
        <span className="flex items-center gap-1">
          <span aria-hidden="true" className="inline-block h-3 w-5 bg-danger-soft" />
          shaded: past the joint limits
        </span>
        <span>
          <span aria-hidden="true" className="text-danger">
            ▲
          </span>{" "}
          flagged frames: A's filled, B's hollow under them
        </span>
        <label className="ml-auto flex items-center gap-1">
          <input type="checkbox" checked={onlyDifferent} onChange={(event) => setOnlyDifferent(event.target.checked)} />
          Only joints that differ by 0.5° or more
        </label>
      </div>
      {shown.length === 0 ? (
        <p className="text-sm text-ink-muted">The joint curves of A and B agree within 0.5° everywhere.</p>
      ) : (
        <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3" aria-label="Joint plots, A and B overlaid">
          {shown.map((overlay) => (
            <li key={`${overlay.legId}-${overlay.joint}`} className="rounded-md border border-line bg-surface p-1">
              <figure>
                <figcaption className="flex justify-between px-1 text-xs">
                  <span className="font-mono font-medium">
                    {overlay.legId} {overlay.joint}
                  </span>
                  <span className="text-ink-muted tabular-nums">max Δ {overlay.maxDifferenceDeg.toFixed(1)}°</span>
                </figcaption>
                <svg
                  viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
                  className="h-auto w-full"
                  role="img"
                  data-limits={overlay.limits ? `${overlay.limits.minDeg}..${overlay.limits.maxDeg}` : undefined}
                  aria-label={`${overlay.legId} ${overlay.joint}, servo degrees over the cycle: A and B differ by up to ${overlay.maxDifferenceDeg.toFixed(1)}°`}
                >
                  <Plot overlay={overlay} />
                  <line x1={playheadX} x2={playheadX} y1={PAD.top} y2={HEIGHT - PAD.bottom} className="stroke-ink-muted" strokeWidth={1} />
                </svg>
              </figure>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
