// pulse-range (error): the servo angle asks for a pulse outside the servo's
// minUs..maxUs; the table holds the clamped pulse.
import { JOINT_NAMES, pulseToAngle } from "../../kinematics/index";
import type { Flag } from "../solved";
import { formatNumber, type Check } from "./check";

export const pulseRangeCheck: Check = {
  kind: "pulse-range",
  run({ state }) {
    const flags: Flag[] = [];
    const perFrame = state.legCount * 3;
    const { pulseClamped } = state;
    for (let index = 0; index < state.frameCount * perFrame; index += 1) {
      if (!pulseClamped[index]) continue;
      const frame = Math.floor(index / perFrame);
      const i = index - frame * perFrame;
      const spec = state.joints[i];
      const value = state.angles[index];
      const { servo } = spec.joint;
      // The servo angle where the pulse range ends on the side that was passed.
      const atMin = pulseToAngle(spec.joint, servo.minUs);
      const atMax = pulseToAngle(spec.joint, servo.maxUs);
      const low = Math.min(atMin, atMax);
      const high = Math.max(atMin, atMax);
      const limit = value > high ? high : low;
      const limitUs = limit === atMax ? servo.maxUs : servo.minUs;
      flags.push({
        frame,
        leg: spec.legId,
        joint: JOINT_NAMES[i % 3],
        kind: "pulse-range",
        value,
        limit,
        severity: "error",
        message: `${spec.legId} ${spec.name} at ${formatNumber(value)}° at frame ${frame} needs a pulse outside ${formatNumber(servo.minUs, 0)}–${formatNumber(servo.maxUs, 0)} µs (the range ends at ${formatNumber(limit)}°); clamped to ${formatNumber(limitUs, 0)} µs`,
      });
    }
    return flags;
  },
};
