import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { distance, worldFoot } from "../helpers";

// leg-clearance (warning): neighbouring legs of one side (by the kinematics'
// side and row) whose feet come closer than the clearance.
describe("leg-clearance with a clearance of 140 mm", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const solved = solveSequence(robot, generateGait(robot, { template: "ripple", strideMm: 60, cycleMs: 1200, fps: 50 }), { clearanceMm: 140 });
  const pairs = [
    ["LF", "LM"],
    ["LM", "LR"],
    ["RF", "RM"],
    ["RM", "RR"],
  ];

  it("flags exactly the neighbour pairs and frames closer than 140 mm (world feet by three.js)", () => {
    const expected: string[] = [];
    for (const frame of solved.frames) {
      for (const [a, b] of pairs) if (distance(worldFoot(frame, a), worldFoot(frame, b)) < 140) expected.push(`${frame.index} ${a}`);
    }
    expect(expected.length).toBeGreaterThan(0);
    const flags = solved.flags.filter((flag) => flag.kind === "leg-clearance");
    expect(flags.map((flag) => `${flag.frame} ${flag.leg}`).sort()).toEqual(expected.sort());
    expect(new Set(flags.map((flag) => flag.severity))).toEqual(new Set(["warning"]));
    expect(flags[0].message).toMatch(/^[LR][FM] and [LR][MR] feet \d+\.\d mm apart at frame \d+, clearance 140\.0 mm$/);
  });

  it("raises none at the default clearance of 20 mm", () => {
    const plain = solveSequence(robot, generateGait(robot, { template: "ripple", strideMm: 60, cycleMs: 1200, fps: 50 }));
    expect(plain.flags.filter((flag) => flag.kind === "leg-clearance")).toEqual([]);
  });
});
