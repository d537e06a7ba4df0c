// The neutral stance per robot and body height, made once: it costs a reach
// scan per leg, and copy, mirror and the views ask for it often.
import { neutralStance, type Robot, type Vec3 } from "../../../kinematics/index";

const cache = new WeakMap<Robot, Map<number, Record<string, Vec3>>>();

export function neutralFeet(robot: Robot, bodyHeightMm: number): Record<string, Vec3> {
  let byHeight = cache.get(robot);
  if (!byHeight) cache.set(robot, (byHeight = new Map()));
  let feet = byHeight.get(bodyHeightMm);
  if (!feet) byHeight.set(bodyHeightMm, (feet = neutralStance(robot, bodyHeightMm)));
  return feet;
}
