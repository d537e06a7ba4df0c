import { describe, expect, it } from "vitest";
import { COLUMNS_LAYOUT, generateGait, solveSequence, toColumns } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "./helpers";

describe("the column layout of a solve (compact transfer form)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const solved = solveSequence(robot, generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 1200, fps: 50, turnDegPerCycle: 12 }));
  const columns = toColumns(solved);

  it("holds every frame's numbers to 0.0001 of their unit", () => {
    expect(columns.layout).toBe(COLUMNS_LAYOUT);
    expect(columns.frames).toBe(solved.frames.length);
    solved.frames.forEach((frame, i) => {
      expect(Math.abs(columns.body.yaw[i] - frame.body.yaw)).toBeLessThanOrEqual(5e-5);
      for (const legId of columns.legs) {
        const leg = frame.legs[legId];
        expect(columns.leg[legId].contact[i]).toBe(leg.contact === "stance" ? "s" : "w");
        expect(Math.abs(columns.leg[legId].angles.femur[i] - leg.angles.femur)).toBeLessThanOrEqual(5e-5);
        expect(Math.abs(columns.leg[legId].pulses.tibia[i] - leg.pulses.tibia)).toBeLessThanOrEqual(5e-5);
        expect(Math.abs(columns.leg[legId].foot.z[i] - leg.foot[2])).toBeLessThanOrEqual(5e-5);
      }
      const polygon = columns.supportPolygons[columns.supportIndex[i]];
      expect(polygon.length).toBe(frame.support.length * 2);
      expect(columns.marginMm[i] === null).toBe(frame.marginMm === null);
    });
  });

  it("stores each distinct support polygon once and is far smaller than the frame layout", () => {
    expect(columns.supportPolygons.length).toBeLessThan(solved.frames.length);
    expect(JSON.stringify(columns).length).toBeLessThan(JSON.stringify(solved).length / 2);
  });
});
