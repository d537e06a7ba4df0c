import { describe, expect, it } from "vitest";
import { forwardLeg, solveLeg, type Vec3 } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";
import { seededRandom } from "./support/prng";
import { testRobot } from "./support/test-robot";

const DEG = 180 / Math.PI;

// Test leg LF: mount (50, 40, 0), yaw 0, coxa 20 mm; its leg plane is y = 40 and
// the femur joint sits at x = 70, so a target (70 + u, 40, z) is (u, z) from it.
const COXA_MM = 20;
const femurJointX = 50 + COXA_MM;
const inPlane = (u: number, z: number): Vec3 => [femurJointX + u, 40, z];

describe("law of cosines worked examples (planar two-link leg)", () => {
  it("3-4-5 right triangle: 36.870°, 53.130°, 90° (published worked example)", () => {
    const robot = testRobot({ coxa: COXA_MM, femur: 30, tibia: 40 });
    const solution = solveLeg(robot, "LF", inPlane(50, 0));
    expect(solution.reachable).toBe(true);
    const kneeInteriorDeg = solution.angles.tibia + 90;
    const atFemurJointDeg = solution.angles.femur; // the target line is horizontal
    const atFootDeg = 180 - kneeInteriorDeg - atFemurJointDeg;
    expect(kneeInteriorDeg, "interior knee angle γ (°), opposite the 5 side").toBeCloseTo(90, 9);
    expect(atFemurJointDeg, "angle at the femur joint (°), opposite the 4 side").toBeCloseTo(53.13010235415598, 9);
    expect(atFootDeg, "angle at the foot (°), opposite the 3 side").toBeCloseTo(36.86989764584402, 9);
    expect(solution.angles.coxa, "coxa (°)").toBeCloseTo(0, 12);
  });

  it("3-4-5 right triangle turned straight down: femur at 53.130° − 90° = −36.870°", () => {
    const robot = testRobot({ coxa: COXA_MM, femur: 30, tibia: 40 });
    const solution = solveLeg(robot, "LF", inPlane(0, -50));
    expect(solution.angles.femur, "femur (°)").toBeCloseTo(-36.86989764584402, 9);
    expect(solution.angles.tibia, "tibia (°), right-angled knee").toBeCloseTo(0, 9);
  });

  it("obtuse 3-5-7 triangle: the angle opposite 7 is 120° (published worked example)", () => {
    // 7² = 3² + 5² − 2·3·5·cos C  ⇒  cos C = −1/2, C = 120°; the angle opposite 5 is acos(11/14) = 38.2132°.
    const robot = testRobot({ coxa: COXA_MM, femur: 30, tibia: 50 });
    const solution = solveLeg(robot, "LF", inPlane(70, 0));
    expect(solution.angles.tibia + 90, "interior knee angle γ (°)").toBeCloseTo(120, 9);
    expect(solution.angles.tibia, "tibia (°) = γ − 90°").toBeCloseTo(30, 9);
    expect(solution.angles.femur, "femur (°) = angle opposite the 5 side").toBeCloseTo(Math.acos(11 / 14) * DEG, 9);
    expect(Math.acos(11 / 14) * DEG, "published value (°)").toBeCloseTo(38.2132, 4);
  });

  it("agrees with Craig's closed-form planar two-link solution (J. J. Craig, Introduction to Robotics) on 500 seeded targets", () => {
    const femurMm = 60;
    const tibiaMm = 100;
    const robot = testRobot({ coxa: COXA_MM, femur: femurMm, tibia: tibiaMm });
    const random = seededRandom(345);
    let worstDeg = 0;
    let worstCase = "";
    for (let sample = 0; sample < 500; sample += 1) {
      const distance = random.between(Math.abs(femurMm - tibiaMm) + 1, femurMm + tibiaMm - 1);
      const directionRad = random.between(-Math.PI / 2 - 0.3, 0.8);
      const u = distance * Math.cos(directionRad);
      const z = distance * Math.sin(directionRad);
      if (u + COXA_MM < 2) continue; // keep the foot in front of the coxa axis
      // Craig: c2 = (x² + y² − l1² − l2²)/(2·l1·l2), s2 = ±√(1 − c2²), θ2 = atan2(s2, c2),
      // θ1 = atan2(y, x) − atan2(l2·s2, l1 + l2·c2). Our knee-up branch is s2 ≤ 0.
      const c2 = (u * u + z * z - femurMm * femurMm - tibiaMm * tibiaMm) / (2 * femurMm * tibiaMm);
      const s2 = -Math.sqrt(1 - c2 * c2);
      const theta2Deg = Math.atan2(s2, c2) * DEG;
      const theta1Deg = (Math.atan2(z, u) - Math.atan2(tibiaMm * s2, femurMm + tibiaMm * c2)) * DEG;
      const solution = solveLeg(robot, "LF", inPlane(u, z));
      // θ1 is our femur angle; θ2 is the tibia's direction relative to the femur, α − φf = φt − 90°.
      // Compared modulo a full turn: we report the turn nearest the middle of the joint's range.
      const errorDeg = Math.max(Math.abs(turnDifference(solution.angles.femur, theta1Deg)), Math.abs(turnDifference(solution.angles.tibia - 90, theta2Deg)));
      if (errorDeg > worstDeg) {
        worstDeg = errorDeg;
        worstCase = `target (u ${u.toFixed(2)}, z ${z.toFixed(2)}) mm: expected femur ${theta1Deg}°, tibia ${theta2Deg + 90}°, got ${solution.angles.femur}°, ${solution.angles.tibia}°`;
      }
    }
    expect(worstDeg, `worst difference (°) — ${worstCase}`).toBeLessThan(1e-9);
  });
});

