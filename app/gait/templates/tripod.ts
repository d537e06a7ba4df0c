// Tripod: two alternating sets of three legs (front and rear of one side with
// the middle of the other), duty factor 1/2 (Song and Waldron, Machines That Walk, 1989).
import { alternatingSetsPhase, requireLegsPerSide, type GaitTemplate } from "./template";

export const tripod: GaitTemplate = {
  name: "tripod",
  dynamic: false,
  unsuitable: (layout) => requireLegsPerSide(layout, 3, "tripod"),
  defaultDutyFactor: () => 1 / 2,
  phase: alternatingSetsPhase,
};
