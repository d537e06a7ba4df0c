// A plain four-legged robot for the worked examples: legs along the axes, no
// offsets, wide limits, so the numbers of a textbook triangle come out as they are.
import { parseRobot, type Robot } from "../../../app/kinematics";

export type TestLegShape = { coxa: number; femur: number; tibia: number };

function joint(channel: number, minDeg: number, maxDeg: number) {
  return {
    minDeg,
    maxDeg,
    zeroOffsetDeg: 0,
    maxSpeedDegS: 300,
    servo: { channel, reversed: false, centerUs: 1500, usPerDeg: 11.1, minUs: 500, maxUs: 2500 },
  };
}

export function testRobotJson(shape: TestLegShape) {
  const mounts = [
    { id: "LF", x: 50, y: 40, yawDeg: 0 },
    { id: "LR", x: -50, y: 40, yawDeg: 180 },
    { id: "RF", x: 50, y: -40, yawDeg: 0 },
    { id: "RR", x: -50, y: -40, yawDeg: 180 },
  ];
  return {
    format: "gaitloom.robot/1",
    name: "Worked example",
    body: { massKg: 1, com: [0, 0, 0] },
    standHeight: 60,
    legs: mounts.map((mount, index) => ({
      id: mount.id,
      mount: { x: mount.x, y: mount.y, z: 0, yawDeg: mount.yawDeg },
      coxa: shape.coxa,
      femur: shape.femur,
      tibia: shape.tibia,
      joints: { coxa: joint(index * 3, -90, 90), femur: joint(index * 3 + 1, -170, 170), tibia: joint(index * 3 + 2, -170, 170) },
    })),
  };
}

export function testRobot(shape: TestLegShape): Robot {
  const parsed = parseRobot(testRobotJson(shape));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.robot;
}
