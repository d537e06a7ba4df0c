// One track of the Timeline: a leg's stance bars (the gait diagram), its key
// markers and its flags; the body track holds the body keys and the flags
// that belong to no one leg (support, CoM, margin, the loop seam).
import { memo, useCallback, useMemo } from "react";
import { legFill } from "~/components/robot-view";
import type { BodyKey, LegKey } from "~/gait";
import { flagRuns } from "~/features/gaits/editor/flag-runs";
import { msOfFrame } from "~/features/gaits/editor/timing";
import { useEditor } from "~/stores/editor-context";
import type { KeyRef } from "~/stores/editor-store";
import { stanceRuns } from "./contact-runs";
import { FlagLane } from "./FlagLane";
import { KeyMarker } from "./KeyMarker";

const EMPTY: readonly never[] = [];

export const TRACK_HEIGHT = "h-10";

export function keyLabel(legId: string | null, index: number, count: number, key: LegKey | BodyKey, cycleFrames: number, fps: number): string {
  const frame = Math.round(key.t * cycleFrames);
  const when = `frame ${frame} (${Math.round(msOfFrame(frame, fps))} ms)`;
  if (legId === null) return `Body key ${index + 1} of ${count}, ${when}`;
  const contact = (key as LegKey).contact === "swing" ? "lift-off" : "touch-down";
  return `${legId} key ${index + 1} of ${count}, ${contact} at ${when}`;
}

export const TrackLane = memo(function TrackLane({ legId, legIndex }: { legId: string | null; legIndex: number }) {
  const keys = useEditor((state) => (legId === null ? state.sequence.body.keys : (state.sequence.legs[legId]?.keys ?? EMPTY))) as readonly (LegKey | BodyKey)[];
  const preview = useEditor((state) => state.preview);
  const cycleFrames = useEditor((state) => state.cycleFrames);
  const fps = useEditor((state) => state.sequence.fps);
  const selectedIndex = useEditor((state) => (state.selection && state.selection.legId === legId ? state.selection.index : -1));
  const readOnly = useEditor((state) => state.readOnly);
  const select = useEditor((state) => state.select);
  const setFrame = useEditor((state) => state.setFrame);
  const focusLeg = useEditor((state) => state.focusLeg);
  const addKeyAtPlayhead = useEditor((state) => state.addKeyAtPlayhead);

  const bars = useMemo(() => (preview && legId !== null ? stanceRuns(preview, legId) : EMPTY), [preview, legId]);
  const runs = useMemo(
    () => (preview ? flagRuns(preview.flags).filter((run) => (legId === null ? run.leg === undefined : run.leg === legId)) : EMPTY),
    [preview, legId],
  );
  const onSelect = useCallback((ref: KeyRef) => select(ref), [select]);

  const frameAt = (event: React.MouseEvent<HTMLDivElement>) => {
    const box = event.currentTarget.getBoundingClientRect();
    return Math.round(((event.clientX - box.left) / box.width) * cycleFrames);
  };

  return (
    <div
      className={`relative ${TRACK_HEIGHT} border-b border-line`}
      data-track={legId ?? "body"}
      onClick={(event) => {
        if (event.target !== event.currentTarget) return;
        setFrame(frameAt(event));
        if (legId !== null) focusLeg(legId);
      }}
      onDoubleClick={(event) => {
        if (event.target !== event.currentTarget || readOnly) return;
        setFrame(frameAt(event));
        addKeyAtPlayhead(legId);
      }}
    >
      {legId !== null ? (
        <svg aria-hidden className="pointer-events-none absolute inset-x-0 top-1.5 h-5 w-full" viewBox={`0 0 ${cycleFrames} 1`} preserveAspectRatio="none">
          <rect x={0} y={0} width={cycleFrames} height={1} className="fill-sunken" />
          {bars.map(([from, to]) => (
            <rect key={from} x={from} y={0} width={to - from} height={1} className={legFill(legIndex)} data-stance={`${from}-${to}`} />
          ))}
        </svg>
      ) : (
        <div aria-hidden className="pointer-events-none absolute inset-x-0 top-3 h-0 border-t border-dashed border-line" />
      )}
      {keys.map((key, index) => (
        <KeyMarker
          key={index}
          keyRef={{ legId, index }}
          t={key.t}
          contact={legId === null ? undefined : (key as LegKey).contact}
          legIndex={legIndex}
          label={keyLabel(legId, index, keys.length, key, cycleFrames, fps)}
          selected={index === selectedIndex}
          disabled={readOnly}
          onSelect={onSelect}
        />
      ))}
      <FlagLane runs={runs} cycleFrames={cycleFrames} onJump={setFrame} />
    </div>
  );
});
