// joint-speed (error): |Δangle| · fps between a frame and the one before above
// the joint's maxSpeedDegS (DESIGN.md). The seam of a loop is loop-jump's.
import { JOINT_NAMES } from "../../kinematics/index";
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const jointSpeedCheck: Check = {
  kind: "joint-speed",
  run({ state }) {
    const flags: Flag[] = [];
    const { angles, fps, joints } = state;
    const perFrame = state.legCount * 3;
    for (let frame = 1; frame < state.frameCount; frame += 1) {
      const here = frame * perFrame;
      for (let i = 0; i < perFrame; i += 1) {
        const speed = Math.abs(angles[here + i] - angles[here + i - perFrame]) * fps;
        const spec = joints[i];
        if (speed <= spec.maxSpeedDegS) continue;
        flags.push({
          frame,
          leg: spec.legId,
          joint: JOINT_NAMES[i % 3],
          kind: "joint-speed",
          value: speed,
          limit: spec.maxSpeedDegS,
          severity: "error",
          message: `${spec.legId} ${spec.name} turns ${formatNumber(speed, 0)} °/s at frame ${frame}, limit ${formatNumber(spec.maxSpeedDegS, 0)} °/s`,
        });
      }
    }
    return flags;
  },
};
