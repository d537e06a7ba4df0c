// The time ruler, in frames and milliseconds, and the playhead: drag along
// the ruler to scrub, or focus it and use the arrow keys. Only the small
// parts that show the current frame subscribe to it.
import { memo, useEffect, useRef, useState } from "react";
import { msOfFrame } from "~/features/gaits/editor/timing";
import { useEditor } from "~/stores/editor-context";

const STEPS = [1, 2, 5, 10, 20, 25, 50, 100, 200, 250, 500, 1000, 2000, 5000, 10_000];

/** A tick step that gives at most `most` labelled ticks over the cycle. */
export function tickStep(cycleFrames: number, most = 8): number {
  return STEPS.find((step) => cycleFrames / step <= most) ?? Math.ceil(cycleFrames / most);
}

/** A label needs about this much room, px ("12000 ms" in 10 px mono). */
const LABEL_PX = 56;

const RulerTicks = memo(function RulerTicks({ cycleFrames, fps, widthPx }: { cycleFrames: number; fps: number; widthPx: number }) {
  const step = tickStep(cycleFrames, Math.max(2, Math.floor(widthPx / LABEL_PX)));
  const ticks: number[] = [];
  // The end of the cycle is the ruler's right edge; its label would crowd the last one.
  for (let frame = 0; frame < cycleFrames; frame += step) ticks.push(frame);
  return (
    <div aria-hidden className="pointer-events-none absolute inset-0">
      {ticks.map((frame) => (
        <div key={frame} className="absolute top-0 h-full border-l border-line" style={{ left: `${(frame / cycleFrames) * 100}%` }}>
          <span className="numeric absolute top-0.5 left-1 block font-mono text-[10px] leading-tight whitespace-nowrap text-ink">
            {frame}
            <span className="block text-ink-muted">{Math.round(msOfFrame(frame, fps))} ms</span>
          </span>
        </div>
      ))}
    </div>
  );
});

/** Keeps the pointer's moves coming while it is outside the ruler; a pointer the browser no longer tracks is simply not captured. */
function capture(event: React.PointerEvent<HTMLElement>) {
  try {
    event.currentTarget.setPointerCapture(event.pointerId);
  } catch {
    // Synthetic or already-released pointers cannot be captured; scrubbing still follows moves over the ruler.
  }
}

export function TimeRuler() {
  const cycleFrames = useEditor((state) => state.cycleFrames);
  const solvedFrames = useEditor((state) => state.solvedFrames);
  const fps = useEditor((state) => state.sequence.fps);
  const frame = useEditor((state) => state.frame);
  const setFrame = useEditor((state) => state.setFrame);
  const setPlaying = useEditor((state) => state.setPlaying);
  const scrubbing = useRef(false);
  const ruler = useRef<HTMLDivElement>(null);
  const [widthPx, setWidthPx] = useState(480);
  useEffect(() => {
    const element = ruler.current;
    if (!element || typeof ResizeObserver === "undefined") return;
    const observer = new ResizeObserver(([entry]) => setWidthPx(Math.round(entry.contentRect.width)));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  const frameAt = (element: HTMLElement, clientX: number) => {
    const box = element.getBoundingClientRect();
    return Math.round(((clientX - box.left) / box.width) * cycleFrames);
  };

  return (
    <div
      ref={ruler}
      role="slider"
      tabIndex={0}
      aria-label="Playhead"
      aria-valuemin={0}
      aria-valuemax={solvedFrames - 1}
      aria-valuenow={frame}
      aria-valuetext={`frame ${frame} of ${solvedFrames}, ${Math.round(msOfFrame(frame, fps))} ms`}
      data-testid="time-ruler"
      className="relative h-8 cursor-ew-resize touch-none border-b border-line bg-sunken select-none"
      onPointerDown={(event) => {
        capture(event);
        scrubbing.current = true;
        setPlaying(false);
        setFrame(frameAt(event.currentTarget, event.clientX));
      }}
      onPointerMove={(event) => {
        if (scrubbing.current) setFrame(frameAt(event.currentTarget, event.clientX));
      }}
      onPointerUp={() => (scrubbing.current = false)}
      onPointerCancel={() => (scrubbing.current = false)}
      onKeyDown={(event) => {
        const big = event.shiftKey ? 10 : 1;
        const moves: Record<string, number | undefined> = {
          ArrowLeft: frame - big,
          ArrowDown: frame - big,
          ArrowRight: frame + big,
          ArrowUp: frame + big,
          PageDown: frame - 10,
          PageUp: frame + 10,
          Home: 0,
          End: solvedFrames - 1,
        };
        const next = moves[event.key];
        if (next === undefined || event.altKey || event.ctrlKey || event.metaKey) return;
        event.preventDefault();
        setPlaying(false);
        setFrame(next);
      }}
    >
      <RulerTicks cycleFrames={cycleFrames} fps={fps} widthPx={widthPx} />
      <div
        aria-hidden
        className="pointer-events-none absolute -top-0.5 h-2 w-2 -translate-x-1/2 rotate-45 bg-accent"
        style={{ left: `${(frame / cycleFrames) * 100}%` }}
      />
    </div>
  );
}

/** The playhead line across the tracks. */
export function PlayheadLine() {
  const frame = useEditor((state) => state.frame);
  const cycleFrames = useEditor((state) => state.cycleFrames);
  return (
    <div
      aria-hidden
      data-testid="playhead"
      className="pointer-events-none absolute inset-y-0 z-20 w-0 border-l-2 border-accent"
      style={{ left: `${(frame / cycleFrames) * 100}%` }}
    />
  );
}
