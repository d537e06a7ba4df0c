// What a version's review state is called wherever a person reads it: badges
// and filters, the export page's choices, and the sentences of a refusal.
// Pure, so components, services and the API document share it.
import type { VersionState } from "../../../db/schema";

export const STATE_LABELS: Record<VersionState, string> = {
  committed: "Committed",
  "in-review": "In review",
  "sent-back": "Sent back",
  approved: "Approved",
  released: "Released",
  retired: "Retired",
};

/** Every state in the order of a version's life: the filter's choices, the API's enum. */
export const VERSION_STATES = Object.keys(STATE_LABELS) as [VersionState, ...VersionState[]];

/** The state inside a sentence: "Version 3 is sent back now". */
export const stateWord = (state: VersionState) => STATE_LABELS[state].toLowerCase();
