// The flags a joint's plot marks: the joint's own (past its limit, too fast,
// pulse out of range) and its leg's that name no joint (out of reach, foot
// slips …), one per frame and kind. The editor's joint plots and the
// comparison's overlays mark the same ones. Pure.
import type { Flag, FlagKind, Severity } from "../../gait/index";
import type { JointName } from "../../kinematics/index";

export type FlaggedFrame = { frame: number; kind: FlagKind; severity: Severity };

export function jointFlags(flags: readonly Flag[], legId: string, joint: JointName): FlaggedFrame[] {
  const seen = new Set<string>();
  const out: FlaggedFrame[] = [];
  for (const flag of flags) {
    if (flag.leg !== legId || (flag.joint !== undefined && flag.joint !== joint)) continue;
    const key = `${flag.frame}|${flag.kind}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ frame: flag.frame, kind: flag.kind, severity: flag.severity });
  }
  return out;
}
