// A plain, valid robot to start from when no existing robot is close: four, six
// or eight equal legs around an oval body, servos on channels in leg order.
import { JOINT_NAMES, parseRobot, ROBOT_FORMAT, type Joint, type Leg, type Robot } from "~/kinematics";

export const STARTER_LEG_COUNTS = [4, 6, 8] as const;
export type StarterLegCount = (typeof STARTER_LEG_COUNTS)[number];

const LEG_IDS: Record<StarterLegCount, { left: string[]; right: string[] }> = {
  4: { left: ["LF", "LR"], right: ["RF", "RR"] },
  6: { left: ["LF", "LM", "LR"], right: ["RF", "RM", "RR"] },
  8: { left: ["L1", "L2", "L3", "L4"], right: ["R1", "R2", "R3", "R4"] },
};

// Common hobby-servo practice: 1500 µs centre, about 11.1 µs per degree over 500–2500 µs.
const servo = (channel: number) => ({ channel, reversed: false, centerUs: 1500, usPerDeg: 11.1, minUs: 500, maxUs: 2500 });

const LIMITS: Record<(typeof JOINT_NAMES)[number], Omit<Joint, "servo">> = {
  coxa: { minDeg: -45, maxDeg: 45, zeroOffsetDeg: 0, maxSpeedDegS: 300 },
  femur: { minDeg: -75, maxDeg: 85, zeroOffsetDeg: 0, maxSpeedDegS: 300 },
  tibia: { minDeg: -85, maxDeg: 80, zeroOffsetDeg: 0, maxSpeedDegS: 300 },
};

export function starterRobot(name: string, legCount: StarterLegCount): Robot {
  const { left, right } = LEG_IDS[legCount];
  const rows = left.length;
  const halfLengthMm = 40 + 25 * rows;
  const legs: Leg[] = [];
  for (const [sideIndex, ids] of [left, right].entries()) {
    const sign = sideIndex === 0 ? 1 : -1;
    ids.forEach((id, row) => {
      // Rows spread front to back; the coxa zero fans from 45° at the front to 135° at the back.
      const fraction = rows === 1 ? 0.5 : row / (rows - 1);
      const x = Math.round(halfLengthMm * (1 - 2 * fraction));
      const y = Math.round(sign * (50 + 12 * Math.sin(Math.PI * fraction)));
      const yawDeg = sign * Math.round(45 + 90 * fraction);
      const first = legs.length * 3;
      legs.push({
        id,
        mount: { x, y, z: 0, yawDeg },
        coxa: 30,
        femur: 60,
        tibia: 100,
        joints: {
          coxa: { ...LIMITS.coxa, servo: servo(first) },
          femur: { ...LIMITS.femur, servo: servo(first + 1) },
          tibia: { ...LIMITS.tibia, servo: servo(first + 2) },
        },
      });
    });
  }
  const candidate = {
    format: ROBOT_FORMAT,
    name,
    description: `Starter robot with ${legCount} legs: measure yours and change the numbers.`,
    body: { massKg: 1.5, com: [0, 0, 0] },
    standHeight: 80,
    legs,
  };
  const parsed = parseRobot(candidate);
  // The template is ours; a failure here is a bug, never the user's input.
  if (!parsed.ok) throw new Error(`starter robot is invalid: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.robot;
}
