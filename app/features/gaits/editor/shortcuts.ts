// The editor's keyboard shortcuts, our own choice: one table that the key
// handler reads and the help dialog lists.

export type ShortcutAction =
  | "play"
  | "frame-back"
  | "frame-forward"
  | "frames-back"
  | "frames-forward"
  | "first-frame"
  | "last-frame"
  | "add-key"
  | "add-body-key"
  | "duplicate"
  | "delete"
  | "key-earlier"
  | "key-later"
  | "mirror"
  | "loop"
  | "deselect"
  | "undo"
  | "redo"
  | "help"
  | "focus-leg";

export type KeyPress = { key: string; shiftKey: boolean; ctrlKey: boolean; metaKey: boolean; altKey: boolean };

export const SHORTCUTS: readonly { keys: string; does: string }[] = [
  { keys: "Space", does: "Play or pause" },
  { keys: "← / →", does: "Step one frame back or forward (with Shift: ten)" },
  { keys: "Home / End", does: "First or last frame" },
  { keys: "A", does: "Add a key to the focused leg at the playhead" },
  { keys: "B", does: "Add a body key at the playhead" },
  { keys: "D", does: "Duplicate the selected key" },
  { keys: "Delete or Backspace", does: "Delete the selected key" },
  { keys: "[ / ]", does: "Move the selected key one frame earlier or later" },
  { keys: "M", does: "Mirror the focused leg onto the other side" },
  { keys: "1 … 8", does: "Focus a leg (in Timeline order) for the joint plots" },
  { keys: "L", does: "Loop playback on or off" },
  { keys: "Escape", does: "Clear the selection" },
  { keys: "Ctrl+Z (⌘Z)", does: "Undo" },
  { keys: "Ctrl+Shift+Z or Ctrl+Y (⌘⇧Z)", does: "Redo" },
  { keys: "?", does: "Show this list" },
  { keys: "Space, ←/→, Space on a key", does: "Pick up a key, move it a frame at a time (Shift: tenths), drop it; Escape puts it back" },
];

/** What a key press asks for, or null; `leg` is the 0-based track for focus-leg. */
export function shortcutFor(press: KeyPress): { action: ShortcutAction; leg?: number } | null {
  const command = press.ctrlKey || press.metaKey;
  const key = press.key;
  if (command && !press.altKey) {
    if (key.toLowerCase() === "z") return { action: press.shiftKey ? "redo" : "undo" };
    if (key.toLowerCase() === "y") return { action: "redo" };
    return null;
  }
  if (press.altKey || command) return null;
  switch (key) {
    case " ":
      return { action: "play" };
    case "ArrowLeft":
      return { action: press.shiftKey ? "frames-back" : "frame-back" };
    case "ArrowRight":
      return { action: press.shiftKey ? "frames-forward" : "frame-forward" };
    case "Home":
      return { action: "first-frame" };
    case "End":
      return { action: "last-frame" };
    case "Delete":
    case "Backspace":
      return { action: "delete" };
    case "[":
      return { action: "key-earlier" };
    case "]":
      return { action: "key-later" };
    case "Escape":
      return { action: "deselect" };
    case "?":
      return { action: "help" };
  }
  const letter = key.toLowerCase();
  if (letter === "a") return { action: "add-key" };
  if (letter === "b") return { action: "add-body-key" };
  if (letter === "d") return { action: "duplicate" };
  if (letter === "m") return { action: "mirror" };
  if (letter === "l") return { action: "loop" };
  if (/^[1-8]$/.test(key)) return { action: "focus-leg", leg: Number(key) - 1 };
  return null;
}
