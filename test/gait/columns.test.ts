import { describe, expect, it } from "vitest";
import { COLUMNS_LAYOUT, columnsOf, decodeColumns, encodeColumns, generateGait, runSolve, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";

describe("the column layout of a solve (compact transfer form)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const sequence = generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 1200, fps: 50, turnDegPerCycle: 12 });
  const solved = solveSequence(robot, sequence);
  const columns = columnsOf(runSolve(robot, sequence));
  // Through JSON and back, as a client receives it.
  const received = decodeColumns(JSON.parse(JSON.stringify(encodeColumns(columns))));

  it("holds every frame's numbers as the nearest float32, after the trip through base64 and JSON", () => {
    expect(received.layout).toBe(COLUMNS_LAYOUT);
    expect(received.frames).toBe(solved.frames.length);
    solved.frames.forEach((frame, i) => {
      expect(received.body.x[i]).toBe(Math.fround(frame.body.x));
      expect(received.body.yaw[i]).toBe(Math.fround(frame.body.yaw));
      expect(received.com.y[i]).toBe(Math.fround(frame.com[1]));
      for (const legId of received.legs) {
        const leg = frame.legs[legId];
        expect(received.leg[legId].contact[i]).toBe(leg.contact === "stance" ? "s" : "w");
        expect(received.leg[legId].angles.femur[i]).toBe(Math.fround(leg.angles.femur));
        expect(received.leg[legId].pulses.tibia[i]).toBe(Math.fround(leg.pulses.tibia));
        expect(received.leg[legId].foot.z[i]).toBe(Math.fround(leg.foot[2]));
      }
      const polygon = received.supportPolygons[received.supportIndex[i]];
      expect(polygon).toEqual(frame.support.flatMap(([x, y]) => [Math.round(x * 1e4) / 1e4 || 0, Math.round(y * 1e4) / 1e4 || 0]));
      if (frame.marginMm === null) expect(received.marginMm[i]).toBeNaN();
      else expect(received.marginMm[i]).toBe(Math.fround(frame.marginMm));
    });
    expect(received.flags).toEqual(solved.flags);
    expect(received.summary).toEqual(solved.summary);
  });

  it("marks the frames where a leg was out of reach", () => {
    const tooLong = generateGait(robot, { template: "tripod", strideMm: 400, cycleMs: 1200, fps: 50 });
    const expected = solveSequence(robot, tooLong)
      .frames.filter((frame) => !frame.legs.LF.reachable)
      .map((frame) => frame.index);
    expect(expected.length).toBeGreaterThan(0);
    expect(columnsOf(runSolve(robot, tooLong)).leg.LF.unreachableFrames).toEqual(expected);
  });

  it("stores each distinct support polygon once, encodes the same with Buffer and with btoa, and is far smaller than the frame layout", () => {
    expect(columns.supportPolygons.length).toBeLessThan(solved.frames.length);
    const withBuffer = encodeColumns(columns, (bytes) => Buffer.from(bytes).toString("base64"));
    expect(withBuffer).toEqual(encodeColumns(columns));
    expect(JSON.stringify(withBuffer).length).toBeLessThan(JSON.stringify(solved).length / 3);
  });
});
