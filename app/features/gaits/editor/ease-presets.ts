// Named easing curves of our own for a key's segment (cubic-Bézier
// [x1, y1, x2, y2] as CSS writes them; "Soft" is CSS `ease`, "Cushioned" `ease-in-out`).
import type { Ease } from "../../../gait/index";

export const EASE_PRESETS: readonly { name: string; ease: Ease; hint: string }[] = [
  { name: "Steady", ease: [0, 0, 1, 1], hint: "constant speed" },
  { name: "Soft", ease: [0.25, 0.1, 0.25, 1], hint: "quick start, gentle finish (the default)" },
  { name: "Cushioned", ease: [0.42, 0, 0.58, 1], hint: "gentle at both ends" },
  { name: "Quick lift", ease: [0.1, 0.7, 0.3, 1], hint: "most of the way early" },
  { name: "Slow start", ease: [0.6, 0, 0.4, 1], hint: "holds back, then catches up" },
];

export const presetOf = (ease: readonly number[]) =>
  EASE_PRESETS.find((preset) => preset.ease.every((value, index) => Math.abs(value - ease[index]) < 1e-6)) ?? null;

const round = (value: number) => Math.round(value * 1000) / 1000;

/** A control point dragged anywhere: x kept in [0, 1] so the curve stays a function of time, y in a sane range. */
export function clampEase(ease: readonly number[]): Ease {
  const clampX = (value: number) => round(Math.min(1, Math.max(0, value)));
  const clampY = (value: number) => round(Math.min(2, Math.max(-1, value)));
  return [clampX(ease[0]), clampY(ease[1]), clampX(ease[2]), clampY(ease[3])];
}
