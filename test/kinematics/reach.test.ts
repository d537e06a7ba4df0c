import { describe, expect, it } from "vitest";
import { neutralStance, parseRobot, reachRing, solveLeg, type Robot, type Vec3 } from "../../app/kinematics";
import { DEMO_ROBOT_FILES, demoRobotJson, loadDemoRobot, loadDemoRobots } from "../support/robots";
import reachScanJson from "./fixtures/reach-scan-0.5mm.json";
import { seededRandom } from "./support/prng";

const along = (center: [number, number], directionDeg: number, radiusMm: number, z: number): Vec3 => [
  center[0] + radiusMm * Math.cos((directionDeg * Math.PI) / 180),
  center[1] + radiusMm * Math.sin((directionDeg * Math.PI) / 180),
  z,
];

describe("reachRing", () => {
  it("gives the law-of-cosines annulus: outer radius c + √((f + t)² − h²) (pier crawler LF at z = −90 mm)", () => {
    const [pier] = loadDemoRobots();
    const ring = reachRing(pier, "LF", -90);
    // Mount z −8 mm, so the foot is h = 82 mm below the femur joint; c 30, f 60, t 100.
    expect(ring.centerMm).toEqual([85, 50]);
    expect(ring.geometricOuterMm, "outer radius (mm)").toBeCloseTo(30 + Math.sqrt(160 ** 2 - 82 ** 2), 9);
    expect(ring.geometricInnerMm, "inner radius (mm), foot can pass under the coxa").toBe(1);
    expect(ring.startDeg).toBe(45 + 2 - 45);
    expect(ring.endDeg).toBe(45 + 2 + 45);
  });

  it("its edges are where the foot stops being reachable inside the limits, for every demo leg", () => {
    const problems: string[] = [];
    for (const robot of loadDemoRobots()) {
      for (const leg of robot.legs) {
        const z = -robot.standHeight;
        const ring = reachRing(robot, leg.id, z);
        const direction = leg.mount.yawDeg + leg.joints.coxa.zeroOffsetDeg;
        const fits = (radius: number) => {
          const solution = solveLeg(robot, leg.id, along(ring.centerMm, direction, radius, z));
          return solution.reachable && solution.violations.length === 0;
        };
        if (!ring.reachable) problems.push(`${leg.id}: no reach at standHeight`);
        if (!fits(ring.outerMm - 0.01) || fits(ring.outerMm + 0.01)) problems.push(`${robot.name} ${leg.id}: outer edge ${ring.outerMm} mm`);
        if (!fits(ring.innerMm + 0.01)) problems.push(`${robot.name} ${leg.id}: inner edge ${ring.innerMm} mm`);
        if (ring.innerMm > 1 && fits(ring.innerMm - 0.01)) problems.push(`${robot.name} ${leg.id}: inner edge ${ring.innerMm} mm`);
        const geometric = solveLeg(robot, leg.id, along(ring.centerMm, direction, ring.geometricOuterMm + 0.01, z));
        if (geometric.reachable) problems.push(`${robot.name} ${leg.id}: reachable past the geometric outer edge`);
      }
    }
    expect(problems).toEqual([]);
  });

  it("is empty above the leg's reach", () => {
    const [pier] = loadDemoRobots();
    const ring = reachRing(pier, "LF", -500);
    expect(ring).toMatchObject({ reachable: false, innerMm: 0, outerMm: 0, geometricInnerMm: 0, geometricOuterMm: 0 });
  });
});

describe("neutralStance", () => {
  it("puts every foot on the ground at standHeight, along its mount yaw, reachable inside the limits", () => {
    for (const robot of loadDemoRobots()) {
      const stance = neutralStance(robot);
      expect(Object.keys(stance)).toEqual(robot.legs.map((leg) => leg.id));
      for (const leg of robot.legs) {
        const foot = stance[leg.id];
        expect(foot[2], `${leg.id} foot height (mm)`).toBe(-robot.standHeight);
        const solution = solveLeg(robot, leg.id, foot);
        expect(solution, `${robot.name} ${leg.id}`).toMatchObject({ reachable: true, violations: [] });
        expect(solution.angles.coxa, `${leg.id} coxa servo (°) along the mount yaw`).toBeCloseTo(-leg.joints.coxa.zeroOffsetDeg, 9);
      }
    }
  });

  it("takes another body height", () => {
    const [pier] = loadDemoRobots();
    const low = neutralStance(pier, 60);
    expect(low.LF[2]).toBe(-60);
    expect(solveLeg(pier, "LF", low.LF)).toMatchObject({ reachable: true, violations: [] });
  });
});

