// What each kind of check flag is called wherever a person reads it: the
// editor's Checks list and timeline, a version's facts and flag table, and the
// comparison of two versions. One word for one kind everywhere, so a flag
// found in the editor is the same thing in review. Pure: components import it.
import type { FlagKind } from "../../gait/index";

/** The name of a kind of flag, for lists, tables and titles. */
export const FLAG_LABELS: Record<FlagKind, string> = {
  unreachable: "Out of reach",
  "joint-limit": "Joint past its limit",
  "joint-speed": "Joint too fast",
  "pulse-range": "Pulse out of range",
  "ground-penetration": "Foot below the ground",
  "foot-slip": "Foot slips",
  "support-count": "Too few feet down",
  "com-outside": "Centre of mass outside support",
  "low-margin": "Low stability margin",
  "leg-clearance": "Legs too close",
  "loop-jump": "Jump at the loop seam",
};

/** A word short enough to sit on the timeline beside the flag's mark. */
export const FLAG_TAGS: Record<FlagKind, string> = {
  unreachable: "reach",
  "joint-limit": "limit",
  "joint-speed": "speed",
  "pulse-range": "pulse",
  "ground-penetration": "ground",
  "foot-slip": "slip",
  "support-count": "feet",
  "com-outside": "CoM",
  "low-margin": "margin",
  "leg-clearance": "clear",
  "loop-jump": "seam",
};
