// low-margin (warning): the static stability margin is at least 0 but below
// the threshold the user sets (default 10 mm).
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const lowMarginCheck: Check = {
  kind: "low-margin",
  run({ state }) {
    const flags: Flag[] = [];
    const threshold = state.options.marginThresholdMm;
    for (let frame = 0; frame < state.frameCount; frame += 1) {
      const margin = state.margin[frame];
      // NaN (fewer than three feet) fails both comparisons and is skipped.
      if (state.resting[frame] || !(margin >= 0 && margin < threshold)) continue;
      flags.push({
        frame,
        kind: "low-margin",
        value: margin,
        limit: threshold,
        severity: "warning",
        message: `stability margin ${formatNumber(margin)} mm at frame ${frame}, below ${formatNumber(threshold)} mm`,
      });
    }
    return flags;
  },
};
