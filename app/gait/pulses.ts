// Servo angle → pulse width for the whole table without an object per value:
// the same mapping as the kinematics' angleToPulse (us = centerUs ± usPerDeg ·
// servoDeg, the sign flipped when reversed, clamped to minUs..maxUs), with the
// servo constants laid out once per solve in typed arrays. The functions are
// small enough to be inlined into the frame loop. test/gait/pulses.test.ts
// holds this equal to angleToPulse.
import type { Joint } from "../kinematics/index";

export type PulseTable = { centerUs: Float64Array; signedUsPerDeg: Float64Array; minUs: Float64Array; maxUs: Float64Array };

export function createPulseTable(joints: readonly Pick<Joint, "servo">[]): PulseTable {
  return {
    centerUs: Float64Array.from(joints, (joint) => joint.servo.centerUs),
    signedUsPerDeg: Float64Array.from(joints, (joint) => (joint.servo.reversed ? -joint.servo.usPerDeg : joint.servo.usPerDeg)),
    minUs: Float64Array.from(joints, (joint) => joint.servo.minUs),
    maxUs: Float64Array.from(joints, (joint) => joint.servo.maxUs),
  };
}

/** The pulse (µs) joint `index` needs for `servoDeg`, before clamping. */
export function rawPulseUs(table: PulseTable, index: number, servoDeg: number): number {
  return table.centerUs[index] + table.signedUsPerDeg[index] * servoDeg;
}

/** The pulse clamped to the servo's range: what a table holds. It differs from the raw pulse exactly when clamped. */
export function clampPulseUs(table: PulseTable, index: number, us: number): number {
  const min = table.minUs[index];
  const max = table.maxUs[index];
  return us < min ? min : us > max ? max : us;
}
