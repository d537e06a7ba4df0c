// Flags along a track at their frames: a thin strip in the severity's colour
// over each run's frames, and a badge at its start with its shape (▲ error,
// ◆ warning) and its whole tag. Where badges would crowd, one badge stands
// for the runs under it ("▲ limit +2", all of them in its title): text is
// never cut. The Checks list below the timeline carries the same runs for the
// keyboard and screen readers.
import { memo, useLayoutEffect, useMemo, useRef, useState } from "react";
import { badgeText, layoutFlagBadges } from "~/features/gaits/editor/flag-badges";
import { framesText, type FlagRun } from "~/features/gaits/editor/flag-runs";
import { FLAG_LABELS } from "~/features/gaits/flag-labels";

/** The lane's width before it has been measured (and in a document without layout). */
const UNMEASURED_PX = 1000;

const runTitle = (run: FlagRun) => `${FLAG_LABELS[run.kind]}, ${framesText(run)}: ${run.message}`;

export const FlagLane = memo(function FlagLane({
  runs,
  cycleFrames,
  onJump,
}: {
  runs: readonly FlagRun[];
  cycleFrames: number;
  onJump: (frame: number) => void;
}) {
  const lane = useRef<HTMLDivElement>(null);
  const [lanePx, setLanePx] = useState(UNMEASURED_PX);
  const empty = runs.length === 0;
  useLayoutEffect(() => {
    const element = lane.current;
    if (!element || typeof ResizeObserver === "undefined") return;
    const measure = () => {
      const width = element.getBoundingClientRect().width;
      if (width > 0) setLanePx(Math.round(width));
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, [empty]);
  const badges = useMemo(() => layoutFlagBadges(runs, cycleFrames, lanePx), [runs, cycleFrames, lanePx]);
  if (empty) return null;
  return (
    <div ref={lane} aria-hidden className="pointer-events-none absolute inset-x-0 bottom-0 h-4">
      {runs.map((run) => (
        <span
          key={run.id}
          data-flag-extent={run.kind}
          className={`absolute bottom-0 h-0.5 ${run.severity === "error" ? "bg-danger" : "bg-warning"}`}
          style={{ left: `${(run.fromFrame / cycleFrames) * 100}%`, width: `${((run.toFrame - run.fromFrame + 1) / cycleFrames) * 100}%` }}
        />
      ))}
      {badges.map((badge) => {
        const error = badge.severity === "error";
        return (
          <span
            key={badge.run.id}
            title={[badge.run, ...badge.hidden].map(runTitle).join("\n")}
            data-flag-kind={badge.run.kind}
            data-from={badge.run.fromFrame}
            data-to={badge.run.toFrame}
            data-more={badge.hidden.length || undefined}
            onClick={() => onJump(badge.run.fromFrame)}
            className={`pointer-events-auto absolute bottom-0.5 flex h-3.5 cursor-pointer items-center rounded-sm border px-1 text-[10px] leading-none font-medium whitespace-nowrap ${
              error ? "border-danger bg-danger-soft text-danger" : "border-warning bg-warning-soft text-warning"
            }`}
            style={{ left: badge.leftPx, minWidth: badge.widthPx }}
          >
            {badgeText(badge)}
          </span>
        );
      })}
    </div>
  );
});
