// joint-limit (error): a solved servo angle outside the joint's minDeg..maxDeg.
import { JOINT_NAMES, SOLVE_COXA_LIMIT, SOLVE_FEMUR_LIMIT, SOLVE_TIBIA_LIMIT, SOLVE_UNREACHABLE } from "../../kinematics/index";
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

const LIMIT_BITS = [SOLVE_COXA_LIMIT, SOLVE_FEMUR_LIMIT, SOLVE_TIBIA_LIMIT];
const ANY_LIMIT = SOLVE_COXA_LIMIT | SOLVE_FEMUR_LIMIT | SOLVE_TIBIA_LIMIT;

export const jointLimitCheck: Check = {
  kind: "joint-limit",
  run({ state }) {
    const flags: Flag[] = [];
    const { legCount, status } = state;
    for (let slot = 0; slot < state.frameCount * legCount; slot += 1) {
      // An unreachable leg keeps earlier angles: its limits are those angles', checked when they were solved.
      if ((status[slot] & ANY_LIMIT) === 0 || status[slot] & SOLVE_UNREACHABLE) continue;
      const frame = Math.floor(slot / legCount);
      const leg = slot - frame * legCount;
      for (let j = 0; j < 3; j += 1) {
        if ((status[slot] & LIMIT_BITS[j]) === 0) continue;
        const spec = state.joints[leg * 3 + j];
        const value = state.angles[slot * 3 + j];
        const above = value > spec.maxDeg;
        const limit = above ? spec.maxDeg : spec.minDeg;
        flags.push({
          frame,
          leg: spec.legId,
          joint: JOINT_NAMES[j],
          kind: "joint-limit",
          value,
          limit,
          severity: "error",
          message: `${spec.legId} ${spec.name} at ${formatNumber(value)}° at frame ${frame}, ${above ? "above its maximum" : "below its minimum"} ${formatNumber(limit)}°`,
        });
      }
    }
    return flags;
  },
};
