// support-count (error for static gaits, warning for dynamic ones): fewer than
// three feet down, so there is no support polygon to stand on. Frames where
// the body rests on the ground are skipped.
import type { Flag } from "../solved";
import { supportSeverity, type Check } from "./check";

export const MIN_SUPPORT_FEET = 3;

export const supportCountCheck: Check = {
  kind: "support-count",
  run({ state }) {
    const flags: Flag[] = [];
    const severity = supportSeverity(state);
    for (let frame = 0; frame < state.frameCount; frame += 1) {
      const count = state.stanceCount[frame];
      if (state.resting[frame] || count >= MIN_SUPPORT_FEET) continue;
      flags.push({
        frame,
        kind: "support-count",
        value: count,
        limit: MIN_SUPPORT_FEET,
        severity,
        message: `${count} ${count === 1 ? "foot" : "feet"} on the ground at frame ${frame}, at least ${MIN_SUPPORT_FEET} needed for static support`,
      });
    }
    return flags;
  },
};
