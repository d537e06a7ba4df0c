// Issue 16, item 5: the editor's check summary counts frames as frames and
// flags as flags ("10 frames with errors, 0 with warnings (14 flags)").
import { expect, test } from "vitest";
import type { Flag } from "~/gait";
import { checkSummary } from "~/features/gaits/editor/flag-runs";

const flag = (frame: number, kind: Flag["kind"], severity: Flag["severity"] = "error", leg?: string): Flag => ({
  frame,
  kind,
  leg,
  severity,
  value: 0,
  limit: 0,
  message: `${kind} at ${frame}`,
});

test("frames are counted once however many flags they hold; flags are counted as flags", () => {
  const flags = [
    flag(3, "unreachable", "error", "LF"),
    flag(3, "joint-limit", "error", "LF"),
    flag(3, "unreachable", "error", "RF"),
    flag(4, "unreachable", "error", "LF"),
    flag(4, "low-margin", "warning"),
    flag(9, "low-margin", "warning"),
  ];
  expect(checkSummary(flags)).toEqual({ errorFrames: 2, warningFrames: 2, flags: 6, text: "2 frames with errors, 2 with warnings (6 flags)" });
});

test("one of each reads in the singular; no flags reads as none", () => {
  expect(checkSummary([flag(0, "support-count")]).text).toBe("1 frame with errors, 0 with warnings (1 flag)");
  expect(checkSummary([flag(2, "low-margin", "warning")]).text).toBe("0 frames with errors, 1 with warnings (1 flag)");
  expect(checkSummary([]).text).toBe("no flags");
});
