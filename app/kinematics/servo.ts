// Servo angle ↔ PWM pulse width (DESIGN.md, "Robot definition"):
// us = centerUs ± usPerDeg·servoDeg, the sign flipped when the servo is reversed.
import type { Joint } from "./robot";

export type PulseWidth = {
  /** Pulse width in µs, clamped to the servo's minUs..maxUs and not rounded. */
  us: number;
  /** True when the angle asked for a pulse outside minUs..maxUs. */
  clamped: boolean;
};

/** Pulse width (µs) that turns the joint's servo to `servoDeg`. */
export function angleToPulse(joint: Pick<Joint, "servo">, servoDeg: number): PulseWidth {
  const { servo } = joint;
  const us = servo.centerUs + (servo.reversed ? -servo.usPerDeg : servo.usPerDeg) * servoDeg;
  if (us < servo.minUs) return { us: servo.minUs, clamped: true };
  if (us > servo.maxUs) return { us: servo.maxUs, clamped: true };
  return { us, clamped: false };
}

/** Servo degrees for a pulse width (µs); the inverse of angleToPulse inside minUs..maxUs. */
export function pulseToAngle(joint: Pick<Joint, "servo">, us: number): number {
  const { servo } = joint;
  return (us - servo.centerUs) / (servo.reversed ? -servo.usPerDeg : servo.usPerDeg);
}
