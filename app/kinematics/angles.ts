// Degree/radian helpers shared by the solver files.

export const DEG_PER_RAD = 180 / Math.PI;
export const RAD_PER_DEG = Math.PI / 180;

/**
 * The turn equal to `angleDeg` modulo 360° that lies within ±180° of `nearDeg`.
 * Servo angles are chosen near the middle of the joint's range, so a solve
 * never reports a limit violation that a full turn would remove.
 */
export function wrapNear(angleDeg: number, nearDeg: number): number {
  return angleDeg - 360 * Math.round((angleDeg - nearDeg) / 360);
}
