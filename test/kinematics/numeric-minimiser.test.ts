import numeric from "numeric";
import { describe, expect, it } from "vitest";
import { forwardLeg, solveLeg, type JointAngles, type Vec3 } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";
import { sampleJointSet } from "./support/joint-samples";
import { seededRandom } from "./support/prng";
import { distanceMm, referenceFoot } from "./support/reference-fk";

const TARGETS = 300;
// Servo degrees (coxa, femur, tibia): a neutral posture first, then a few others.
const STARTS_DEG = [
  [0, 0, 0],
  [0, 30, -30],
  [-30, 10, 10],
  [30, 10, 10],
  [0, -30, 40],
];

describe("solveLeg against a general-purpose numeric minimiser (numeric.uncmin, reference library)", () => {
  it(`reaches the same foot to 1e-4 mm on ${TARGETS} seeded targets`, () => {
    const random = seededRandom(4242);
    const robots = loadDemoRobots();
    const legs = robots.flatMap((robot) => robot.legs.map((leg) => ({ robot, leg })));
    let worstOursMm = 0;
    let worstNumericMm = 0;
    let worstApartMm = 0;
    let worstCase = "";
    let sameAngles = 0;
    for (let index = 0; index < TARGETS; index += 1) {
      const { robot, leg } = legs[index % legs.length];
      const pose = {
        x: random.between(-15, 15),
        y: random.between(-15, 15),
        z: random.between(-15, 15),
        roll: random.between(-10, 10),
        pitch: random.between(-10, 10),
        yaw: random.between(-15, 15),
      };
      // Targets from the three.js reference FK, so neither side grades its own homework.
      const target = referenceFoot(leg, sampleJointSet(random, leg), pose);

      const ours = solveLeg(robot, leg.id, target, pose);
      const oursFoot = forwardLeg(robot, leg.id, ours.angles, pose);

      // Minimise the squared foot distance (mm²) over the three servo angles (degrees).
      const footOf = (x: number[]): Vec3 => referenceFoot(leg, { coxa: x[0], femur: x[1], tibia: x[2] }, pose);
      const objective = (x: number[]): number => {
        const foot = footOf(x);
        return (foot[0] - target[0]) ** 2 + (foot[1] - target[1]) ** 2 + (foot[2] - target[2]) ** 2;
      };
      // A local minimiser may settle in a false minimum: restart from a few
      // plain postures (the common multi-start practice) until the foot is there.
      let result = numeric.uncmin(objective, STARTS_DEG[0], 1e-14, undefined, 2000);
      for (const start of STARTS_DEG.slice(1)) {
        if (result.f < 1e-12) break;
        const retry = numeric.uncmin(objective, start, 1e-14, undefined, 2000);
        if (retry.f < result.f) result = retry;
      }
      const numericAngles: JointAngles = { coxa: result.solution[0], femur: result.solution[1], tibia: result.solution[2] };
      const numericFoot = footOf(result.solution);

      const oursMm = distanceMm(oursFoot, target);
      const numericMm = distanceMm(numericFoot, target);
      const apartMm = distanceMm(oursFoot, numericFoot);
      if (Math.max(oursMm, numericMm, apartMm) > Math.max(worstOursMm, worstNumericMm, worstApartMm)) {
        worstCase = `${robot.name} ${leg.id} target [${target.join(", ")}] mm: ours ${JSON.stringify(ours.angles)}°, numeric ${JSON.stringify(numericAngles)}° (${result.message.trim()})`;
      }
      worstOursMm = Math.max(worstOursMm, oursMm);
      worstNumericMm = Math.max(worstNumericMm, numericMm);
      worstApartMm = Math.max(worstApartMm, apartMm);
      const anglesApartDeg = Math.max(...(["coxa", "femur", "tibia"] as const).map((joint) => Math.abs(ours.angles[joint] - numericAngles[joint])));
      if (anglesApartDeg < 1e-3) sameAngles += 1;
    }
    expect(worstNumericMm, `numeric minimiser's worst foot error (mm) — ${worstCase}`).toBeLessThanOrEqual(1e-4);
    expect(worstOursMm, `solveLeg's worst foot error (mm) — ${worstCase}`).toBeLessThanOrEqual(1e-4);
    expect(worstApartMm, `worst distance between the two feet (mm) — ${worstCase}`).toBeLessThanOrEqual(1e-4);
    // The foot is what must agree; the minimiser may find the other (knee-down)
    // posture now and then, so the angles need only agree on most targets.
    expect(sameAngles, `targets where both found the same angles to 1e-3°, of ${TARGETS}`).toBeGreaterThanOrEqual(TARGETS * 0.9);
  });
});
