// Flags grouped for people: the same kind on the same leg (and joint) over
// consecutive frames is one run ("LF unreachable, frames 12–20"), which is
// what the timeline draws and the Checks list shows.
import type { Flag, FlagKind, Severity } from "../../../gait/index";

export type FlagRun = {
  id: string;
  kind: FlagKind;
  severity: Severity;
  leg?: string;
  joint?: Flag["joint"];
  fromFrame: number;
  toFrame: number;
  count: number;
  /** The first flag's message; the run's other frames read the same with their own numbers. */
  message: string;
};

const cache = new WeakMap<readonly Flag[], FlagRun[]>();

export function flagRuns(flags: readonly Flag[]): FlagRun[] {
  const cached = cache.get(flags);
  if (cached) return cached;
  const open = new Map<string, FlagRun>();
  const runs: FlagRun[] = [];
  for (const flag of flags) {
    const group = `${flag.kind}|${flag.leg ?? ""}|${flag.joint ?? ""}`;
    const run = open.get(group);
    if (run && flag.frame <= run.toFrame + 1) {
      if (flag.frame > run.toFrame) run.toFrame = flag.frame;
      run.count += 1;
      if (flag.severity === "error") run.severity = "error";
      continue;
    }
    const next: FlagRun = {
      id: `${group}|${flag.frame}`,
      kind: flag.kind,
      severity: flag.severity,
      leg: flag.leg,
      joint: flag.joint,
      fromFrame: flag.frame,
      toFrame: flag.frame,
      count: 1,
      message: flag.message,
    };
    open.set(group, next);
    runs.push(next);
  }
  runs.sort((a, b) => a.fromFrame - b.fromFrame || (a.severity === b.severity ? 0 : a.severity === "error" ? -1 : 1));
  cache.set(flags, runs);
  return runs;
}

export const framesText = (run: Pick<FlagRun, "fromFrame" | "toFrame">) =>
  run.fromFrame === run.toFrame ? `frame ${run.fromFrame}` : `frames ${run.fromFrame}–${run.toFrame}`;

/** "LF femur" / "LF" / "body" — where a run belongs. */
export const runPlace = (run: Pick<FlagRun, "leg" | "joint">) => (run.leg ? `${run.leg}${run.joint ? ` ${run.joint}` : ""}` : "body");

/**
 * The Checks list's count: frames counted once however many flags they hold,
 * flags counted as flags — "10 frames with errors, 0 with warnings (14 flags)".
 * A frame with both an error and a warning counts in both.
 */
export function checkSummary(flags: readonly Flag[]): { errorFrames: number; warningFrames: number; flags: number; text: string } {
  const errorFrames = new Set<number>();
  const warningFrames = new Set<number>();
  for (const flag of flags) (flag.severity === "error" ? errorFrames : warningFrames).add(flag.frame);
  const counts = { errorFrames: errorFrames.size, warningFrames: warningFrames.size, flags: flags.length };
  if (flags.length === 0) return { ...counts, text: "no flags" };
  const text = `${counts.errorFrames} ${counts.errorFrames === 1 ? "frame" : "frames"} with errors, ${counts.warningFrames} with warnings (${counts.flags} ${counts.flags === 1 ? "flag" : "flags"})`;
  return { ...counts, text };
}
