import { describe, expect, it } from "vitest";
import { copyLegGeometry, forwardLeg, mirrorLeg, parseRobot } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";

describe("mirrorLeg (DESIGN.md: mirroring negates y, the mount yaw and the coxa's limits and offset)", () => {
  const [pier] = loadDemoRobots();
  const lf = pier.legs.find((leg) => leg.id === "LF")!;

  it("turns the pier crawler's LF into its RF geometry", () => {
    const rf = pier.legs.find((leg) => leg.id === "RF")!;
    const mirrored = mirrorLeg(lf, "RF", { coxa: 9, femur: 10, tibia: 11 });
    const withoutServos = (leg: typeof lf) => ({
      ...leg,
      joints: Object.fromEntries(Object.entries(leg.joints).map(([name, joint]) => [name, { ...joint, servo: undefined }])),
    });
    expect(withoutServos(mirrored)).toEqual(withoutServos(rf));
    expect(mirrored.joints.coxa.servo.channel).toBe(9);
  });

  it("swaps asymmetric coxa limits and twice mirrored gives the leg back", () => {
    const asymmetric = { ...lf, joints: { ...lf.joints, coxa: { ...lf.joints.coxa, minDeg: -30, maxDeg: 50, zeroOffsetDeg: 4 } } };
    const mirrored = mirrorLeg(asymmetric, "RX");
    expect(mirrored.joints.coxa).toMatchObject({ minDeg: -50, maxDeg: 30, zeroOffsetDeg: -4 });
    expect(mirrorLeg(mirrored, lf.id)).toEqual(asymmetric);
  });

  it("moves the foot to its mirror image for mirrored coxa angles", () => {
    const robot = structuredClone(pier);
    const index = robot.legs.findIndex((leg) => leg.id === "RF");
    robot.legs[index] = mirrorLeg(lf, "RF", { coxa: 9, femur: 10, tibia: 11 });
    const parsed = parseRobot(robot);
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
    const left = forwardLeg(robot, "LF", { coxa: 20, femur: 15, tibia: -10 });
    const right = forwardLeg(robot, "RF", { coxa: -20, femur: 15, tibia: -10 });
    expect(right[0], "x (mm)").toBeCloseTo(left[0], 9);
    expect(right[1], "y (mm)").toBeCloseTo(-left[1], 9);
    expect(right[2], "z (mm)").toBeCloseTo(left[2], 9);
  });

  it("flips a given side", () => {
    expect(mirrorLeg({ ...lf, side: "left" }, "RF").side).toBe("right");
  });
});

describe("copyLegGeometry", () => {
  const [pier, quay] = loadDemoRobots();

  it("copies lengths and joint limits, offsets and speeds; keeps the target's id, mount and servos", () => {
    const source = quay.legs[0];
    const target = pier.legs[1];
    const copied = copyLegGeometry(source, target);
    expect(copied).toMatchObject({ id: target.id, mount: target.mount, coxa: source.coxa, femur: source.femur, tibia: source.tibia });
    for (const name of ["coxa", "femur", "tibia"] as const) {
      const { servo, ...rest } = copied.joints[name];
      const { servo: _sourceServo, ...sourceRest } = source.joints[name];
      expect(rest).toEqual(sourceRest);
      expect(servo).toEqual(target.joints[name].servo);
    }
  });

  it("mirrors the coxa for a leg on the other side", () => {
    const source = { ...quay.legs[0], joints: { ...quay.legs[0].joints, coxa: { ...quay.legs[0].joints.coxa, minDeg: -20, maxDeg: 40, zeroOffsetDeg: 3 } } };
    const copied = copyLegGeometry(source, pier.legs[3], { mirror: true });
    expect(copied.joints.coxa).toMatchObject({ minDeg: -40, maxDeg: 20, zeroOffsetDeg: -3 });
  });
});
