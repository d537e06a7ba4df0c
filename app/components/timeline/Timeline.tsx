// The Timeline: the gait diagram with one track per leg (left side front to
// back, then right) and one for the body, the key markers, the flags, the
// ruler and the playhead. Keys are dragged with @dnd-kit: snapped to frames,
// to tenths of a frame while Shift is held; the whole drag is one undo step.
import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type Announcements,
  type DragMoveEvent,
  type DragStartEvent,
  type KeyboardCoordinateGetter,
} from "@dnd-kit/core";
import { useCallback, useEffect, useId, useMemo, useRef } from "react";
import { Panel } from "~/components/common/Panel";
import { legBackground } from "~/components/robot-view";
import { legLayout } from "~/gait";
import { keyAt } from "~/features/gaits/editor/key-edits";
import { FINE_STEPS_PER_FRAME } from "~/features/gaits/editor/timing";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import type { KeyRef } from "~/stores/editor-store";
import { KeyTools } from "./KeyTools";
import { PlayheadLine, TimeRuler } from "./TimeRuler";
import { TRACK_HEIGHT, TrackLane } from "./TrackRow";

type DragState = { ref: KeyRef; startT: number; widthPx: number; pendingT: number | null; raf: number };

const refOf = (data: unknown): KeyRef | null => (data && typeof data === "object" && "ref" in data ? (data.ref as KeyRef) : null);

