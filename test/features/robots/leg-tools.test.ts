import { describe, expect, test } from "vitest";
import { JOINT_NAMES, mirrorLeg, parseRobot } from "~/kinematics";
import { addLeg, copyGeometryTo, counterpartOf, defaultRest, freeChannels, mirrorSide, removeLeg } from "~/features/robots/leg-tools";
import { loadDemoRobot } from "../../support/robots";

describe("mirror one side onto the other", () => {
  test("right legs become mirror images of the left ones, keeping their ids and servo mappings (DESIGN.md: coxa limits and offsets negated)", () => {
    const robot = loadDemoRobot("pier-crawler");
    robot.legs[0].femur = 66; // LF
    robot.legs[0].joints.coxa.minDeg = -50;
    robot.legs[0].joints.coxa.zeroOffsetDeg = 4;
    const { robot: mirrored, replaced, added } = mirrorSide(robot, "left");
    expect(replaced).toEqual(["RF", "RM", "RR"]);
    expect(added).toEqual([]);
    const rf = mirrored.legs.find((leg) => leg.id === "RF")!;
    const original = robot.legs.find((leg) => leg.id === "RF")!;
    const expected = mirrorLeg(robot.legs[0], "RF");
    expect(rf.femur).toBe(66);
    expect(rf.mount).toEqual(expected.mount);
    expect(rf.joints.coxa.maxDeg).toBe(50);
    expect(rf.joints.coxa.zeroOffsetDeg).toBe(-4);
    for (const joint of JOINT_NAMES) expect(rf.joints[joint].servo).toEqual(original.joints[joint].servo);
    expect(parseRobot(mirrored).ok).toBe(true);
  });

  test("counterparts pair by side and row (DESIGN.md); a leg without one gets a new mirrored leg on free channels", () => {
    const robot = loadDemoRobot("pier-crawler");
    const fewer = removeLeg(robot, "RR");
    expect(fewer.legs.map((leg) => leg.id)).not.toContain("RR");
    expect(Object.keys(fewer.rest ?? {})).not.toContain("RR");
    const { robot: mirrored, replaced, added } = mirrorSide(fewer, "left");
    expect(replaced).toEqual(["RF", "RM"]);
    expect(added).toEqual(["RR"]);
    const parsed = parseRobot(mirrored);
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
    const rr = mirrored.legs.find((leg) => leg.id === "RR")!;
    const lr = robot.legs.find((leg) => leg.id === "LR")!;
    expect(rr.mount).toEqual({ ...lr.mount, y: -lr.mount.y, yawDeg: -lr.mount.yawDeg });
    expect(counterpartOf(mirrored, rr)?.id).toBe("LR");
    expect(mirrored.rest?.RR).toEqual({ ...robot.rest!.LR, coxa: -robot.rest!.LR.coxa || 0 });
    const channels = mirrored.legs.flatMap((leg) => [leg.joints.coxa.servo.channel, leg.joints.femur.servo.channel, leg.joints.tibia.servo.channel]);
    expect(new Set(channels).size).toBe(channels.length);
  });
});

describe("copy a leg's geometry", () => {
  test("same side copies as is; the other side gets the coxa mirrored; mounts and servos stay", () => {
    const robot = loadDemoRobot("quay-walker");
    robot.legs[0].tibia = 130;
    robot.legs[0].joints.coxa.minDeg = -30;
    const copied = copyGeometryTo(robot, "LF", ["LR", "RF"]);
    const [lf, lr, rf, rr] = copied.legs;
    expect(lr.tibia).toBe(130);
    expect(lr.joints.coxa.minDeg).toBe(-30);
    expect(rf.tibia).toBe(130);
    expect(rf.joints.coxa.maxDeg).toBe(30);
    expect(rf.mount).toEqual(robot.legs[2].mount);
    expect(rf.joints.femur.servo).toEqual(robot.legs[2].joints.femur.servo);
    expect(rr).toBe(robot.legs[3]);
    expect(lf).toBe(robot.legs[0]);
  });
});

describe("add a leg, rest pose defaults", () => {
  test("a new leg has a fresh id and unused channels; a full robot takes no more", () => {
    const robot = loadDemoRobot("quay-walker");
    const more = addLeg(robot)!;
    expect(more.legs).toHaveLength(5);
    const parsed = parseRobot(more);
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
    expect(freeChannels(robot, 3)).toEqual([12, 13, 14]);
    expect(addLeg(loadDemoRobot("hull-climber"))).toBeNull();
  });

  test("the default rest pose sits every joint at 0° or its nearest limit", () => {
    const robot = loadDemoRobot("quay-walker");
    robot.legs[0].joints.femur.minDeg = 10;
    const rest = defaultRest(robot);
    expect(rest.LF).toEqual({ coxa: 0, femur: 10, tibia: 0 });
    expect(parseRobot({ ...robot, rest }).ok).toBe(true);
  });
});
