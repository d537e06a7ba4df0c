// Alternating tetrapod for eight legs: two sets of four (rows 0 and 2 of one
// side with rows 1 and 3 of the other) alternate, duty factor 1/2: the
// eight-legged counterpart of the tripod.
import { alternatingSetsPhase, requireLegsPerSide, type GaitTemplate } from "./template";

export const alternatingTetrapod: GaitTemplate = {
  name: "alternating-tetrapod",
  dynamic: false,
  unsuitable: (layout) => requireLegsPerSide(layout, 4, "alternating-tetrapod"),
  defaultDutyFactor: () => 1 / 2,
  phase: alternatingSetsPhase,
};
