// The robot seen from above: body outline, each leg's reach ring at the foot
// height, and the legs. Fast enough to redraw every frame of a playback: the
// frame and the rings depend on the robot only and are drawn in a memoised layer.
import { arc, curveLinearClosed, line } from "d3-shape";
import { memo, useMemo } from "react";
import { RAD_PER_DEG, type ReachRing, type Robot } from "~/kinematics";
import { topFrame, type ViewFrame } from "./frame";
import { legFill, legStroke } from "./leg-colours";
import { placeLegLabels } from "./leg-labels";
import type { LegPosture } from "./leg-postures";
import { FootMarker } from "./FootMarker";
import { ViewPicture } from "./ViewPicture";

export type TopViewProps = {
  robot: Robot;
  postures: readonly LegPosture[];
  /** Reach rings to draw under the legs (one per leg, any order); none when omitted. */
  rings?: readonly ReachRing[];
  highlightLegId?: string;
  width?: number;
  height?: number;
  /** Accessible name of the picture. */
  label?: string;
  description?: string;
};

export function TopView({ robot, postures, rings, highlightLegId, width = 360, height = 360, label, description }: TopViewProps) {
  const frame = useMemo(() => topFrame(robot, width, height), [robot, width, height]);
  const labels = useMemo(() => {
    const placed = placeLegLabels(
      postures.map((posture) => ({
        id: posture.legId,
        text: `${posture.legId}${!posture.reachable || posture.violations.length > 0 ? " !" : ""}`,
        foot: frame.toScreen(posture.points.foot[0], posture.points.foot[1]),
      })),
      frame.toScreen(0, 0),
    );
    return new Map(placed.map((label) => [label.id, label]));
  }, [postures, frame]);
  return (
    <ViewPicture
      width={width}
      height={height}
      className="mx-auto h-auto max-h-[28rem] w-full"
      label={label ?? `Top view of ${robot.name}`}
      description={description}
    >
      <TopStatic robot={robot} frame={frame} rings={rings} />
      <g>
        {postures.map((posture) => {
          const { coxa, femur, knee, foot } = posture.points;
          const path = [coxa, femur, knee, foot].map(([x, y]) => frame.toScreen(x, y).join(",")).join(" ");
          const [footX, footY] = frame.toScreen(foot[0], foot[1]);
          const faded = highlightLegId !== undefined && highlightLegId !== posture.legId;
          const flagged = !posture.reachable || posture.violations.length > 0;
          return (
            <g key={posture.legId} opacity={faded ? 0.35 : 1} data-leg={posture.legId}>
              <polyline points={path} className={`${legStroke(posture.index)} fill-none`} strokeWidth={3} strokeLinecap="round" strokeLinejoin="round" />
              <FootMarker x={footX} y={footY} index={posture.index} flagged={flagged} />
              {/* Beside the foot, away from the body and from the other labels; a halo keeps it readable over the legs. */}
              <text
                x={labels.get(posture.legId)?.x}
                y={labels.get(posture.legId)?.y}
                textAnchor={labels.get(posture.legId)?.anchor}
                className="fill-ink stroke-surface text-[11px] font-medium [paint-order:stroke]"
                strokeWidth={3}
                strokeLinejoin="round"
              >
                {labels.get(posture.legId)?.text}
              </text>
            </g>
          );
        })}
      </g>
    </ViewPicture>
  );
}

const ringArc = arc();

const TopStatic = memo(function TopStatic({ robot, frame, rings }: { robot: Robot; frame: ViewFrame; rings?: readonly ReachRing[] }) {
  const body = useMemo(() => bodyOutline(robot, frame), [robot, frame]);
  const [comX, comY] = frame.toScreen(robot.body.com[0], robot.body.com[1]);
  const [originX, originY] = frame.toScreen(0, 0);
  const [noseX, noseY] = frame.toScreen(Math.max(...robot.legs.map((leg) => leg.mount.x), 20) + 14, 0);
  return (
    <g>
      {rings?.map((ring) => {
        const index = robot.legs.findIndex((leg) => leg.id === ring.legId);
        if (index < 0 || !ring.reachable) return null;
        const [cx, cy] = frame.toScreen(ring.centerMm[0], ring.centerMm[1]);
        const span = ring.endDeg - ring.startDeg;
        // Our angles turn counter-clockwise from forward; d3's clockwise from screen-up, which is forward here.
        const [startAngle, endAngle] = span >= 360 ? [0, 2 * Math.PI] : [-ring.endDeg * RAD_PER_DEG, -ring.startDeg * RAD_PER_DEG];
        const d = ringArc({
          innerRadius: ring.innerMm * frame.pxPerMm,
          outerRadius: ring.outerMm * frame.pxPerMm,
          startAngle,
          endAngle,
        });
        return d ? (
          <path
            key={ring.legId}
            d={d}
            transform={`translate(${cx},${cy})`}
            className={`${legFill(index)} ${legStroke(index)}`}
            fillOpacity={0.12}
            strokeOpacity={0.5}
            strokeDasharray="3 3"
            data-ring={ring.legId}
          />
        ) : null;
      })}
      <path d={body ?? undefined} className="fill-sunken stroke-ink-muted" strokeWidth={1.5} />
      {/* The nose: which way is forward. */}
      <line x1={originX} y1={originY} x2={noseX} y2={noseY} className="stroke-ink-muted" strokeWidth={1} />
      <path d={`M${noseX},${noseY} l-4,7 h8 z`} className="fill-ink-muted" />
      <g className="stroke-ink" strokeWidth={1.2}>
        <circle cx={comX} cy={comY} r={4} className="fill-surface" />
        <line x1={comX - 6} y1={comY} x2={comX + 6} y2={comY} />
        <line x1={comX} y1={comY - 6} x2={comX} y2={comY + 6} />
      </g>
      <text x={comX + 7} y={comY + 12} className="fill-ink-muted text-[10px]">
        CoM
      </text>
      {robot.legs.map((leg, index) => {
        const [x, y] = frame.toScreen(leg.mount.x, leg.mount.y);
        return <circle key={leg.id} cx={x} cy={y} r={3} className={`${legFill(index)} stroke-ink`} strokeWidth={0.8} />;
      })}
    </g>
  );
});

const closedLine = line<[number, number]>().curve(curveLinearClosed);

// The body drawn through the mounts in order round the centre.
function bodyOutline(robot: Robot, frame: ViewFrame): string | null {
  const points = robot.legs
    .map((leg) => ({ angle: Math.atan2(leg.mount.y, leg.mount.x), point: frame.toScreen(leg.mount.x, leg.mount.y) }))
    .sort((a, b) => a.angle - b.angle)
    .map((entry) => entry.point);
  return closedLine(points);
}
