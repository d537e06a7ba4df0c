// A cubic-Bézier easing curve with its two control points to drag (or move
// with the arrow keys: 0.01, 0.1 with Shift). Time runs right, progress up.
import { useRef } from "react";
import type { Ease } from "~/gait";
import { clampEase } from "~/features/gaits/editor/ease-presets";

const SIZE = 160;
const PAD = 20;
const SPAN = SIZE - 2 * PAD;

const toScreen = (x: number, y: number): [number, number] => [PAD + x * SPAN, SIZE - PAD - y * SPAN];

export type BezierEditorProps = {
  ease: Ease;
  disabled?: boolean;
  /** Called while a point moves (a gesture) and at the end. */
  onChange: (ease: Ease) => void;
  onGestureStart?: () => void;
  onGestureEnd?: () => void;
};

export function BezierEditor({ ease, disabled, onChange, onGestureStart, onGestureEnd }: BezierEditorProps) {
  const svg = useRef<SVGSVGElement>(null);
  const dragging = useRef<0 | 1 | null>(null);
  const [x1, y1, x2, y2] = ease;
  const [ax, ay] = toScreen(0, 0);
  const [bx, by] = toScreen(1, 1);
  const [p1x, p1y] = toScreen(x1, y1);
  const [p2x, p2y] = toScreen(x2, y2);

  const pointAt = (event: React.PointerEvent): [number, number] | null => {
    const matrix = svg.current?.getScreenCTM();
    if (!matrix) return null;
    const point = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    return [(point.x - PAD) / SPAN, (SIZE - PAD - point.y) / SPAN];
  };
  const move = (which: 0 | 1, x: number, y: number) => {
    const next = [...ease];
    next[which * 2] = x;
    next[which * 2 + 1] = y;
    onChange(clampEase(next));
  };

  const handle = (which: 0 | 1, cx: number, cy: number) => (
    <circle
      cx={cx}
      cy={cy}
      r={7}
      role="slider"
      tabIndex={disabled ? -1 : 0}
      aria-label={which === 0 ? "First control point (leaving the key)" : "Second control point (arriving at the next key)"}
      aria-valuemin={0}
      aria-valuemax={1}
      aria-valuenow={ease[which * 2]}
      aria-valuetext={`time ${ease[which * 2].toFixed(2)}, progress ${ease[which * 2 + 1].toFixed(2)}; arrow keys move it`}
      aria-disabled={disabled || undefined}
      className={`${which === 0 ? "fill-accent" : "fill-surface"} stroke-accent outline-none focus-visible:stroke-ink`}
      strokeWidth={2}
      style={{ cursor: disabled ? "default" : "grab", touchAction: "none" }}
      onPointerDown={(event) => {
        if (disabled) return;
        event.currentTarget.setPointerCapture(event.pointerId);
        dragging.current = which;
        onGestureStart?.();
      }}
      onPointerMove={(event) => {
        if (dragging.current !== which) return;
        const point = pointAt(event);
        if (point) move(which, point[0], point[1]);
      }}
      onPointerUp={() => {
        if (dragging.current === null) return;
        dragging.current = null;
        onGestureEnd?.();
      }}
      onKeyDown={(event) => {
        if (disabled) return;
        const step = event.shiftKey ? 0.1 : 0.01;
        const deltas: Record<string, [number, number]> = { ArrowRight: [step, 0], ArrowLeft: [-step, 0], ArrowUp: [0, step], ArrowDown: [0, -step] };
        const delta = deltas[event.key];
        if (!delta) return;
        event.preventDefault();
        move(which, ease[which * 2] + delta[0], ease[which * 2 + 1] + delta[1]);
      }}
    />
  );

  return (
    <svg ref={svg} viewBox={`0 0 ${SIZE} ${SIZE}`} className="h-40 w-40 shrink-0 rounded border border-line bg-sunken" aria-label="Easing curve" role="group">
      <rect x={PAD} y={PAD} width={SPAN} height={SPAN} className="fill-surface stroke-line" />
      <text x={PAD} y={SIZE - 6} className="fill-ink-muted text-[9px]">
        time →
      </text>
      <text x={4} y={PAD - 6} className="fill-ink-muted text-[9px]">
        ↑ progress
      </text>
      <line x1={ax} y1={ay} x2={p1x} y2={p1y} className="stroke-accent" strokeWidth={1} />
      <line x1={bx} y1={by} x2={p2x} y2={p2y} className="stroke-accent" strokeWidth={1} />
      <path d={`M${ax},${ay} C${p1x},${p1y} ${p2x},${p2y} ${bx},${by}`} className="fill-none stroke-ink" strokeWidth={2} />
      {handle(0, p1x, p1y)}
      {handle(1, p2x, p2y)}
    </svg>
  );
}
