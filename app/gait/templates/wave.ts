// Wave: legs lift one side at a time from the back forwards. With 2n legs and
// duty factor β the touch-downs of Song and Waldron's wave gait (Machines That
// Walk, 1989) are φ = F(i·β) for the left leg of row i (0 = front) and
// F(i·β + 1/2) for the right one; lift-off, our phase, comes β later. The
// default β = 1 − 1/(legs) leaves exactly one leg up at a time: 3/4 for four
// legs (the creeping or crawl gait), 5/6 for six, 7/8 for eight. Uneven sides
// lift one leg after another, right side first, back to front.
import { cycleFraction, type GaitTemplate } from "./template";

export const wave: GaitTemplate = {
  name: "wave",
  dynamic: false,
  unsuitable: (layout) => (layout.legIds.length >= 4 ? null : `wave needs at least 4 legs (this robot has ${layout.legIds.length})`),
  defaultDutyFactor: (layout) => 1 - 1 / layout.legIds.length,
  phase(layout, dutyFactor) {
    const phase: Record<string, number> = {};
    if (layout.left.length === layout.right.length) {
      layout.left.forEach((legId, row) => (phase[legId] = cycleFraction(row * dutyFactor + dutyFactor)));
      layout.right.forEach((legId, row) => (phase[legId] = cycleFraction(row * dutyFactor + 1 / 2 + dutyFactor)));
      return phase;
    }
    const order = [...[...layout.right].reverse(), ...[...layout.left].reverse()];
    order.forEach((legId, index) => (phase[legId] = cycleFraction(index / order.length)));
    return phase;
  },
};