export function Timeline() {
  const store = useEditorStore();
  const robot = useEditor((state) => state.robot);
  const focusLegId = useEditor((state) => state.focusLegId);
  const focusLeg = useEditor((state) => state.focusLeg);
  const tracks = useMemo(() => {
    const layout = legLayout(robot);
    const ordered = [...layout.left, ...layout.right, ...layout.legIds.filter((id) => !layout.left.includes(id) && !layout.right.includes(id))];
    return ordered.map((legId) => ({ legId, legIndex: robot.legs.findIndex((leg) => leg.id === legId) }));
  }, [robot]);

  const lanes = useRef<HTMLDivElement>(null);
  const drag = useRef<DragState | null>(null);
  const fine = useRef(false);
  useEffect(() => {
    const track = (event: KeyboardEvent | PointerEvent) => (fine.current = event.shiftKey);
    window.addEventListener("keydown", track);
    window.addEventListener("keyup", track);
    window.addEventListener("pointermove", track);
    return () => {
      window.removeEventListener("keydown", track);
      window.removeEventListener("keyup", track);
      window.removeEventListener("pointermove", track);
    };
  }, []);

  // Keyboard drags move a frame per arrow press (a tenth with Shift).
  const keyboardStep = useCallback<KeyboardCoordinateGetter>(
    (event, { currentCoordinates }) => {
      const { cycleFrames } = store.getState();
      const width = lanes.current?.getBoundingClientRect().width ?? 600;
      const step = width / cycleFrames / (event.shiftKey ? FINE_STEPS_PER_FRAME : 1);
      if (event.code === "ArrowRight") return { ...currentCoordinates, x: currentCoordinates.x + step };
      if (event.code === "ArrowLeft") return { ...currentCoordinates, x: currentCoordinates.x - step };
      return undefined;
    },
    [store],
  );

  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(KeyboardSensor, { coordinateGetter: keyboardStep }),
  );

  const flush = () => {
    const state = drag.current;
    if (!state || state.pendingT === null) return;
    cancelAnimationFrame(state.raf);
    store.getState().moveKey(state.ref, state.pendingT, fine.current);
    state.pendingT = null;
  };

  const onDragStart = ({ active }: DragStartEvent) => {
    const ref = refOf(active.data.current);
    if (!ref) return;
    const key = keyAt(store.getState().sequence, ref);
    if (!key) return;
    store.getState().select(ref);
    store.getState().beginGesture();
    drag.current = { ref, startT: key.t, widthPx: lanes.current?.getBoundingClientRect().width ?? 1, pendingT: null, raf: 0 };
  };

  const onDragMove = ({ delta }: DragMoveEvent) => {
    const state = drag.current;
    if (!state) return;
    const first = state.pendingT === null;
    state.pendingT = state.startT + delta.x / state.widthPx;
    // One solve per animation frame however fast the pointer moves.
    if (first) state.raf = requestAnimationFrame(flush);
  };

  const finish = (cancelled: boolean) => {
    if (!cancelled) flush();
    else if (drag.current) cancelAnimationFrame(drag.current.raf);
    drag.current = null;
    if (cancelled) store.getState().cancelGesture();
    else store.getState().endGesture();
  };

  const describe = (data: unknown) => {
    const ref = refOf(data);
    const state = store.getState();
    const key = ref ? keyAt(state.sequence, ref) : undefined;
    if (!ref || !key) return "the key";
    return `${ref.legId ?? "body"} key at frame ${Math.round(key.t * state.cycleFrames)}`;
  };
  const announcements: Announcements = {
    onDragStart: ({ active }) =>
      `Picked up ${describe(active.data.current)}. Left and right arrows move it a frame, Shift for a tenth; Space drops it, Escape puts it back.`,
    onDragMove: ({ active }) => `Moved to ${describe(active.data.current)}.`,
    onDragOver: () => undefined,
    onDragEnd: ({ active }) => `Dropped: ${describe(active.data.current)}.`,
    onDragCancel: ({ active }) => `Put back: ${describe(active.data.current)}.`,
  };

  const dndId = useId();
  return (
    <Panel title="Timeline" layout="flex flex-wrap items-center gap-x-4 gap-y-2" className="[contain:layout_style]" tools={<KeyTools />}>
      <DndContext
        id={dndId}
        sensors={sensors}
        onDragStart={onDragStart}
        onDragMove={onDragMove}
        onDragEnd={() => finish(false)}
        onDragCancel={() => finish(true)}
        accessibility={{
          announcements,
          screenReaderInstructions: {
            draggable: "To move a key in time, press Space, then the left and right arrows; Space again to drop it, Escape to put it back.",
          },
        }}
      >
        <div className="flex px-3 pt-1 pb-3">
          <div className="w-16 shrink-0 pr-2">
            <div className="h-8" />
            {tracks.map(({ legId, legIndex }) => (
              <div key={legId} className={`${TRACK_HEIGHT} flex items-center border-b border-line`}>
                <button
                  type="button"
                  aria-pressed={focusLegId === legId}
                  aria-label={`${legId}: show in the joint plots`}
                  onClick={() => focusLeg(legId)}
                  className={`flex items-center gap-1.5 rounded px-1 py-0.5 font-mono text-sm ${focusLegId === legId ? "bg-accent-soft font-semibold text-accent-strong" : "hover:bg-sunken"}`}
                >
                  <span aria-hidden className={`inline-block h-3 w-3 rounded-sm ${legBackground(legIndex)}`} />
                  {legId}
                </button>
              </div>
            ))}
            <div className={`${TRACK_HEIGHT} flex items-center border-b border-line px-1 text-sm font-medium`}>Body</div>
          </div>
          <div ref={lanes} className="relative min-w-0 flex-1" data-testid="timeline-lanes">
            <TimeRuler />
            {tracks.map(({ legId, legIndex }) => (
              <TrackLane key={legId} legId={legId} legIndex={legIndex} />
            ))}
            <TrackLane legId={null} legIndex={-1} />
            <PlayheadLine />
          </div>
        </div>
      </DndContext>
      <TimelineLegend />
    </Panel>
  );
}

function TimelineLegend() {
  const readOnly = useEditor((state) => state.readOnly);
  return (
    <p className="flex flex-wrap gap-x-4 gap-y-1 border-t border-line px-3 py-1.5 text-xs text-ink-muted">
      <span>
        <span aria-hidden className="mr-1 inline-block h-2.5 w-5 rounded-sm bg-leg-1 align-middle" />
        bar: foot on the ground (stance)
      </span>
      <span>
        <span aria-hidden className="mr-1 inline-block h-2.5 w-2.5 rotate-45 border-2 border-ink bg-surface align-middle" />
        lift-off key
      </span>
      <span>
        <span aria-hidden className="mr-1 inline-block h-2.5 w-2.5 rotate-45 border border-ink bg-leg-2 align-middle" />
        touch-down key
      </span>
      <span>
        <span aria-hidden className="mr-1 text-danger">
          ▲
        </span>
        error
      </span>
      <span>
        <span aria-hidden className="mr-1 text-warning">
          ◆
        </span>
        warning
      </span>
      {readOnly ? (
        <span>Click a key to see its details; your role cannot move keys.</span>
      ) : (
        <span>Drag keys to move them (Shift: tenths of a frame); double-click a track to add a key.</span>
      )}
    </p>
  );
}
