// Ripple: on each side a wave from the back forwards, legs a third of a cycle
// apart, the two sides half a cycle apart; duty factor 3/4, so at most two
// legs are up at once and never two neighbours (common practice, from memory).
import { cycleFraction, requireLegsPerSide, type GaitTemplate } from "./template";

export const ripple: GaitTemplate = {
  name: "ripple",
  dynamic: false,
  unsuitable: (layout) => requireLegsPerSide(layout, 3, "ripple"),
  defaultDutyFactor: () => 3 / 4,
  phase(layout) {
    const phase: Record<string, number> = {};
    layout.left.forEach((legId, row) => (phase[legId] = cycleFraction((2 - row) / 3)));
    layout.right.forEach((legId, row) => (phase[legId] = cycleFraction((2 - row) / 3 + 1 / 2)));
    return phase;
  },
};
