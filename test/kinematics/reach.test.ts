import { describe, expect, it } from "vitest";
import { neutralStance, reachRing, solveLeg, type Vec3 } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";

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
