// Trot: the diagonal pairs of a four-legged robot alternate, duty factor 1/2.
// Only two feet are down at a time, so the gait is dynamic: its static
// support flags are warnings (DESIGN.md).
import { alternatingSetsPhase, requireLegsPerSide, type GaitTemplate } from "./template";

export const trot: GaitTemplate = {
  name: "trot",
  dynamic: true,
  unsuitable: (layout) => requireLegsPerSide(layout, 2, "trot"),
  defaultDutyFactor: () => 1 / 2,
  phase: alternatingSetsPhase,
};
