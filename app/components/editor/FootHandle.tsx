// The selected key's foot in the top view, to drag to a new place (or move
// with the arrow keys: 1 mm, 10 mm with Shift; up is forward, left is left).
// A grab cursor and a tooltip say so on hover, a dashed ring shows keyboard
// focus, and the view's caption says it in words while a handle is shown.
// Only keys that place the foot get a handle: during a stance the foot stays
// where it touched down, so a lift-off key's foot follows from the stance.
import { useRef } from "react";
import type { ViewFrame } from "~/components/robot-view";
import type { LegKey } from "~/gait";
import { poseApply, poseUnapply, type Vec3 } from "~/kinematics";
import { bodyOffsetAt, plannedFoot } from "~/features/gaits/editor/body-offset";
import { keyAt, keyPlacesFoot } from "~/features/gaits/editor/key-edits";
import { useEditor, useEditorStore } from "~/stores/editor-context";

export function FootHandle({ view }: { view: ViewFrame }) {
  const store = useEditorStore();
  const selection = useEditor((state) => state.selection);
  const sequence = useEditor((state) => state.sequence);
  const preview = useEditor((state) => state.preview);
  const readOnly = useEditor((state) => state.readOnly);
  const drag = useRef<{ pointerId: number; raf: number; pending: Vec3 | null } | null>(null);

  if (!selection || selection.legId === null || readOnly || !keyPlacesFoot(sequence, selection)) return null;
  const key = keyAt(sequence, selection) as LegKey | undefined;
  if (!key) return null;
  const legId = selection.legId;
  const cycleFrames = store.getState().cycleFrames;
  const offset = bodyOffsetAt(sequence, key.t);
  const frameIndex = Math.round(key.t * cycleFrames) % (sequence.loop ? cycleFrames : Infinity);
  const neutralFoot = key.foot ?? (preview ? plannedFoot(sequence, preview, legId, frameIndex, cycleFrames) : undefined);
  if (!neutralFoot) return null;
  // Keys hold feet in the neutral body frame; the view draws the moved body frame.
  const moved = poseUnapply(offset, neutralFoot);
  const [x, y] = view.toScreen(moved[0], moved[1]);

  const footAt = (event: React.PointerEvent<SVGElement>): Vec3 | null => {
    const svg = event.currentTarget.ownerSVGElement;
    const matrix = svg?.getScreenCTM();
    if (!svg || !matrix) return null;
    const point = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    return poseApply(offset, [view.vertical.invert(point.y), view.horizontal.invert(point.x), moved[2]]);
  };
  const apply = () => {
    const state = drag.current;
    if (!state?.pending) return;
    store.getState().setKeyFoot(selection, state.pending);
    state.pending = null;
  };
  const nudge = (dx: number, dy: number) => store.getState().setKeyFoot(selection, poseApply(offset, [moved[0] + dx, moved[1] + dy, moved[2]]));
  const mm = (value: number) => Math.round(value);
  const hint = `Drag the ${legId} foot, or use the arrow keys: 1 mm, 10 mm with Shift (up is forward).`;

  return (
    <g
      role="button"
      tabIndex={0}
      aria-label={`Foot of the selected ${legId} key: x ${mm(neutralFoot[0])} mm, y ${mm(neutralFoot[1])} mm. Drag it, or use the arrow keys (Shift: 10 mm).`}
      data-testid="foot-handle"
      style={{ pointerEvents: "all", cursor: drag.current ? "grabbing" : "grab", touchAction: "none" }}
      // The SVG group draws its own focus ring (the outer dashed circle), as an outline does not follow its shape.
      className="group outline-none"
      onPointerDown={(event) => {
        event.preventDefault();
        event.currentTarget.setPointerCapture(event.pointerId);
        store.getState().beginGesture();
        drag.current = { pointerId: event.pointerId, raf: 0, pending: null };
      }}
      onPointerMove={(event) => {
        const state = drag.current;
        if (!state || state.pointerId !== event.pointerId) return;
        const foot = footAt(event);
        if (!foot) return;
        const first = state.pending === null;
        state.pending = foot;
        if (first) state.raf = requestAnimationFrame(apply);
      }}
      onPointerUp={() => {
        if (!drag.current) return;
        cancelAnimationFrame(drag.current.raf);
        apply();
        drag.current = null;
        store.getState().endGesture();
      }}
      onPointerCancel={() => {
        drag.current = null;
        store.getState().cancelGesture();
      }}
      onKeyDown={(event) => {
        const step = event.shiftKey ? 10 : 1;
        const moves: Record<string, [number, number]> = { ArrowUp: [step, 0], ArrowDown: [-step, 0], ArrowLeft: [0, step], ArrowRight: [0, -step] };
        const move = moves[event.key];
        if (!move || event.altKey || event.ctrlKey || event.metaKey) return;
        event.preventDefault();
        nudge(move[0], move[1]);
      }}
    >
      <title>{hint}</title>
      <circle cx={x} cy={y} r={17} className="fill-none stroke-ink opacity-0 group-focus-visible:opacity-100" strokeWidth={2} strokeDasharray="4 3" />
      <circle cx={x} cy={y} r={11} className="fill-accent stroke-ink" fillOpacity={0.2} strokeWidth={1.5} />
      <circle cx={x} cy={y} r={3} className="fill-accent" />
      <path d={`M${x - 16},${y} h6 M${x + 10},${y} h6 M${x},${y - 16} v6 M${x},${y + 10} v6`} className="stroke-accent" strokeWidth={1.5} />
    </g>
  );
}
