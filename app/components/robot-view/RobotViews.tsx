// Top and side views side by side with a legend of the legs. Give it a robot
// and, optionally, where the feet are (default: the neutral stance) or the
// servo angles; the gait editor passes each frame's feet or angles.
import { useMemo } from "react";
import { neutralStance, reachRing, type BodyPose, type JointAngles, type ReachRing, type Robot, type Vec3 } from "~/kinematics";
import { legBackground } from "./leg-colours";
import { legPostures, type LegPosture } from "./leg-postures";
import { SideView } from "./SideView";
import { TopView } from "./TopView";

export type RobotViewsProps = {
  robot: Robot;
  /** Foot targets in the neutral body frame, mm; default the neutral stance at the body height. */
  feet?: Readonly<Record<string, Vec3>>;
  /** Servo angles per leg; where given they win over `feet`. */
  angles?: Readonly<Record<string, JointAngles>>;
  bodyPose?: BodyPose;
  /** Height of the body origin above the ground, mm; default the robot's standHeight. */
  bodyHeightMm?: number;
  /** Draw each leg's reach ring at the ground; default true. */
  showReach?: boolean;
  highlightLegId?: string;
  /** Hide the leg list under the views. */
  compact?: boolean;
};

/** Reach rings at the ground for a body height; memoise on the robot, as this solves a few hundred postures a leg. */
export function groundRings(robot: Robot, bodyHeightMm: number = robot.standHeight): ReachRing[] {
  return robot.legs.map((leg) => reachRing(robot, leg.id, -bodyHeightMm));
}

export function RobotViews({ robot, feet, angles, bodyPose, bodyHeightMm = robot.standHeight, showReach = true, highlightLegId, compact }: RobotViewsProps) {
  const rings = useMemo(() => (showReach ? groundRings(robot, bodyHeightMm) : undefined), [robot, bodyHeightMm, showReach]);
  const stance = useMemo(() => feet ?? neutralStance(robot, bodyHeightMm), [robot, feet, bodyHeightMm]);
  const postures = useMemo(() => legPostures(robot, stance, angles, bodyPose), [robot, stance, angles, bodyPose]);
  const summary = describePostures(postures, bodyHeightMm, feet === undefined && angles === undefined);
  return (
    <div className="grid gap-3 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <figure className="rounded-lg border border-line bg-surface p-2">
        <TopView robot={robot} postures={postures} rings={rings} highlightLegId={highlightLegId} description={summary} />
        <figcaption className="px-1 text-xs text-ink-muted">From above, forward up; shaded: where each foot reaches on the ground.</figcaption>
      </figure>
      <div className="space-y-3">
        <figure className="rounded-lg border border-line bg-surface p-2">
          <SideView robot={robot} postures={postures} bodyHeightMm={bodyHeightMm} highlightLegId={highlightLegId} description={summary} />
          <figcaption className="px-1 text-xs text-ink-muted">From the right, forward to the right; far-side legs dashed.</figcaption>
        </figure>
        {compact ? null : <LegLegend robot={robot} postures={postures} rings={rings} />}
      </div>
    </div>
  );
}

function describePostures(postures: readonly LegPosture[], bodyHeightMm: number, neutral: boolean): string {
  const flagged = postures.filter((posture) => !posture.reachable || posture.violations.length > 0);
  const opening = `${postures.length} legs${neutral ? " in the neutral stance" : ""}, body origin ${Math.round(bodyHeightMm * 10) / 10} mm above the ground.`;
  if (flagged.length === 0) return `${opening} Every foot is within reach and joint limits.`;
  return `${opening} Out of reach or limits: ${flagged.map((posture) => posture.legId).join(", ")}.`;
}

const mm = (value: number) => Math.round(value).toString();

function LegLegend({ robot, postures, rings }: { robot: Robot; postures: readonly LegPosture[]; rings?: readonly ReachRing[] }) {
  return (
    <ul className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm" aria-label="Legs in the views">
      {robot.legs.map((leg, index) => {
        const posture = postures.find((candidate) => candidate.legId === leg.id);
        const ring = rings?.find((candidate) => candidate.legId === leg.id);
        const problem =
          posture && !posture.reachable
            ? "out of reach"
            : posture && posture.violations.length > 0
              ? `${posture.violations.map((v) => v.joint).join(", ")} past limit`
              : null;
        return (
          <li key={leg.id} className="flex items-center gap-2">
            <span aria-hidden className={`inline-block h-3 w-3 rounded-sm ${legBackground(index)}`} />
            <span className="font-mono font-medium">{leg.id}</span>
            {problem ? (
              <span className="text-danger">
                <span aria-hidden>✕ </span>
                {problem}
              </span>
            ) : ring ? (
              <span className="numeric text-ink-muted">{ring.reachable ? `reach ${mm(ring.innerMm)}–${mm(ring.outerMm)} mm` : "cannot reach the ground"}</span>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}
