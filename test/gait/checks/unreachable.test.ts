import { describe, expect, it } from "vitest";
import { findLeg } from "~/kinematics/index";
import { generateGait, parseSequence, solveSequence, type Sequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { flaggedFrames, numbersIn } from "../helpers";

// unreachable: beyond full extension (femur + tibia from the femur joint,
// DESIGN.md "Closed-form IK"); the leg keeps its last reachable angles, so no
// table holds a NaN, and a stance leg that cannot follow its plan slips.
describe("unreachable and foot-slip: a touch-down key far out of reach", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const gait = generateGait(robot, { template: "tripod", strideMm: 120, cycleMs: 1200, fps: 50 });
  const json = structuredClone(gait) as Sequence;
  const touchDown = json.legs.LF.keys.find((key) => key.contact === "stance")!;
  // 67 mm further forward: the foot lands out of reach and comes back into reach as the body walks over it.
  touchDown.foot = [touchDown.foot![0] + 67, touchDown.foot![1], touchDown.foot![2]];
  const parsed = parseSequence(json);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const solved = solveSequence(robot, parsed.sequence);
  const leg = findLeg(robot, "LF");

  // Distance of a body-frame foot from LF's femur joint, from the leg's dimensions alone.
  function reachNeeded(foot: readonly number[]): number {
    const dx = foot[0] - leg.mount.x;
    const dy = foot[1] - leg.mount.y;
    return Math.hypot(Math.hypot(dx, dy) - leg.coxa, foot[2] - leg.mount.z);
  }

  it("flags exactly the frames whose planned LF foot lies beyond femur + tibia", () => {
    const expected = solved.frames.filter((frame) => reachNeeded(frame.legs.LF.foot) > leg.femur + leg.tibia).map((frame) => frame.index);
    expect(expected.length).toBeGreaterThan(5);
    expect(expected.length).toBeLessThan(50);
    expect(flaggedFrames(solved.flags, "unreachable", "LF")).toEqual(expected);
    for (const frame of expected) expect(solved.frames[frame].legs.LF.reachable, `frame ${frame}`).toBe(false);
    const flag = solved.flags.find((f) => f.kind === "unreachable")!;
    expect(flag.value).toBeCloseTo(reachNeeded(solved.frames[flag.frame].legs.LF.foot), 9);
    expect(flag.limit).toBe(leg.femur + leg.tibia);
    expect(flag.message).toBe(
      `LF cannot reach its foot target at frame ${flag.frame}: the foot is ${flag.value.toFixed(1)} mm from the femur joint, beyond full extension (160.0 mm); it keeps its last reachable angles`,
    );
  });

  it("keeps the last reachable angles (never NaN) and reports the stance foot slipping by the body's travel", () => {
    const unreachable = flaggedFrames(solved.flags, "unreachable", "LF");
    const first = unreachable[0];
    for (const frame of unreachable) {
      expect(solved.frames[frame].legs.LF.angles, `frame ${frame}: kept angles`).toEqual(solved.frames[first - 1].legs.LF.angles);
    }
    expect(numbersIn(solved).every(Number.isFinite), "every number in the result is finite").toBe(true);
    const slips = solved.flags.filter((flag) => flag.kind === "foot-slip" && flag.leg === "LF");
    expect(slips.length).toBeGreaterThan(0);
    for (const slip of slips) {
      expect(solved.frames[slip.frame].legs.LF.contact).toBe("stance");
      expect(slip.message).toBe(`LF stance foot slips ${slip.value.toFixed(1)} mm at frame ${slip.frame}, tolerance 0.5 mm`);
    }
    // Kept angles ride along with the body: the foot slips by the body's travel per frame, 120 mm / 60 frames.
    const steady = slips.find((slip) => unreachable.includes(slip.frame) && unreachable.includes(slip.frame - 1))!;
    expect(steady.value).toBeCloseTo(120 / 60, 6);
  });
});
