// The robot seen from its right side: forward to the right, the ground line at
// the body height below the body origin, legs of the near (right) side in front.
import { memo, useMemo } from "react";
import { legSide, type Robot } from "~/kinematics";
import { sideFrame, type ViewFrame } from "./frame";
import { FootMarker } from "./FootMarker";
import { legStroke } from "./leg-colours";
import type { LegPosture } from "./leg-postures";
import { ViewPicture } from "./ViewPicture";

export type SideViewProps = {
  robot: Robot;
  postures: readonly LegPosture[];
  /** Height of the body origin above the ground, mm; default the robot's standHeight. */
  bodyHeightMm?: number;
  highlightLegId?: string;
  width?: number;
  height?: number;
  label?: string;
  description?: string;
};

export function SideView({ robot, postures, bodyHeightMm = robot.standHeight, highlightLegId, width = 360, height = 180, label, description }: SideViewProps) {
  const frame = useMemo(() => sideFrame(robot, width, height, bodyHeightMm), [robot, width, height, bodyHeightMm]);
  // Far-side (left) legs first, so the near side is drawn over them.
  const ordered = useMemo(() => {
    const near = (posture: LegPosture) => legSide(robot, robot.legs[posture.index]) === "right";
    return [...postures].sort((a, b) => Number(near(a)) - Number(near(b)));
  }, [robot, postures]);
  return (
    <ViewPicture
      width={width}
      height={height}
      className="h-auto w-full"
      label={label ?? `Side view of ${robot.name}, from the right`}
      description={description}
    >
      <SideStatic robot={robot} frame={frame} bodyHeightMm={bodyHeightMm} />
      {ordered.map((posture) => {
        const leg = robot.legs[posture.index];
        const far = legSide(robot, leg) === "left";
        const { coxa, femur, knee, foot } = posture.points;
        const path = [coxa, femur, knee, foot].map(([x, , z]) => frame.toScreen(x, z).join(",")).join(" ");
        const [footX, footY] = frame.toScreen(foot[0], foot[2]);
        const faded = (highlightLegId !== undefined && highlightLegId !== posture.legId) || far;
        const flagged = !posture.reachable || posture.violations.length > 0;
        return (
          <g key={posture.legId} opacity={faded ? 0.4 : 1} data-leg={posture.legId}>
            <polyline
              points={path}
              className={`${legStroke(posture.index)} fill-none`}
              strokeWidth={far ? 2 : 3}
              strokeDasharray={far ? "5 3" : undefined}
              strokeLinecap="round"
              strokeLinejoin="round"
            />
            <FootMarker x={footX} y={footY} index={posture.index} flagged={flagged} />
          </g>
        );
      })}
    </ViewPicture>
  );
}

const SideStatic = memo(function SideStatic({ robot, frame, bodyHeightMm }: { robot: Robot; frame: ViewFrame; bodyHeightMm: number }) {
  const xs = robot.legs.map((leg) => leg.mount.x);
  const zs = robot.legs.map((leg) => leg.mount.z);
  const bodyTop = Math.max(...zs, 0) + 12;
  const bodyBottom = Math.min(...zs, 0) - 12;
  const [left, top] = frame.toScreen(Math.min(...xs) - 10, bodyTop);
  const [right, bottom] = frame.toScreen(Math.max(...xs) + 10, bodyBottom);
  const [, groundY] = frame.toScreen(0, -bodyHeightMm);
  const [originX, originY] = frame.toScreen(0, 0);
  const [comX, comY] = frame.toScreen(robot.body.com[0], robot.body.com[2]);
  return (
    <g>
      <line x1={0} y1={groundY} x2={frame.width} y2={groundY} className="stroke-ink-muted" strokeWidth={1.5} />
      <text x={6} y={groundY - 5} className="fill-ink-muted text-[10px]">
        ground
      </text>
      <line x1={originX} y1={originY} x2={originX} y2={groundY} className="stroke-line" strokeDasharray="2 3" />
      <text x={originX + 5} y={(originY + groundY) / 2} className="fill-ink-muted text-[10px]">
        {`${Math.round(bodyHeightMm * 10) / 10} mm`}
      </text>
      <rect
        x={left}
        y={top}
        width={Math.max(1, right - left)}
        height={Math.max(1, bottom - top)}
        rx={6}
        className="fill-sunken stroke-ink-muted"
        strokeWidth={1.5}
      />
      <path d={`M${right + 10},${(top + bottom) / 2} l-7,-4 v8 z`} className="fill-ink-muted" />
      <g className="stroke-ink" strokeWidth={1.2}>
        <circle cx={comX} cy={comY} r={4} className="fill-surface" />
        <line x1={comX - 6} y1={comY} x2={comX + 6} y2={comY} />
      </g>
    </g>
  );
});
