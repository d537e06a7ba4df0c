// Joint plots: coxa, femur and tibia servo angles over the cycle for the
// focused leg (d3-scale, d3-shape), the joint-limit bands shaded, the joint
// speed as a dashed curve against its own axis with the servo's rated speed,
// and the playhead. The curves are drawn once per solve; scrubbing moves only
// the playhead line and the readout.
import { scaleLinear } from "d3-scale";
import { line } from "d3-shape";
import { memo, useMemo } from "react";
import { legStroke } from "~/components/robot-view";
import type { Joint, JointName } from "~/kinematics";
import { useEditor } from "~/stores/editor-context";
import { jointSeries, type JointSeries } from "./joint-series";
import { Panel } from "~/components/common/Panel";
import { jointFlags, type FlaggedFrame } from "~/features/gaits";
import { angleRange, FlagMarks, LimitBands } from "./plot-parts";

const WIDTH = 600;
const HEIGHT = 96;
const MARGIN = { left: 40, right: 46, top: 6, bottom: 16 };

type Scales = { x: (frame: number) => number; angle: ReturnType<typeof scaleLinear<number, number>>; speed: ReturnType<typeof scaleLinear<number, number>> };

function scalesFor(series: JointSeries, joint: Joint, frames: number): Scales {
  // The curve sets the range; a limit within 15° of it is shown too, farther ones would flatten the curve.
  const [low, high] = angleRange(series.minAngleDeg, series.maxAngleDeg, joint);
  const x = scaleLinear()
    .domain([0, Math.max(1, frames - 1)])
    .range([MARGIN.left, WIDTH - MARGIN.right]);
  const angle = scaleLinear()
    .domain([low, high])
    .range([HEIGHT - MARGIN.bottom, MARGIN.top])
    .nice();
  const speed = scaleLinear()
    .domain([0, Math.max(series.peakSpeedDegS, joint.maxSpeedDegS) * 1.1 || 1])
    .range([HEIGHT - MARGIN.bottom, MARGIN.top]);
  return { x, angle, speed };
}

const PlotCurves = memo(function PlotCurves({ series, joint, scales, legIndex }: { series: JointSeries; joint: Joint; scales: Scales; legIndex: number }) {
  const { x, angle, speed } = scales;
  const angleLine = line<number>()
    .x((_, i) => x(i))
    .y((value) => angle(value));
  const speedLine = line<number>()
    .x((_, i) => x(i))
    .y((value) => speed(value));
  const top = MARGIN.top;
  const bottom = HEIGHT - MARGIN.bottom;
  const right = WIDTH - MARGIN.right;
  const ticks = angle.ticks(3);
  const overSpeed = speed(joint.maxSpeedDegS);
  return (
    <g>
      {/* Outside the joint limits: shaded bands with a dashed edge (the comparison's plots draw the same). */}
      <LimitBands limits={joint} angle={angle} left={MARGIN.left} right={right} top={top} bottom={bottom} />
      {ticks.map((tick) => (
        <g key={tick}>
          <line x1={MARGIN.left - 3} x2={right} y1={angle(tick)} y2={angle(tick)} className="stroke-line" strokeWidth={0.5} />
          <text x={MARGIN.left - 5} y={angle(tick) + 3} textAnchor="end" className="fill-ink-muted font-mono text-[9px]">
            {tick}°
          </text>
        </g>
      ))}
      <text x={right + 4} y={Math.max(top + 8, overSpeed + 3)} className="fill-danger font-mono text-[9px]">
        {Math.round(joint.maxSpeedDegS)}°/s
      </text>
      <line x1={MARGIN.left} x2={right} y1={overSpeed} y2={overSpeed} className="stroke-danger" strokeDasharray="1 3" strokeWidth={1} />
      <path d={speedLine(Array.from(series.speedDegS)) ?? undefined} className="fill-none stroke-ink-muted" strokeDasharray="3 2" strokeWidth={1} />
      <path d={angleLine(Array.from(series.angleDeg)) ?? undefined} className={`fill-none ${legStroke(legIndex)}`} strokeWidth={2} />
      <line x1={MARGIN.left} x2={right} y1={bottom} y2={bottom} className="stroke-ink-muted" strokeWidth={1} />
    </g>
  );
});

