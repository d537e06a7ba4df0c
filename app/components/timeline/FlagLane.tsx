// Flags along a track at their frames: one mark per run, its shape (▲ error,
// ◆ warning), a short tag and the colour of its severity. The Checks list
// below the timeline carries the same runs for the keyboard and screen readers.
import { memo } from "react";
import { framesText, type FlagRun } from "~/features/gaits/editor/flag-runs";
import { FLAG_LABELS, FLAG_TAGS } from "~/features/gaits/flag-labels";

export const SEVERITY_GLYPH = { error: "▲", warning: "◆" } as const;

export const FlagLane = memo(function FlagLane({
  runs,
  cycleFrames,
  onJump,
}: {
  runs: readonly FlagRun[];
  cycleFrames: number;
  onJump: (frame: number) => void;
}) {
  if (runs.length === 0) return null;
  return (
    <div aria-hidden className="pointer-events-none absolute inset-x-0 bottom-0 h-3.5">
      {runs.map((run) => {
        const error = run.severity === "error";
        return (
          <span
            key={run.id}
            title={`${FLAG_LABELS[run.kind]}, ${framesText(run)}: ${run.message}`}
            data-flag-kind={run.kind}
            data-from={run.fromFrame}
            data-to={run.toFrame}
            onClick={() => onJump(run.fromFrame)}
            className={`pointer-events-auto absolute bottom-0 flex h-3.5 min-w-3.5 cursor-pointer items-center gap-0.5 overflow-hidden rounded-sm border px-0.5 text-[9px] leading-none font-medium whitespace-nowrap ${
              error ? "border-danger bg-danger-soft text-danger" : "border-warning bg-warning-soft text-warning"
            }`}
            style={{ left: `${(run.fromFrame / cycleFrames) * 100}%`, width: `${((run.toFrame - run.fromFrame + 1) / cycleFrames) * 100}%` }}
          >
            <span>{SEVERITY_GLYPH[run.severity]}</span>
            <span>{FLAG_TAGS[run.kind]}</span>
          </span>
        );
      })}
    </div>
  );
});