/** What the 0.5 mm scan gave, per ring and per neutral stance (fixtures/reach-scan-0.5mm.json). */
type ReachScan = {
  rings: { robot: string; leg: string; footZMm: number; innerMm: number; outerMm: number; reachable: boolean }[];
  stances: { robot: string; bodyHeightMm: number; feet: Record<string, number[]> }[];
};
// The fixture's feet objects differ in their leg ids, which JSON module typing keeps apart.
const reachScan = reachScanJson as unknown as ReachScan;

// The pier crawler with every length (links, mounts, CoM, stand height) scaled by `factor`.
function scaledPier(factor: number): Robot {
  const json = demoRobotJson("pier-crawler");
  json.standHeight *= factor;
  json.body.com = [json.body.com[0] * factor, json.body.com[1] * factor, json.body.com[2] * factor];
  for (const leg of json.legs) {
    for (const axis of ["x", "y", "z"] as const) leg.mount[axis] *= factor;
    leg.coxa *= factor;
    leg.femur *= factor;
    leg.tibia *= factor;
  }
  const parsed = parseRobot(json);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.robot;
}

/** Median time (ms) of `run` over batches of `calls` calls. */
function medianMs(run: () => void, calls: number, batches = 9): number {
  const times: number[] = [];
  for (let batch = 0; batch < batches; batch += 1) {
    const start = performance.now();
    for (let call = 0; call < calls; call += 1) run();
    times.push((performance.now() - start) / calls);
  }
  return times.sort((a, b) => a - b)[Math.floor(batches / 2)];
}

