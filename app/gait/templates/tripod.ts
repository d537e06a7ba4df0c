// Tripod: two alternating sets of three legs (front and rear of one side with
// the middle of the other), duty factor 1/2 (Song and Waldron, Machines That Walk, 1989).
import { cycleFraction, requireLegsPerSide, type GaitTemplate } from "./template";

export const tripod: GaitTemplate = {
  name: "tripod",
  dynamic: false,
  unsuitable: (layout) => requireLegsPerSide(layout, 3, "tripod"),
  defaultDutyFactor: () => 1 / 2,
  phase(layout) {
    const phase: Record<string, number> = {};
    layout.left.forEach((legId, row) => (phase[legId] = cycleFraction(row % 2 === 0 ? 0 : 1 / 2)));
    layout.right.forEach((legId, row) => (phase[legId] = cycleFraction(row % 2 === 0 ? 1 / 2 : 0)));
    return phase;
  },
};
