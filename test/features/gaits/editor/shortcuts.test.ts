// The shortcut table: what each key press asks for, and that the help list
// covers every action the handler knows.
import { expect, test } from "vitest";
import { SHORTCUTS, shortcutFor, type KeyPress } from "~/features/gaits/editor/shortcuts";

const press = (key: string, mods: Partial<KeyPress> = {}): KeyPress => ({ key, shiftKey: false, ctrlKey: false, metaKey: false, altKey: false, ...mods });

test("keys and what they do", () => {
  expect(shortcutFor(press(" "))).toEqual({ action: "play" });
  expect(shortcutFor(press("ArrowRight"))).toEqual({ action: "frame-forward" });
  expect(shortcutFor(press("ArrowLeft", { shiftKey: true }))).toEqual({ action: "frames-back" });
  expect(shortcutFor(press("A", { shiftKey: true }))).toEqual({ action: "add-key" });
  expect(shortcutFor(press("Backspace"))).toEqual({ action: "delete" });
  expect(shortcutFor(press("]"))).toEqual({ action: "key-later" });
  expect(shortcutFor(press("3"))).toEqual({ action: "focus-leg", leg: 2 });
  expect(shortcutFor(press("9"))).toBeNull();
  expect(shortcutFor(press("z", { ctrlKey: true }))).toEqual({ action: "undo" });
  expect(shortcutFor(press("z", { metaKey: true, shiftKey: true }))).toEqual({ action: "redo" });
  expect(shortcutFor(press("y", { ctrlKey: true }))).toEqual({ action: "redo" });
  expect(shortcutFor(press("?", { shiftKey: true }))).toEqual({ action: "help" });
  // The browser's and the system's own combinations are left alone.
  expect(shortcutFor(press("r", { ctrlKey: true }))).toBeNull();
  expect(shortcutFor(press("ArrowLeft", { altKey: true }))).toBeNull();
});

test("the help list names play, step, add key, undo and redo", () => {
  const text = SHORTCUTS.map((shortcut) => shortcut.does).join("\n");
  for (const words of ["Play or pause", "Step one frame", "Add a key", "Undo", "Redo"]) expect(text).toContain(words);
});