describe("the reach ring's edges, found in closed form", () => {
  it("are the 0.5 mm scan's that it replaced, within that scan's 1e-3 mm edge tolerance, for the demo robots (fixture from the scan)", () => {
    const robots = Object.fromEntries(DEMO_ROBOT_FILES.map((file) => [file, loadDemoRobot(file)]));
    const problems: string[] = [];
    for (const old of reachScan.rings) {
      const ring = reachRing(robots[old.robot], old.leg, old.footZMm);
      const where = `${old.robot} ${old.leg} at z ${old.footZMm} mm`;
      if (ring.reachable !== old.reachable) problems.push(`${where}: reachable ${ring.reachable}, the scan said ${old.reachable}`);
      if (Math.abs(ring.innerMm - old.innerMm) > 1e-3) problems.push(`${where}: inner ${ring.innerMm} mm, the scan ${old.innerMm} mm`);
      if (Math.abs(ring.outerMm - old.outerMm) > 1e-3) problems.push(`${where}: outer ${ring.outerMm} mm, the scan ${old.outerMm} mm`);
    }
    for (const old of reachScan.stances) {
      const feet = neutralStance(robots[old.robot], old.bodyHeightMm);
      for (const [legId, foot] of Object.entries(old.feet)) {
        const off = Math.hypot(...foot.map((value, axis) => feet[legId][axis] - value));
        if (off > 1e-3) problems.push(`${old.robot} ${legId} neutral foot at body height ${old.bodyHeightMm} mm: ${off} mm from the scan's`);
      }
    }
    expect(reachScan.rings.length).toBeGreaterThan(250);
    expect(problems).toEqual([]);
  });

  it("agree with a dense scan written here (20 000 steps, edges bisected) on random legs from 1 mm to 2 000 mm, random limits and offsets", () => {
    const random = seededRandom(2024);
    const problems: string[] = [];
    for (let sample = 0; sample < 60; sample += 1) {
      const json = demoRobotJson("pier-crawler");
      const leg = json.legs[0];
      const length = () => Math.round(Math.exp(random.between(0, Math.log(2000))) * 10) / 10;
      [leg.coxa, leg.femur, leg.tibia] = [length(), length(), length()];
      for (const name of ["femur", "tibia"] as const) {
        const joint = leg.joints[name];
        joint.minDeg = Math.round(random.between(-180, 60));
        joint.maxDeg = Math.round(random.between(joint.minDeg + 5, 180));
        joint.zeroOffsetDeg = Math.round(random.between(-180, 180));
      }
      json.rest = undefined;
      const parsed = parseRobot(json);
      if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
      const robot = parsed.robot;
      const reach = leg.femur + leg.tibia;
      const footZMm = leg.mount.z + random.between(-reach, reach);
      const ring = reachRing(robot, leg.id, footZMm);
      const direction = leg.mount.yawDeg + leg.joints.coxa.zeroOffsetDeg;
      // Inside the femur and tibia limits; the coxa's own limits do not count for the ring's radii.
      const fits = (radius: number) => {
        const solution = solveLeg(robot, leg.id, along(ring.centerMm, direction, radius, footZMm));
        return solution.reachable && solution.violations.every((violation) => violation.joint === "coxa");
      };
      const from = ring.geometricInnerMm;
      const to = ring.geometricOuterMm;
      const steps = 20_000;
      let first = -1;
      let last = -1;
      for (let step = 0; step <= steps && to > from; step += 1) {
        const radius = from + ((to - from) * step) / steps;
        if (!fits(radius)) continue;
        if (first < 0) first = step;
        last = step;
      }
      const edge = (outsideStep: number, insideStep: number) => {
        let outside = from + ((to - from) * outsideStep) / steps;
        let inside = from + ((to - from) * insideStep) / steps;
        for (let i = 0; i < 80; i += 1) {
          const middle = (inside + outside) / 2;
          if (fits(middle)) inside = middle;
          else outside = middle;
        }
        return inside;
      };
      const where = `legs ${leg.coxa}/${leg.femur}/${leg.tibia} mm, femur ${leg.joints.femur.minDeg}..${leg.joints.femur.maxDeg}° +${leg.joints.femur.zeroOffsetDeg}°, tibia ${leg.joints.tibia.minDeg}..${leg.joints.tibia.maxDeg}° +${leg.joints.tibia.zeroOffsetDeg}°, z ${footZMm.toFixed(3)} mm`;
      if (first < 0) {
        if (ring.reachable) problems.push(`${where}: the scan finds nothing, the ring ${ring.innerMm}..${ring.outerMm} mm`);
        continue;
      }
      const inner = first === 0 ? from : edge(first - 1, first);
      const outer = last === steps ? to : edge(last + 1, last);
      const tolerance = 1e-6 * reach;
      if (!ring.reachable || Math.abs(ring.innerMm - inner) > tolerance || Math.abs(ring.outerMm - outer) > tolerance) {
        problems.push(`${where}: the ring ${ring.reachable ? `${ring.innerMm}..${ring.outerMm}` : "empty"}, the scan ${inner}..${outer} mm`);
      }
    }
    expect(problems).toEqual([]);
  });

  it("cost the same for a 50 mm and a 2 000 mm leg: a fixed amount of work per leg, whatever its size", () => {
    const small = scaledPier(0.5); // tibia 50 mm
    const large = scaledPier(20); // tibia 2 000 mm
    // Both at the same place in their reach, so only the size differs.
    const smallMs = medianMs(() => neutralStance(small), 200);
    const largeMs = medianMs(() => neutralStance(large), 200);
    expect(largeMs / smallMs, `neutral stance ${smallMs.toFixed(4)} ms for 50 mm legs, ${largeMs.toFixed(4)} ms for 2 000 mm legs`).toBeLessThan(3);
    for (const robot of [small, large]) {
      for (const leg of robot.legs) expect(solveLeg(robot, leg.id, neutralStance(robot)[leg.id]), `${robot.name} ${leg.id}`).toMatchObject({ reachable: true });
    }
  });
});
