import { describe, expect, it } from "vitest";
import type { Flag } from "~/gait/index";
import { frameRanges, groupFlags } from "~/features/compare";

const flag = (frame: number, kind: Flag["kind"], severity: Flag["severity"], extra: Partial<Flag> = {}): Flag => ({
  frame,
  kind,
  severity,
  value: 1,
  limit: 0,
  message: `${kind} at ${frame}`,
  ...extra,
});

describe("flag groups", () => {
  it("writes consecutive frames as ranges", () => {
    expect(frameRanges([7, 1, 2, 3, 3, 12])).toBe("1–3, 7, 12");
    expect(frameRanges([])).toBe("");
  });

  it("groups by kind, leg and joint, errors first, the worst flag's message as the example", () => {
    const groups = groupFlags([
      flag(1, "low-margin", "warning"),
      flag(2, "low-margin", "warning"),
      flag(3, "low-margin", "warning"),
      flag(5, "joint-speed", "error", { leg: "LF", joint: "femur", value: 310, limit: 300, message: "slightly fast" }),
      flag(6, "joint-speed", "error", { leg: "LF", joint: "femur", value: 420, limit: 300, message: "far too fast" }),
    ]);
    expect(groups).toEqual([
      { kind: "joint-speed", severity: "error", leg: "LF", joint: "femur", count: 2, frames: "5–6", example: "far too fast" },
      { kind: "low-margin", severity: "warning", leg: undefined, joint: undefined, count: 3, frames: "1–3", example: "low-margin at 1" },
    ]);
  });
});