function PlotPlayhead({ scales }: { scales: Scales }) {
  const frame = useEditor((state) => state.frame);
  const x = scales.x(frame);
  return <line x1={x} x2={x} y1={MARGIN.top} y2={HEIGHT - MARGIN.bottom} className="stroke-accent" strokeWidth={1.5} data-playhead={frame} />;
}

function JointPlot({
  legId,
  name,
  series,
  joint,
  frames,
  legIndex,
  flagged,
}: {
  legId: string;
  name: JointName;
  series: JointSeries;
  joint: Joint;
  frames: number;
  legIndex: number;
  flagged: readonly FlaggedFrame[];
}) {
  const scales = useMemo(() => scalesFor(series, joint, frames), [series, joint, frames]);
  const marks = useMemo(() => flagged.map((entry) => ({ ...entry, x: scales.x(entry.frame) })), [flagged, scales]);
  const label =
    `${legId} ${name}: from ${series.minAngleDeg.toFixed(1)}° to ${series.maxAngleDeg.toFixed(1)}° over the cycle, ` +
    `limits ${joint.minDeg}° to ${joint.maxDeg}°; peak speed ${Math.round(series.peakSpeedDegS)}°/s of ${joint.maxSpeedDegS}°/s.`;
  return (
    <figure>
      <figcaption className="flex items-baseline justify-between text-xs">
        <span className="font-medium capitalize">{name}</span>
        <JointReadout series={series} />
      </figcaption>
      <svg
        viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
        className="h-auto w-full"
        role="img"
        aria-label={label}
        data-joint={name}
        data-peak-speed={Math.round(series.peakSpeedDegS)}
      >
        <PlotCurves series={series} joint={joint} scales={scales} legIndex={legIndex} />
        <FlagMarks marks={marks} y={HEIGHT - MARGIN.bottom + 9} />
        <PlotPlayhead scales={scales} />
      </svg>
    </figure>
  );
}

function JointReadout({ series }: { series: JointSeries }) {
  const frame = useEditor((state) => state.frame);
  const angle = series.angleDeg[frame] ?? 0;
  const speed = series.speedDegS[frame] ?? 0;
  return (
    <span className="numeric font-mono text-ink-muted">
      {angle.toFixed(1)}° · {Math.round(speed)}°/s
    </span>
  );
}

export function JointPlots() {
  const robot = useEditor((state) => state.robot);
  const preview = useEditor((state) => state.preview);
  const loop = useEditor((state) => state.sequence.loop);
  const legId = useEditor((state) => state.focusLegId);
  const legIndex = robot.legs.findIndex((leg) => leg.id === legId);
  const leg = robot.legs[legIndex];
  const series = useMemo(() => (preview && leg ? jointSeries(preview, leg.id, loop) : null), [preview, leg, loop]);
  return (
    <Panel
      title={
        <>
          Joint plots <span className="font-mono text-sm font-normal">{legId}</span>
        </>
      }
      layout="flex items-baseline justify-between gap-2"
      className="[contain:content]"
      testId="joint-plots"
      tools={<p className="text-xs text-ink-muted">solid: angle · dashed: speed · shaded: past the joint limits · ▲ ◆ flagged frames</p>}
    >
      <div className="grid gap-1 p-2">
        {series && leg ? (
          series.map((entry) => (
            <JointPlot
              key={entry.joint}
              legId={leg.id}
              name={entry.joint}
              series={entry}
              joint={leg.joints[entry.joint]}
              frames={preview!.frames.length}
              legIndex={legIndex}
              flagged={jointFlags(preview!.flags, leg.id, entry.joint)}
            />
          ))
        ) : (
          <p className="p-2 text-sm text-ink-muted">No preview: the sequence does not solve.</p>
        )}
      </div>
    </Panel>
  );
}
