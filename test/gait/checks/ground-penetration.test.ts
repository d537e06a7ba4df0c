import { describe, expect, it } from "vitest";
import { generateGait, parseSequence, solveSequence, type Sequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { worldFoot } from "../helpers";

// ground-penetration: a foot below the ground plane z = 0 (DESIGN.md: the ground is the world's z = 0).
describe("ground-penetration: a stance key 5 mm below the ground", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const gait = generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 1200, fps: 50 });
  const json = structuredClone(gait) as Sequence;
  const touchDown = json.legs.LF.keys.find((key) => key.contact === "stance")!;
  touchDown.foot = [touchDown.foot![0], touchDown.foot![1], touchDown.foot![2] - 5];
  const parsed = parseSequence(json);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const solved = solveSequence(robot, parsed.sequence);

  it("flags LF in every frame its foot is more than 0.01 mm under the ground, with the depth", () => {
    const expected = solved.frames.filter((frame) => worldFoot(frame, "LF")[2] < -0.01).map((frame) => frame.index);
    // The stance (frames 30..59) and the end of the swing that comes down to the key.
    expect(expected).toEqual(expect.arrayContaining(Array.from({ length: 30 }, (_, i) => 30 + i)));
    const flags = solved.flags.filter((flag) => flag.kind === "ground-penetration");
    expect(flags.map((flag) => flag.frame)).toEqual(expected);
    const inStance = flags.find((flag) => flag.frame === 40)!;
    expect(inStance.value).toBeCloseTo(5, 9);
    expect(inStance.message).toBe("LF foot 5.0 mm below the ground at frame 40");
    expect(inStance.severity).toBe("error");
  });
});
