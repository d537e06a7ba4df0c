// Issue 16, item 5: flag badges on a dense timeline stay readable — each tag
// whole, none on top of another; the runs a badge stands for are counted on it.
import { expect, test } from "vitest";
import type { Flag } from "~/gait";
import { badgeText, badgeWidthPx, layoutFlagBadges } from "~/features/gaits/editor/flag-badges";
import { flagRuns } from "~/features/gaits/editor/flag-runs";

const flag = (frame: number, kind: Flag["kind"], joint?: Flag["joint"], severity: Flag["severity"] = "error"): Flag => ({
  frame,
  kind,
  leg: "LF",
  joint,
  severity,
  value: 0,
  limit: 0,
  message: `${kind} at ${frame}`,
});

test("badges never overlap and never end past the lane, at any lane width", () => {
  // One-frame runs of three kinds every other frame: the densest a track gets.
  const flags: Flag[] = [];
  for (let frame = 0; frame < 60; frame += 2)
    flags.push(flag(frame, "joint-limit", "femur"), flag(frame, "joint-speed", "tibia"), flag(frame, "leg-clearance"));
  const runs = flagRuns(flags);
  for (const lanePx of [240, 480, 720, 1100]) {
    const badges = layoutFlagBadges(runs, 60, lanePx);
    const shown = badges.reduce((sum, badge) => sum + 1 + badge.hidden.length, 0);
    expect(shown, `${lanePx} px: every run is on a badge`).toBe(runs.length);
    badges.forEach((badge, index) => {
      expect(badge.widthPx, `${lanePx} px: badge ${index} is as wide as its text`).toBe(badgeWidthPx(badgeText(badge)));
      expect(badge.leftPx, `${lanePx} px: badge ${index} starts in the lane`).toBeGreaterThanOrEqual(0);
      expect(badge.leftPx + badge.widthPx, `${lanePx} px: badge ${index} ends in the lane`).toBeLessThanOrEqual(lanePx);
      const next = badges[index + 1];
      if (next) expect(next.leftPx, `${lanePx} px: badge ${index + 1} starts after badge ${index} ends`).toBeGreaterThanOrEqual(badge.leftPx + badge.widthPx);
    });
  }
});

test("a badge reads its glyph, its whole tag and how many more runs it stands for; an error among them makes it an error", () => {
  const runs = flagRuns([flag(10, "low-margin", undefined, "warning"), flag(11, "joint-limit", "femur"), flag(40, "unreachable")]);
  const [first, second] = layoutFlagBadges(runs, 60, 300);
  expect(badgeText(first)).toBe("◆ margin +1");
  expect(first.severity).toBe("error");
  expect(first.hidden.map((run) => run.kind)).toEqual(["joint-limit"]);
  expect(badgeText(second)).toBe("▲ reach");
  // Wide enough (a frame is 100 px), each run has its own badge.
  expect(layoutFlagBadges(runs, 60, 6000).map(badgeText)).toEqual(["◆ margin", "▲ limit", "▲ reach"]);
});
