import { describe, expect, it } from "vitest";
import { JOINT_NAMES } from "~/kinematics/index";
import { generateGait, parseSequence, solveSequence } from "~/gait/index";
import { SEQUENCE_FORMAT } from "~/gait/sequence";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";

// loop-jump (warning): the step from the last frame back to the first turns a
// joint faster than its limit. A leg that never lifts while the body travels
// cannot close the loop: its foot stays put in the world and must jump back.
describe("loop-jump and the seam's foot-slip: a leg that never lifts while the body walks", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const gait = generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 1200, fps: 50 });
  const parsed = parseSequence({
    ...gait,
    format: SEQUENCE_FORMAT,
    legs: { ...gait.legs, LF: { keys: [{ t: 0, contact: "stance", foot: gait.legs.LF.keys[0].foot }] } },
  });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const solved = solveSequence(robot, parsed.sequence);

  it("warns at frame 0 for each LF joint whose seam step is faster than its limit, and nowhere else", () => {
    const jumps = solved.flags.filter((flag) => flag.kind === "loop-jump");
    const last = solved.frames[solved.frames.length - 1].legs.LF.angles;
    const first = solved.frames[0].legs.LF.angles;
    const expected = JOINT_NAMES.filter((joint) => Math.abs(first[joint] - last[joint]) * 50 > robot.legs[0].joints[joint].maxSpeedDegS);
    expect(expected.length).toBeGreaterThan(0);
    expect(jumps.map((flag) => `${flag.frame} ${flag.leg} ${flag.joint}`)).toEqual(expected.map((joint) => `0 LF ${joint}`));
    expect(jumps[0].severity).toBe("warning");
    expect(jumps[0].message).toMatch(/^LF \w+ jumps \d+\.\d° from the last frame \(59\) back to frame 0, \d+ °\/s, limit \d+ °\/s$/);
  });

  it("reports the seam's foot slip (the stride) at frame 0 only", () => {
    const slips = solved.flags.filter((flag) => flag.kind === "foot-slip");
    expect(slips.map((flag) => `${flag.frame} ${flag.leg}`)).toEqual(["0 LF"]);
    expect(slips[0].value).toBeCloseTo(40, 6);
    expect(slips[0].message).toBe("LF stance foot slips 40.0 mm at frame 0 (from the last frame round to the first), tolerance 0.5 mm");
  });

  it("a generated gait closes its loop: no loop-jump, no slip", () => {
    const plain = solveSequence(robot, gait);
    expect(plain.flags.filter((flag) => flag.kind === "loop-jump" || flag.kind === "foot-slip")).toEqual([]);
  });
});
