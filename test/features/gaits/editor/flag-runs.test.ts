// Flags grouped into runs: the same kind, leg and joint on consecutive frames.
import { expect, test } from "vitest";
import type { Flag } from "~/gait";
import { flagRuns, framesText, runPlace } from "~/features/gaits/editor/flag-runs";

const flag = (frame: number, kind: Flag["kind"], leg?: string, joint?: Flag["joint"], severity: Flag["severity"] = "error"): Flag => ({
  frame,
  kind,
  leg,
  joint,
  severity,
  value: 0,
  limit: 0,
  message: `${kind} at ${frame}`,
});

test("consecutive frames join, a gap starts a new run, legs and joints stay apart; runs in frame order", () => {
  const flags = [
    flag(3, "unreachable", "LF"),
    flag(4, "unreachable", "LF"),
    flag(4, "joint-limit", "LF", "femur"),
    flag(5, "unreachable", "LF"),
    flag(5, "joint-limit", "LF", "tibia"),
    flag(7, "unreachable", "LF"),
    flag(8, "low-margin", undefined, undefined, "warning"),
  ];
  const runs = flagRuns(flags);
  expect(runs.map((run) => [run.kind, runPlace(run), framesText(run), run.count])).toEqual([
    ["unreachable", "LF", "frames 3–5", 3],
    ["joint-limit", "LF femur", "frame 4", 1],
    ["joint-limit", "LF tibia", "frame 5", 1],
    ["unreachable", "LF", "frame 7", 1],
    ["low-margin", "body", "frame 8", 1],
  ]);
  expect(flagRuns(flags)).toBe(runs);
});
