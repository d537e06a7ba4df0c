// ground-penetration (error): a foot, where the table's angles put it, below
// the ground plane z = 0 by more than the tolerance.
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const groundPenetrationCheck: Check = {
  kind: "ground-penetration",
  run({ state }) {
    const flags: Flag[] = [];
    const tolerance = state.options.groundToleranceMm;
    const { achievedWorld, legCount } = state;
    for (let slot = 0; slot < state.frameCount * legCount; slot += 1) {
      const depth = -achievedWorld[slot * 3 + 2];
      if (depth <= tolerance) continue;
      const frame = Math.floor(slot / legCount);
      const legId = state.legIds[slot - frame * legCount];
      flags.push({
        frame,
        leg: legId,
        kind: "ground-penetration",
        value: depth,
        limit: tolerance,
        severity: "error",
        message: `${legId} foot ${formatNumber(depth)} mm below the ground at frame ${frame}`,
      });
    }
    return flags;
  },
};
