// The core takes a Robot as parseRobot returns it, every number within its
// range (bounds.ts). A definition built or changed in code can hold what the
// parse refuses — links of 1e200 mm, a NaN offset — and the solve's squares
// and quotients would turn it into NaN. These checks find the first such
// number, so that the solvers refuse the leg instead. Plain comparisons, no
// allocation unless one is found: they run once per solve or per leg.
import { BODY_HEIGHT_MM, BODY_POINT_MM, HALF_TURN_DEG, JOINT_SPEED_DEG_S, LINK_MM, MASS_KG, PULSE_US, US_PER_DEG, type Bound } from "./bounds";
import type { Leg, Robot } from "./robot";

const JOINTS = ["coxa", "femur", "tibia"] as const;

// NaN fails both comparisons, so it is outside every range.
function outside(value: number, bound: Bound): boolean {
  return !(value >= bound.min && value <= bound.max);
}

function sentence(what: string, value: number, bound: Bound, unit: string): string {
  return `its ${what} is ${value}${unit === "°" ? "°" : ` ${unit}`}, outside ${bound.min} to ${bound.max} ${unit}`;
}

/**
 * What a leg solve reads — mount, link lengths, joint limits and zero offsets —
 * checked against the format's ranges: the first number outside, in words
 * ("its femur is 1e+200 mm, outside 1 to 2000 mm"), or null when all are inside.
 */
export function legProblem(leg: Leg): string | null {
  const { mount } = leg;
  if (outside(mount.x, BODY_POINT_MM)) return sentence("mount x", mount.x, BODY_POINT_MM, "mm");
  if (outside(mount.y, BODY_POINT_MM)) return sentence("mount y", mount.y, BODY_POINT_MM, "mm");
  if (outside(mount.z, BODY_POINT_MM)) return sentence("mount z", mount.z, BODY_POINT_MM, "mm");
  if (outside(mount.yawDeg, HALF_TURN_DEG)) return sentence("mount yaw", mount.yawDeg, HALF_TURN_DEG, "°");
  if (outside(leg.coxa, LINK_MM)) return sentence("coxa", leg.coxa, LINK_MM, "mm");
  if (outside(leg.femur, LINK_MM)) return sentence("femur", leg.femur, LINK_MM, "mm");
  if (outside(leg.tibia, LINK_MM)) return sentence("tibia", leg.tibia, LINK_MM, "mm");
  for (const name of JOINTS) {
    const joint = leg.joints[name];
    if (outside(joint.minDeg, HALF_TURN_DEG)) return sentence(`${name} minDeg`, joint.minDeg, HALF_TURN_DEG, "°");
    if (outside(joint.maxDeg, HALF_TURN_DEG)) return sentence(`${name} maxDeg`, joint.maxDeg, HALF_TURN_DEG, "°");
    if (outside(joint.zeroOffsetDeg, HALF_TURN_DEG)) return sentence(`${name} zeroOffsetDeg`, joint.zeroOffsetDeg, HALF_TURN_DEG, "°");
  }
  return null;
}

/**
 * Every number a solve reads, leg by leg (legProblem, then joint speeds and
 * servo pulses) and then the body's: the first outside its range, naming the
 * leg ("leg LF: its femur is …"), or null when all are inside.
 */
export function robotProblem(robot: Robot): string | null {
  for (const leg of robot.legs) {
    const problem = legProblem(leg) ?? servoProblem(leg);
    if (problem !== null) return `leg ${leg.id}: ${problem}`;
  }
  const { massKg, com } = robot.body;
  if (outside(massKg, MASS_KG)) return sentence("body mass", massKg, MASS_KG, "kg");
  for (let axis = 0; axis < 3; axis += 1) if (outside(com[axis], BODY_POINT_MM)) return sentence(`centre of mass [${axis}]`, com[axis], BODY_POINT_MM, "mm");
  if (outside(robot.standHeight, BODY_HEIGHT_MM)) return sentence("standHeight", robot.standHeight, BODY_HEIGHT_MM, "mm");
  return null;
}

function servoProblem(leg: Leg): string | null {
  for (const name of JOINTS) {
    const { maxSpeedDegS, servo } = leg.joints[name];
    if (outside(maxSpeedDegS, JOINT_SPEED_DEG_S)) return sentence(`${name} maxSpeedDegS`, maxSpeedDegS, JOINT_SPEED_DEG_S, "°/s");
    if (outside(servo.centerUs, PULSE_US)) return sentence(`${name} centerUs`, servo.centerUs, PULSE_US, "µs");
    if (outside(servo.minUs, PULSE_US)) return sentence(`${name} minUs`, servo.minUs, PULSE_US, "µs");
    if (outside(servo.maxUs, PULSE_US)) return sentence(`${name} maxUs`, servo.maxUs, PULSE_US, "µs");
    if (outside(servo.usPerDeg, US_PER_DEG)) return sentence(`${name} usPerDeg`, servo.usPerDeg, US_PER_DEG, "µs/°");
  }
  return null;
}
