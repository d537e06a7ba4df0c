// Where the timeline's flag badges go: each at its run's first frame, as wide
// as its text (never cut), and none on top of another. A badge that would
// start before the previous one ends joins it instead, and the badge counts
// the runs it stands for ("▲ limit +2"); its title lists them all, and the
// Checks list has each one. Pure: the lane's width in pixels comes from the
// component.
import type { Severity } from "../../../gait/index";
import { FLAG_TAGS } from "../flag-labels";
import type { FlagRun } from "./flag-runs";

export const SEVERITY_GLYPH = { error: "▲", warning: "◆" } as const;

/** Room a badge of 10 px text takes: generous per character (capitals, wide letters) so no text is ever clipped. */
const CHARACTER_PX = 6.5;
const PADDING_PX = 8;
/** Space kept between two badges. */
const GAP_PX = 3;

export type FlagBadge = {
  /** The run the badge is placed by. */
  run: FlagRun;
  /** The runs it stands for as well, in frame order. */
  hidden: FlagRun[];
  /** An error if any of its runs is one. */
  severity: Severity;
  leftPx: number;
  widthPx: number;
};

/** "▲ limit", "◆ margin +2". */
export function badgeText(badge: Pick<FlagBadge, "run" | "hidden">): string {
  const more = badge.hidden.length ? ` +${badge.hidden.length}` : "";
  return `${SEVERITY_GLYPH[badge.run.severity]} ${FLAG_TAGS[badge.run.kind]}${more}`;
}

export function badgeWidthPx(text: string): number {
  return Math.ceil(PADDING_PX + [...text].length * CHARACTER_PX);
}

const widthOf = (badge: Pick<FlagBadge, "run" | "hidden">) => badgeWidthPx(badgeText(badge));

const worse = (a: Severity, b: Severity): Severity => (a === "error" || b === "error" ? "error" : "warning");

export function layoutFlagBadges(runs: readonly FlagRun[], cycleFrames: number, lanePx: number): FlagBadge[] {
  // Left to right: a run whose frame lies under the badge before it joins that badge.
  const badges: FlagBadge[] = [];
  for (const run of runs) {
    const at = (run.fromFrame / cycleFrames) * lanePx;
    const last = badges[badges.length - 1];
    if (last && at < last.leftPx + last.widthPx + GAP_PX) {
      last.hidden.push(run);
      last.severity = worse(last.severity, run.severity);
      last.widthPx = widthOf(last);
      continue;
    }
    const badge: FlagBadge = { run, hidden: [], severity: run.severity, leftPx: at, widthPx: 0 };
    badge.widthPx = widthOf(badge);
    badges.push(badge);
  }
  // Right to left: each badge ends inside the lane and before the next starts; one with no room left joins the next.
  for (;;) {
    let right = lanePx;
    let merged = false;
    for (let index = badges.length - 1; index >= 0; index -= 1) {
      const badge = badges[index];
      badge.leftPx = Math.min(badge.leftPx, right - badge.widthPx);
      if (badge.leftPx < 0 && index + 1 < badges.length) {
        const next = badges[index + 1];
        badge.hidden.push(next.run, ...next.hidden);
        badge.severity = worse(badge.severity, next.severity);
        badge.widthPx = widthOf(badge);
        badges.splice(index + 1, 1);
        merged = true;
        break;
      }
      right = badge.leftPx - GAP_PX;
    }
    if (!merged) break;
  }
  // A lane narrower than one badge: it starts at the lane's start (the one case where a badge may run past the end).
  for (const badge of badges) badge.leftPx = Math.max(0, badge.leftPx);
  return badges;
}
