// A version's flags grouped by kind (and leg and joint), with the frames they
// fall on written as ranges: what a reviewer reads instead of hundreds of rows. Pure.
import type { Flag, FlagKind, Severity } from "../../gait/index";

export type FlagGroup = {
  kind: FlagKind;
  severity: Severity;
  leg?: string;
  joint?: string;
  count: number;
  /** "3–7, 12, 40–44" */
  frames: string;
  /** The worst flag's message (largest |value − limit|). */
  example: string;
};

/** Consecutive frame numbers as ranges: [1, 2, 3, 7] → "1–3, 7". */
export function frameRanges(frames: readonly number[]): string {
  const sorted = [...new Set(frames)].sort((x, y) => x - y);
  const parts: string[] = [];
  let start = sorted[0];
  let previous = sorted[0];
  for (const frame of sorted.slice(1).concat(Number.NaN)) {
    if (frame === previous + 1) {
      previous = frame;
      continue;
    }
    if (start !== undefined) parts.push(start === previous ? `${start}` : `${start}–${previous}`);
    start = frame;
    previous = frame;
  }
  return parts.join(", ");
}

/** Errors first, then by count, largest first. */
export function groupFlags(flags: readonly Flag[]): FlagGroup[] {
  const groups = new Map<string, { flags: Flag[] }>();
  for (const flag of flags) {
    const key = `${flag.kind}|${flag.leg ?? ""}|${flag.joint ?? ""}|${flag.severity}`;
    const group = groups.get(key) ?? { flags: [] };
    group.flags.push(flag);
    groups.set(key, group);
  }
  return [...groups.values()]
    .map(({ flags: members }): FlagGroup => {
      const worst = members.reduce((best, flag) => (Math.abs(flag.value - flag.limit) > Math.abs(best.value - best.limit) ? flag : best));
      return {
        kind: members[0].kind,
        severity: members[0].severity,
        leg: members[0].leg,
        joint: members[0].joint,
        count: members.length,
        frames: frameRanges(members.map((flag) => flag.frame)),
        example: worst.message,
      };
    })
    .sort((x, y) => (x.severity === y.severity ? y.count - x.count : x.severity === "error" ? -1 : 1));
}