describe("unreachable targets: a state with a reason, never NaN", () => {
  const [pierCrawler] = loadDemoRobots();
  // Pier crawler LF: mount (85, 50, −8), yaw 45°, coxa 30, femur 60, tibia 100 mm.
  const alongYaw = (radiusMm: number, z: number): Vec3 => [85 + radiusMm * Math.SQRT1_2, 50 + radiusMm * Math.SQRT1_2, z];

  it("beyond full extension names the leg and the distance", () => {
    const solution = solveLeg(pierCrawler, "LF", alongYaw(300, -8));
    expect(solution.reachable).toBe(false);
    expect(solution.reason).toBe("leg LF: the foot is 270.0 mm from the femur joint, beyond full extension (160.0 mm)");
    // The clamped solution is the straight leg pointing at the target.
    expect(solution.angles.tibia + pierCrawler.legs[0].joints.tibia.zeroOffsetDeg, "geometric tibia (°), straight").toBeCloseTo(90, 9);
    const foot = forwardLeg(pierCrawler, "LF", solution.angles);
    const reached = alongYaw(190, -8);
    expect(Math.hypot(foot[0] - reached[0], foot[1] - reached[1], foot[2] - reached[2]), "foot off the full-reach point (mm)").toBeLessThan(1e-9);
  });

  it("inside full fold names the leg and the distance", () => {
    const solution = solveLeg(pierCrawler, "LF", alongYaw(50, -8));
    expect(solution.reachable).toBe(false);
    expect(solution.reason).toBe("leg LF: the foot is 20.0 mm from the femur joint, inside full fold (40.0 mm)");
  });

  it("within 1 mm of the coxa axis is unreachable: the coxa angle is undefined there", () => {
    const solution = solveLeg(pierCrawler, "LF", [85.3, 50, -60]);
    expect(solution.reachable).toBe(false);
    expect(solution.reason).toBe("leg LF: the foot is 0.3 mm from the coxa axis, where the coxa angle is undefined (1.0 mm needed)");
    expect(Object.values(solution.angles).every(Number.isFinite)).toBe(true);
  });

  it("exactly at full extension is still reachable", () => {
    const solution = solveLeg(pierCrawler, "LF", alongYaw(190, -8));
    expect(solution.reachable, solution.reason).toBe(true);
  });

  it("NaN and infinite targets give finite angles and a reason", () => {
    for (const target of [
      [Number.NaN, 0, 0],
      [0, Number.POSITIVE_INFINITY, 0],
      [0, 0, Number.NEGATIVE_INFINITY],
    ] as Vec3[]) {
      const solution = solveLeg(pierCrawler, "LF", target);
      expect(solution.reachable).toBe(false);
      expect(solution.reason).toMatch(/^leg LF: the target \(.*\) is not a finite point$/);
      expect(Object.values(solution.angles).every(Number.isFinite), JSON.stringify(solution.angles)).toBe(true);
    }
  });

  it("20 000 seeded targets anywhere in a 2 m box, on the mounts and at the singular distances: no NaN", () => {
    const random = seededRandom(20_000);
    const robots = loadDemoRobots();
    let bad = "";
    for (let sample = 0; sample < 20_000 && !bad; sample += 1) {
      const robot = robots[sample % robots.length];
      const leg = robot.legs[random.index(robot.legs.length)];
      const kind = sample % 4;
      const target: Vec3 =
        kind === 0
          ? [random.between(-1000, 1000), random.between(-1000, 1000), random.between(-1000, 1000)]
          : kind === 1
            ? [leg.mount.x, leg.mount.y, random.between(-300, 300)]
            : alongRadius(leg, kind === 2 ? leg.femur + leg.tibia : Math.abs(leg.femur - leg.tibia), random.between(0, 2 * Math.PI));
      const pose = sample % 3 === 0 ? { x: 5, y: -5, z: 10, roll: 7, pitch: -4, yaw: 12 } : undefined;
      const solution = solveLeg(robot, leg.id, target, pose);
      const finite = Object.values(solution.angles).every(Number.isFinite) && solution.violations.every((v) => Number.isFinite(v.valueDeg));
      if (!finite) bad = `${robot.name} ${leg.id} at ${target.join(", ")} mm gave ${JSON.stringify(solution.angles)}`;
      if (!solution.reachable && !solution.reason) bad = `${robot.name} ${leg.id} at ${target.join(", ")} mm: unreachable without a reason`;
    }
    expect(bad, "expected finite angles for every target").toBe("");
  });
});

