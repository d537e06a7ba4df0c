// Both robot views side by side, driven by one clock: play, pause, step and
// scrub move A and B together. "Same phase" plays both through their cycles
// at A's pace, so the same moment of each gait lines up; "Real time" plays
// each at its own cycle time, as the robot would.
import { startTransition, useEffect, useMemo, useRef, useState } from "react";
import { RobotViews } from "~/components/robot-view";
import type { Robot } from "~/kinematics";
import { frameAt, syncedFractions, type Playback, type SyncMode } from "~/features/compare";

export type PlaybackSide = { label: string; robot: Robot; playback: Playback };

function SideView({ side, fraction }: { side: PlaybackSide; fraction: number }) {
  const index = frameAt(side.playback, fraction);
  const frame = side.playback.frames[index];
  const bodyPose = useMemo(() => (frame ? { x: 0, y: 0, z: 0, roll: frame.rollDeg, pitch: frame.pitchDeg, yaw: 0 } : undefined), [frame]);
  if (!frame) return null;
  return (
    <section aria-label={`Robot views of ${side.label}`} className="min-w-0 space-y-2">
      <h3 className="flex items-baseline justify-between gap-2 text-sm font-semibold">
        <span>{side.label}</span>
        <span className="font-mono text-xs font-normal text-ink-muted tabular-nums">
          frame {index} / {side.playback.frames.length} · margin {frame.marginMm === null ? "—" : `${frame.marginMm.toFixed(1)} mm`} · down{" "}
          {frame.stance.join(" ") || "none"}
        </span>
      </h3>
      <RobotViews robot={side.robot} angles={frame.angles} bodyPose={bodyPose} bodyHeightMm={frame.heightMm} showReach={false} compact />
    </section>
  );
}

export function ComparePlayback({ a, b, onFraction }: { a: PlaybackSide; b: PlaybackSide; onFraction?: (fraction: number) => void }) {
  const [timeMs, setTimeMs] = useState(0);
  const [playing, setPlaying] = useState(false);
  const [mode, setMode] = useState<SyncMode>("phase");
  const [speed, setSpeed] = useState(1);
  const last = useRef<number | null>(null);
  const cycleA = a.playback.cycleMs;
  const cycleB = b.playback.cycleMs;
  const period = mode === "phase" ? cycleA : Math.max(cycleA, cycleB);

  useEffect(() => {
    if (!playing) {
      last.current = null;
      return;
    }
    let handle = 0;
    const tick = (now: number) => {
      if (last.current !== null) {
        const elapsed = (now - last.current) * speed;
        // A transition, like the router's navigations: an urgent update every
        // animation frame would keep interrupting the next page's render.
        startTransition(() => setTimeMs((current) => (current + elapsed) % (cycleA * cycleB)));
      }
      last.current = now;
      handle = requestAnimationFrame(tick);
    };
    handle = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(handle);
  }, [playing, speed, cycleA, cycleB]);

  const [fractionA, fractionB] = syncedFractions(timeMs, mode, cycleA, cycleB);
  useEffect(() => onFraction?.(fractionA), [fractionA, onFraction]);
  const stepMs = 1000 / a.playback.fps;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3 rounded-lg border border-line bg-surface px-3 py-2 text-sm" role="group" aria-label="Playback">
        <button
          type="button"
          onClick={() => setPlaying((value) => !value)}
          className="min-w-20 rounded-md bg-accent px-3 py-1 font-medium text-on-accent hover:bg-accent-strong"
        >
          {playing ? "Pause" : "Play"}
        </button>
        <button
          type="button"
          aria-label="Step back one frame"
          onClick={() => setTimeMs((value) => Math.max(0, value - stepMs))}
          className="rounded-md border border-line px-2 py-1 hover:bg-sunken"
        >
          ◀︎
        </button>
        <button
          type="button"
          aria-label="Step forward one frame"
          onClick={() => setTimeMs((value) => value + stepMs)}
          className="rounded-md border border-line px-2 py-1 hover:bg-sunken"
        >
          ▶︎
        </button>
        <label className="flex min-w-48 flex-1 items-center gap-2">
          <span className="text-ink-muted">Time</span>
          <input
            type="range"
            min={0}
            max={period}
            step={1}
            value={timeMs % period}
            onChange={(event) => setTimeMs(Number(event.target.value))}
            className="flex-1"
            aria-valuetext={`${Math.round(timeMs % period)} ms`}
          />
          <span className="w-16 text-right font-mono tabular-nums">{Math.round(timeMs % period)} ms</span>
        </label>
        <label className="flex items-center gap-1">
          <span className="text-ink-muted">Sync</span>
          <select value={mode} onChange={(event) => setMode(event.target.value as SyncMode)} className="rounded-md border border-line bg-canvas px-2 py-1">
            <option value="phase">Same phase</option>
            <option value="time">Real time</option>
          </select>
        </label>
        <label className="flex items-center gap-1">
          <span className="text-ink-muted">Speed</span>
          <select value={speed} onChange={(event) => setSpeed(Number(event.target.value))} className="rounded-md border border-line bg-canvas px-2 py-1">
            <option value={0.25}>¼×</option>
            <option value={0.5}>½×</option>
            <option value={1}>1×</option>
          </select>
        </label>
      </div>
      <div className="grid gap-4 xl:grid-cols-2">
        <SideView side={a} fraction={fractionA} />
        <SideView side={b} fraction={fractionB} />
      </div>
    </div>
  );
}
