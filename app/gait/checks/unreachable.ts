// unreachable (error): no leg posture puts the foot on its planned point; the
// leg keeps its last reachable angles. The reason and distances come from the
// kinematics' own wording.
import { SOLVE_BEYOND_REACH, SOLVE_INSIDE_FOLD, SOLVE_UNREACHABLE, findLeg, type BodyPose } from "../../kinematics/index";
import type { Flag } from "../solved";
import type { Check } from "./check";

export const unreachableCheck: Check = {
  kind: "unreachable",
  run({ state }) {
    const flags: Flag[] = [];
    const { legCount, status } = state;
    const pose: BodyPose = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
    for (let slot = 0; slot < state.frameCount * legCount; slot += 1) {
      if ((status[slot] & SOLVE_UNREACHABLE) === 0) continue;
      const frame = Math.floor(slot / legCount);
      const leg = slot - frame * legCount;
      const legId = state.legIds[leg];
      const definition = findLeg(state.robot, legId);
      const o = frame * 6;
      pose.x = state.offsets[o];
      pose.y = state.offsets[o + 1];
      pose.z = state.offsets[o + 2];
      pose.roll = state.offsets[o + 3];
      pose.pitch = state.offsets[o + 4];
      pose.yaw = state.offsets[o + 5];
      state.solver.setBodyPose(pose);
      const t = slot * 3;
      const reason = state.solver
        .reason(leg, state.targetNeutral[t], state.targetNeutral[t + 1], state.targetNeutral[t + 2], status[slot])
        .replace(/^leg [^:]*: /, "");
      // value: the foot's distance from the femur joint (from the coxa axis when on it), limit: what the leg allows.
      const dx = state.targetBody[t] - definition.mount.x;
      const dy = state.targetBody[t + 1] - definition.mount.y;
      const radius = Math.hypot(dx, dy);
      const distance = Math.hypot(radius - definition.coxa, state.targetBody[t + 2] - definition.mount.z);
      const value = status[slot] & (SOLVE_BEYOND_REACH | SOLVE_INSIDE_FOLD) ? distance : radius;
      const limit =
        status[slot] & SOLVE_BEYOND_REACH
          ? definition.femur + definition.tibia
          : status[slot] & SOLVE_INSIDE_FOLD
            ? Math.abs(definition.femur - definition.tibia)
            : 1;
      flags.push({
        frame,
        leg: legId,
        kind: "unreachable",
        value,
        limit,
        severity: "error",
        message: `${legId} cannot reach its foot target at frame ${frame}: ${reason}; it keeps its last reachable angles`,
      });
    }
    state.solver.setBodyPose(undefined);
    return flags;
  },
};
