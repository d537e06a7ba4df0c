// Playback: while playing, the playhead advances with the clock at the
// sequence's frame rate times the playback speed, one store update per
// animation frame at most; at the end it loops or stops.
import { useEffect } from "react";
import { useEditor, useEditorStore } from "~/stores/editor-context";

export function usePlayback() {
  const store = useEditorStore();
  const playing = useEditor((state) => state.playing);
  useEffect(() => {
    if (!playing) return;
    let raf = 0;
    let last = performance.now();
    let carried = 0;
    const tick = (now: number) => {
      const state = store.getState();
      carried += ((now - last) / 1000) * state.sequence.fps * state.playbackRate;
      last = now;
      const whole = Math.floor(carried);
      if (whole > 0) {
        carried -= whole;
        const next = state.frame + whole;
        if (next < state.solvedFrames) state.setFrame(next);
        else if (state.loopPlayback) state.setFrame(next % state.solvedFrames);
        else {
          state.setFrame(state.solvedFrames - 1);
          state.setPlaying(false);
          return;
        }
      }
      raf = requestAnimationFrame(tick);
    };
    raf = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(raf);
  }, [playing, store]);
}
