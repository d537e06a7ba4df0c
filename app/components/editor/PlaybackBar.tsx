// Playback: play and pause, step a frame either way, loop, and the speed.
import { msOfFrame } from "~/features/gaits/editor/timing";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import { PLAYBACK_RATES } from "~/stores/editor-store";

const button = "rounded-md border border-line px-2 py-1 text-sm hover:bg-sunken aria-pressed:bg-accent-soft aria-pressed:text-accent-strong";

function FrameReadout() {
  const frame = useEditor((state) => state.frame);
  const solvedFrames = useEditor((state) => state.solvedFrames);
  const fps = useEditor((state) => state.sequence.fps);
  return (
    <p className="numeric min-w-44 font-mono text-sm" data-testid="frame-readout">
      frame {frame} / {solvedFrames - 1} · {Math.round(msOfFrame(frame, fps))} ms
    </p>
  );
}

export function PlaybackBar() {
  const store = useEditorStore();
  const playing = useEditor((state) => state.playing);
  const loopPlayback = useEditor((state) => state.loopPlayback);
  const rate = useEditor((state) => state.playbackRate);
  const actions = store.getState();
  return (
    <div role="group" aria-label="Playback" className="flex flex-wrap items-center gap-2 rounded-lg border border-line bg-surface px-3 py-2 [contain:content]">
      <h2 className="sr-only">Playback</h2>
      <button type="button" className={button} onClick={() => actions.stepFrame(-1)} aria-label="Step back one frame">
        <span aria-hidden>◀︎|</span>
      </button>
      <button type="button" className={`${button} min-w-20 font-medium`} onClick={actions.togglePlaying} aria-label={playing ? "Pause" : "Play"}>
        {playing ? "❚❚ Pause" : "▶︎ Play"}
      </button>
      <button type="button" className={button} onClick={() => actions.stepFrame(1)} aria-label="Step forward one frame">
        <span aria-hidden>|▶︎</span>
      </button>
      <button type="button" className={button} aria-pressed={loopPlayback} onClick={() => actions.setLoopPlayback(!loopPlayback)}>
        Loop
      </button>
      <label className="flex items-center gap-1 text-sm">
        <span>Speed</span>
        <select
          value={rate}
          onChange={(event) => actions.setPlaybackRate(Number(event.currentTarget.value))}
          className="rounded-md border border-line bg-surface px-1 py-1 text-sm"
          aria-label="Playback speed"
        >
          {PLAYBACK_RATES.map((value) => (
            <option key={value} value={value}>
              {value}×
            </option>
          ))}
        </select>
      </label>
      <FrameReadout />
    </div>
  );
}
