// foot-slip (error): a foot in stance in this frame and the one before that
// moved in the world by more than the tolerance, measured where the table's
// angles put it (a planned stance never moves; a leg that could not follow
// its plan does). The seam of a loop compares frame N − 1 with frame 0 moved
// on by one cycle of travel, and is reported at frame 0.
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const footSlipCheck: Check = {
  kind: "foot-slip",
  run({ state }) {
    const flags: Flag[] = [];
    const { achievedWorld: w, stance, legCount, frameCount, cycleTravel: travel } = state;
    const tolerance = state.options.slipToleranceMm;
    const firstFrame = state.loop && frameCount > 1 ? 0 : 1;
    for (let frame = firstFrame; frame < frameCount; frame += 1) {
      const seam = frame === 0;
      const previous = seam ? frameCount - 1 : frame - 1;
      for (let leg = 0; leg < legCount; leg += 1) {
        const here = frame * legCount + leg;
        const before = previous * legCount + leg;
        if (!stance[here] || !stance[before]) continue;
        let x = w[here * 3];
        let y = w[here * 3 + 1];
        if (seam) {
          const wx = x;
          x = travel.cos * wx - travel.sin * y + travel.x;
          y = travel.sin * wx + travel.cos * y + travel.y;
        }
        const dx = x - w[before * 3];
        const dy = y - w[before * 3 + 1];
        const dz = w[here * 3 + 2] - w[before * 3 + 2];
        const moved = Math.sqrt(dx * dx + dy * dy + dz * dz);
        if (moved <= tolerance) continue;
        const legId = state.legIds[leg];
        flags.push({
          frame,
          leg: legId,
          kind: "foot-slip",
          value: moved,
          limit: tolerance,
          severity: "error",
          message: `${legId} stance foot slips ${formatNumber(moved)} mm at frame ${frame}${seam ? " (from the last frame round to the first)" : ""}, tolerance ${formatNumber(tolerance)} mm`,
        });
      }
    }
    return flags;
  },
};
