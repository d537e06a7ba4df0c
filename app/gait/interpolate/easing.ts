// Cubic-Bézier easing as CSS defines it (W3C CSS Easing Functions Level 1,
// cubic-bezier(x1, y1, x2, y2)), computed by the bezier-easing package. One
// function per distinct curve, made once and shared: a sequence uses few curves.
import bezier from "bezier-easing";
import type { Ease } from "../sequence";

export type EasingFunction = (fraction: number) => number;

const cache = new Map<string, EasingFunction>();

/** The easing function of a cubic-bezier [x1, y1, x2, y2]; x1 and x2 must lie in [0, 1]. */
export function easingFor(ease: Readonly<Ease>): EasingFunction {
  const key = `${ease[0]},${ease[1]},${ease[2]},${ease[3]}`;
  let easing = cache.get(key);
  if (!easing) {
    easing = bezier(ease[0], ease[1], ease[2], ease[3]);
    if (cache.size > 256) cache.clear();
    cache.set(key, easing);
  }
  return easing;
}
