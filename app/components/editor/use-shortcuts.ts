// The editor's keyboard shortcuts (app/features/gaits/editor/shortcuts.ts) on the whole
// page, except while typing in a field or when a control has already used the
// key (a dragged key, the playhead slider, a foot handle).
import { useEffect } from "react";
import { legLayout } from "~/gait";
import { shortcutFor } from "~/features/gaits/editor/shortcuts";
import { useEditorStore } from "~/stores/editor-context";

const typing = (target: EventTarget | null) =>
  target instanceof HTMLElement && (target.isContentEditable || ["INPUT", "SELECT", "TEXTAREA"].includes(target.tagName));

export function useShortcuts(openHelp: () => void) {
  const store = useEditorStore();
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (event.defaultPrevented || typing(event.target)) return;
      // A key being dragged by keyboard owns the arrows, Space and Escape until it is dropped.
      if (store.getState().gesture) return;
      if (document.querySelector("dialog[open]")) return;
      const shortcut = shortcutFor(event);
      if (!shortcut) return;
      // Space and Enter on a button press the button.
      if (shortcut.action === "play" && event.target instanceof HTMLElement && event.target.closest("button, [role=button], a, summary")) return;
      const state = store.getState();
      const run: Record<typeof shortcut.action, () => void> = {
        play: state.togglePlaying,
        "frame-back": () => state.stepFrame(-1),
        "frame-forward": () => state.stepFrame(1),
        "frames-back": () => state.stepFrame(-10),
        "frames-forward": () => state.stepFrame(10),
        "first-frame": () => state.setFrame(0),
        "last-frame": () => state.setFrame(state.solvedFrames - 1),
        "add-key": () => state.addKeyAtPlayhead(state.focusLegId),
        "add-body-key": () => state.addKeyAtPlayhead(null),
        duplicate: state.duplicateSelected,
        delete: state.deleteSelected,
        "key-earlier": () => state.nudgeSelected(-1),
        "key-later": () => state.nudgeSelected(1),
        mirror: () => state.mirrorLeg(state.selection?.legId ?? state.focusLegId),
        loop: () => state.setLoopPlayback(!state.loopPlayback),
        deselect: () => state.select(null),
        undo: state.undo,
        redo: state.redo,
        help: openHelp,
        "focus-leg": () => {
          const layout = legLayout(state.robot);
          const legId = [...layout.left, ...layout.right][shortcut.leg ?? 0];
          if (legId) state.focusLeg(legId);
        },
      };
      event.preventDefault();
      run[shortcut.action]();
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, [store, openHelp]);
}