function turnDifference(aDeg: number, bDeg: number): number {
  const difference = (aDeg - bDeg) % 360;
  return difference > 180 ? difference - 360 : difference < -180 ? difference + 360 : difference;
}

// A point at `distanceMm` from the femur joint, in the leg plane, at angle `angleRad` there.
function alongRadius(leg: { mount: { x: number; y: number; z: number; yawDeg: number }; coxa: number }, distanceMm: number, angleRad: number): Vec3 {
  const yawRad = (leg.mount.yawDeg * Math.PI) / 180;
  const radius = leg.coxa + distanceMm * Math.cos(angleRad);
  return [leg.mount.x + radius * Math.cos(yawRad), leg.mount.y + radius * Math.sin(yawRad), leg.mount.z + distanceMm * Math.sin(angleRad)];
}

describe("joint limits", () => {
  const [pierCrawler] = loadDemoRobots();

  it("a reachable target past the coxa limit reports the violation in servo degrees", () => {
    // 60° counter-clockwise of LF's mount yaw (45°), 110 mm out: servo = 60° − zero offset 2° = 58°, limit ±45°.
    const directionRad = ((45 + 60) * Math.PI) / 180;
    const solution = solveLeg(pierCrawler, "LF", [85 + 110 * Math.cos(directionRad), 50 + 110 * Math.sin(directionRad), -90]);
    expect(solution.reachable).toBe(true);
    expect(solution.violations).toHaveLength(1);
    expect(solution.violations[0].joint).toBe("coxa");
    expect(solution.violations[0].valueDeg, "coxa servo angle (°)").toBeCloseTo(58, 9);
    expect(solution.violations[0]).toMatchObject({ minDeg: -45, maxDeg: 45 });
  });

  it("a neutral foot has no violations", () => {
    const solution = solveLeg(pierCrawler, "LF", [150, 115, -90]);
    expect(solution).toMatchObject({ reachable: true, violations: [] });
    expect(solution.reason).toBeUndefined();
  });

  it("an unknown leg id is a caller's bug and throws, naming the legs", () => {
    expect(() => solveLeg(pierCrawler, "XX", [0, 0, 0])).toThrow('robot "Pier crawler" has no leg "XX" (legs: LF, LM, LR, RF, RM, RR)');
  });

  it("a definition edited in place is solved with its new numbers", () => {
    const robot = structuredClone(pierCrawler);
    const before = solveLeg(robot, "LF", [150, 115, -90]).angles.tibia;
    robot.legs[0].joints.tibia.zeroOffsetDeg += 10;
    const after = solveLeg(robot, "LF", [150, 115, -90]).angles.tibia;
    expect(after - before, "tibia servo change (°) after raising its zero offset by 10°").toBeCloseTo(-10, 9);
  });
});
