// Custom: any robot, with the phase of every leg and the duty factor given
// explicitly in the parameters.
import type { GaitTemplate } from "./template";

export const custom: GaitTemplate = {
  name: "custom",
  dynamic: false,
  unsuitable: () => null,
  defaultDutyFactor: () => null,
  phase: () => ({}),
};
