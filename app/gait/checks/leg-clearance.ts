// leg-clearance (warning): the feet of neighbouring legs on one side (rows r
// and r + 1) closer than the clearance, where the table's angles put them.
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const legClearanceCheck: Check = {
  kind: "leg-clearance",
  run({ state }) {
    const flags: Flag[] = [];
    const { achievedWorld: w, legCount, neighbours } = state;
    const clearance = state.options.clearanceMm;
    for (let frame = 0; frame < state.frameCount; frame += 1) {
      const base = frame * legCount;
      for (const [a, b] of neighbours) {
        const pa = (base + a) * 3;
        const pb = (base + b) * 3;
        const dx = w[pa] - w[pb];
        const dy = w[pa + 1] - w[pb + 1];
        const dz = w[pa + 2] - w[pb + 2];
        // Math.sqrt, not Math.hypot: this runs for every neighbour pair of every frame.
        const distance = Math.sqrt(dx * dx + dy * dy + dz * dz);
        if (distance >= clearance) continue;
        const legA = state.legIds[a];
        const legB = state.legIds[b];
        flags.push({
          frame,
          leg: legA,
          kind: "leg-clearance",
          value: distance,
          limit: clearance,
          severity: "warning",
          message: `${legA} and ${legB} feet ${formatNumber(distance)} mm apart at frame ${frame}, clearance ${formatNumber(clearance)} mm`,
        });
      }
    }
    return flags;
  },
};
