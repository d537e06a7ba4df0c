// com-outside (error for static gaits, warning for dynamic ones): the CoM's
// ground projection lies outside the support polygon (negative margin,
// McGhee and Frank 1968). Frames where the body rests on the ground are skipped.
import type { Flag } from "../solved";
import { formatNumber, supportSeverity, type Check } from "./check";

export const comOutsideCheck: Check = {
  kind: "com-outside",
  run({ state }) {
    const flags: Flag[] = [];
    const severity = supportSeverity(state);
    for (let frame = 0; frame < state.frameCount; frame += 1) {
      const margin = state.margin[frame];
      // NaN (fewer than three feet) fails the comparison and is skipped.
      if (state.resting[frame] || !(margin < 0)) continue;
      flags.push({
        frame,
        kind: "com-outside",
        value: margin,
        limit: 0,
        severity,
        message: `CoM ${formatNumber(-margin)} mm outside the support polygon at frame ${frame}`,
      });
    }
    return flags;
  },
};
