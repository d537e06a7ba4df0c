import { describe, expect, it } from "vitest";
import { forwardLeg, forwardLegJoints, parseRobot, solveLeg, type BodyPose, type JointAngles, type Robot } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";
import { sampleJointSet } from "./support/joint-samples";
import { seededRandom, type Random } from "./support/prng";
import { distanceMm, referenceFoot, referenceJoints } from "./support/reference-fk";

const SAMPLES = 12_000;

function randomPose(random: Random): BodyPose {
  return {
    x: random.between(-25, 25),
    y: random.between(-25, 25),
    z: random.between(-20, 20),
    roll: random.between(-15, 15),
    pitch: random.between(-15, 15),
    yaw: random.between(-25, 25),
  };
}

// The demo robots, plus copies with random zero offsets on every joint, so that
// each joint's calibration sign is exercised (the demo robots have a few).
function robotsUnderTest(): Robot[] {
  const demo = loadDemoRobots();
  const random = seededRandom(77);
  const variants = demo.map((robot) => {
    const copy = structuredClone(robot);
    copy.name = `${robot.name} (random offsets)`;
    for (const leg of copy.legs) {
      for (const joint of Object.values(leg.joints)) joint.zeroOffsetDeg = Math.round(random.between(-20, 20) * 100) / 100;
    }
    const parsed = parseRobot(copy);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    return parsed.robot;
  });
  return [...demo, ...variants];
}

type Sample = { robot: Robot; legId: string; angles: JointAngles; pose: BodyPose | undefined };

function samples(seed: number): Sample[] {
  const random = seededRandom(seed);
  const robots = robotsUnderTest();
  const legs = robots.flatMap((robot) => robot.legs.map((leg) => ({ robot, leg })));
  return Array.from({ length: SAMPLES }, (_, index) => {
    const { robot, leg } = legs[index % legs.length];
    return { robot, legId: leg.id, angles: sampleJointSet(random, leg), pose: index % 5 === 0 ? undefined : randomPose(random) };
  });
}

describe("forwardLeg against FK composed with three.js Matrix4 (reference library, Euler order 'ZYX')", () => {
  it(`agrees to 1e-6 mm over ${SAMPLES} seeded joint sets on every demo leg, with body pose and zero offsets`, () => {
    let worstMm = 0;
    let worstCase = "";
    for (const { robot, legId, angles, pose } of samples(1)) {
      const leg = robot.legs.find((candidate) => candidate.id === legId)!;
      const expected = referenceFoot(leg, angles, pose);
      const got = forwardLeg(robot, legId, angles, pose);
      const errorMm = distanceMm(expected, got);
      if (errorMm > worstMm) {
        worstMm = errorMm;
        worstCase = `${robot.name} ${legId} ${JSON.stringify(angles)}: expected [${expected.join(", ")}] mm, got [${got.join(", ")}] mm`;
      }
    }
    expect(worstMm, `worst foot error (mm) — ${worstCase}`).toBeLessThanOrEqual(1e-6);
  });
});

describe("forwardLegJoints against the same three.js chain, joint by joint", () => {
  it("puts the coxa joint, femur joint, knee and foot within 1e-6 mm of the reference, and its foot is forwardLeg's", () => {
    let worstMm = 0;
    let worstCase = "";
    let footDiffers = 0;
    for (const { robot, legId, angles, pose } of samples(4).slice(0, 3000)) {
      const leg = robot.legs.find((candidate) => candidate.id === legId)!;
      const expected = referenceJoints(leg, angles, pose);
      const got = forwardLegJoints(robot, legId, angles, pose);
      for (const joint of ["coxa", "femur", "knee", "foot"] as const) {
        const errorMm = distanceMm(expected[joint], got[joint]);
        if (errorMm > worstMm) {
          worstMm = errorMm;
          worstCase = `${robot.name} ${legId} ${joint} ${JSON.stringify(angles)}: expected [${expected[joint].join(", ")}] mm, got [${got[joint].join(", ")}] mm`;
        }
      }
      const foot = forwardLeg(robot, legId, angles, pose);
      if (got.foot.some((value, axis) => value !== foot[axis])) footDiffers += 1;
    }
    expect(worstMm, `worst joint error (mm) — ${worstCase}`).toBeLessThanOrEqual(1e-6);
    expect(footDiffers, "joint sets whose foot is not forwardLeg's, bit for bit").toBe(0);
  });

  it("keeps the links' lengths: coxa, femur and tibia apart, joint to joint", () => {
    for (const { robot, legId, angles, pose } of samples(5).slice(0, 500)) {
      const leg = robot.legs.find((candidate) => candidate.id === legId)!;
      const { coxa, femur, knee, foot } = forwardLegJoints(robot, legId, angles, pose);
      expect(distanceMm(coxa, femur), `${robot.name} ${legId} coxa (mm)`).toBeCloseTo(leg.coxa, 9);
      expect(distanceMm(femur, knee), `${robot.name} ${legId} femur (mm)`).toBeCloseTo(leg.femur, 9);
      expect(distanceMm(knee, foot), `${robot.name} ${legId} tibia (mm)`).toBeCloseTo(leg.tibia, 9);
    }
  });
});

describe("solveLeg(forwardLeg(q)) = q on the documented knee-up branch (round trip through three.js FK)", () => {
  it(`returns q to 1e-6° over ${SAMPLES} seeded joint sets ≥ 1° from a straight or fully folded leg`, () => {
    let worstDeg = 0;
    let worstCase = "";
    let unreachable = 0;
    let offBranch = 0;
    for (const { robot, legId, angles, pose } of samples(2)) {
      const leg = robot.legs.find((candidate) => candidate.id === legId)!;
      // The target comes from the outside reference, not from our own FK.
      const target = referenceFoot(leg, angles, pose);
      const solution = solveLeg(robot, legId, target, pose);
      if (!solution.reachable || solution.violations.length > 0) unreachable += 1;
      const geometricTibiaDeg = solution.angles.tibia + leg.joints.tibia.zeroOffsetDeg;
      if (geometricTibiaDeg < -90 || geometricTibiaDeg > 90) offBranch += 1;
      const errorDeg = Math.max(
        Math.abs(solution.angles.coxa - angles.coxa),
        Math.abs(solution.angles.femur - angles.femur),
        Math.abs(solution.angles.tibia - angles.tibia),
      );
      if (errorDeg > worstDeg) {
        worstDeg = errorDeg;
        worstCase = `${robot.name} ${legId}: expected ${JSON.stringify(angles)}°, got ${JSON.stringify(solution.angles)}°`;
      }
    }
    expect(unreachable, "targets wrongly unreachable or out of limits").toBe(0);
    expect(offBranch, "solutions off the branch φt ∈ [−90°, 90°]").toBe(0);
    expect(worstDeg, `worst joint error (°) — ${worstCase}`).toBeLessThanOrEqual(1e-6);
  });

  it("forwardLeg(solveLeg(p)) = p for the same targets, to 1e-6 mm", () => {
    let worstMm = 0;
    for (const { robot, legId, angles, pose } of samples(3).slice(0, 3000)) {
      const leg = robot.legs.find((candidate) => candidate.id === legId)!;
      const target = referenceFoot(leg, angles, pose);
      const back = forwardLeg(robot, legId, solveLeg(robot, legId, target, pose).angles, pose);
      worstMm = Math.max(worstMm, distanceMm(target, back));
    }
    expect(worstMm, "worst foot error (mm)").toBeLessThanOrEqual(1e-6);
  });
});
