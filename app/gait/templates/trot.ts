// Trot: the diagonal pairs of a four-legged robot alternate, duty factor 1/2.
// Only two feet are down at a time, so the gait is dynamic: its static
// support flags are warnings (DESIGN.md).
import { cycleFraction, requireLegsPerSide, type GaitTemplate } from "./template";

export const trot: GaitTemplate = {
  name: "trot",
  dynamic: true,
  unsuitable: (layout) => requireLegsPerSide(layout, 2, "trot"),
  defaultDutyFactor: () => 1 / 2,
  phase(layout) {
    const phase: Record<string, number> = {};
    layout.left.forEach((legId, row) => (phase[legId] = cycleFraction(row % 2 === 0 ? 0 : 1 / 2)));
    layout.right.forEach((legId, row) => (phase[legId] = cycleFraction(row % 2 === 0 ? 1 / 2 : 0)));
    return phase;
  },
};
