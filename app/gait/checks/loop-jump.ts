// loop-jump (warning): in a loop, the step from the last frame back to the
// first turns a joint faster than its maxSpeedDegS. Reported at frame 0.
import { JOINT_NAMES } from "../../kinematics/index";
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const loopJumpCheck: Check = {
  kind: "loop-jump",
  run({ state }) {
    const flags: Flag[] = [];
    if (!state.loop || state.frameCount < 2) return flags;
    const last = (state.frameCount - 1) * state.legCount * 3;
    for (let i = 0; i < state.legCount * 3; i += 1) {
      const jump = Math.abs(state.angles[i] - state.angles[last + i]);
      const speed = jump * state.fps;
      const spec = state.joints[i];
      if (speed <= spec.maxSpeedDegS) continue;
      flags.push({
        frame: 0,
        leg: spec.legId,
        joint: JOINT_NAMES[i % 3],
        kind: "loop-jump",
        value: speed,
        limit: spec.maxSpeedDegS,
        severity: "warning",
        message: `${spec.legId} ${spec.name} jumps ${formatNumber(jump)}° from the last frame (${state.frameCount - 1}) back to frame 0, ${formatNumber(speed, 0)} °/s, limit ${formatNumber(spec.maxSpeedDegS, 0)} °/s`,
      });
    }
    return flags;
  },
};
