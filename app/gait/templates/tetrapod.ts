// Tetrapod: three pairs of diagonal legs, one on each side, lift in turn, so
// four feet are always down; duty factor 2/3 (common practice, from memory).
// On each side the legs lift from the back forwards, a third of a cycle apart,
// the right side a third of a cycle behind the left: pairs (left rear, right
// front), (left middle, right rear), (left front, right middle).
import { cycleFraction, requireLegsPerSide, type GaitTemplate } from "./template";

export const tetrapod: GaitTemplate = {
  name: "tetrapod",
  dynamic: false,
  unsuitable: (layout) => requireLegsPerSide(layout, 3, "tetrapod"),
  defaultDutyFactor: () => 2 / 3,
  phase(layout) {
    const phase: Record<string, number> = {};
    layout.left.forEach((legId, row) => (phase[legId] = cycleFraction((2 - row) / 3)));
    layout.right.forEach((legId, row) => (phase[legId] = cycleFraction((3 - row) / 3)));
    return phase;
  },
};
