import { describe, expect, it } from "vitest";
import { checkAngleFrames, generateGait, parseSequence, solveSequence, type SolvedSequence } from "~/gait/index";
import { ANGLE_CHECKS } from "~/gait/angle-frames";
import { SEQUENCE_FORMAT } from "~/gait/sequence";
import type { Robot } from "~/kinematics/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";

/** frame × leg × joint servo degrees of a solved result, legs in robot order. */
function anglesOf(robot: Robot, solved: SolvedSequence): Float64Array {
  const legCount = robot.legs.length;
  const angles = new Float64Array(solved.frames.length * legCount * 3);
  solved.frames.forEach((frame, f) =>
    robot.legs.forEach((leg, l) => {
      const { coxa, femur, tibia } = frame.legs[leg.id].angles;
      angles.set([coxa, femur, tibia], (f * legCount + l) * 3);
    }),
  );
  return angles;
}

describe("checkAngleFrames: the engine's joint checks over angles given frame by frame", () => {
  // A fast walk (joint-speed), LF never lifting (loop-jump at the seam), one
  // narrowed femur range (joint-limit) and one narrowed pulse range (pulse-range).
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  robot.legs[1].joints.femur.maxDeg = 5;
  const { servo } = robot.legs[2].joints.tibia;
  [servo.minUs, servo.maxUs] = [servo.centerUs - 20, servo.centerUs + 20];
  const gait = generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 400, fps: 50 });
  const parsed = parseSequence({
    ...gait,
    format: SEQUENCE_FORMAT,
    legs: { ...gait.legs, LF: { keys: [{ t: 0, contact: "stance", foot: gait.legs.LF.keys[0].foot }] } },
  });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const solved = solveSequence(robot, parsed.sequence, { checks: ANGLE_CHECKS });
  const checked = checkAngleFrames(robot, anglesOf(robot, solved), { fps: 50, loop: true });

  it("flags what solveSequence flags with the same checks, flag for flag (every leg reachable)", () => {
    expect(solved.frames.every((frame) => Object.values(frame.legs).every((leg) => leg.reachable))).toBe(true);
    const kinds = new Set(solved.flags.map((flag) => flag.kind));
    expect([...kinds].sort()).toEqual([...ANGLE_CHECKS].sort());
    expect(checked.flags).toEqual(solved.flags);
  });

  it("sums up the frames as solveSequence does where the feet do not matter: counts, errors, peak speeds, headroom", () => {
    const { summary } = checked;
    expect(summary.frames).toBe(solved.summary.frames);
    expect(summary.fps).toBe(50);
    expect(summary.flagsByKind).toEqual(solved.summary.flagsByKind);
    expect([summary.errors, summary.warnings]).toEqual([solved.summary.errors, solved.summary.warnings]);
    expect(summary.peakSpeedDegS).toEqual(solved.summary.peakSpeedDegS);
    expect(summary.speedHeadroom).toBe(solved.summary.speedHeadroom);
  });

  it("has no foot on the ground: no margin, no stride, duty factor 0 for every leg, not dynamic", () => {
    const { summary } = checked;
    expect([summary.worstMarginMm, summary.worstMarginFrame, summary.strideMm, summary.bodySpeedMmS, summary.dynamic]).toEqual([null, null, 0, 0, false]);
    expect(summary.dutyFactor).toEqual(Object.fromEntries(robot.legs.map((leg) => [leg.id, 0])));
  });

  it("runs only the checks asked for, and loop-jump only for a loop", () => {
    const angles = anglesOf(robot, solved);
    expect(checkAngleFrames(robot, angles, { fps: 50, loop: true, checks: ["joint-speed"] }).flags).toEqual(
      solved.flags.filter((flag) => flag.kind === "joint-speed"),
    );
    expect(checkAngleFrames(robot, angles, { fps: 50 }).flags.some((flag) => flag.kind === "loop-jump")).toBe(false);
  });

  it("takes a value on its limit as inside (the leg solver's tolerance) and 1e-6° past it as outside", () => {
    const still = loadDemoRobot(DEMO_ROBOTS.four);
    const angles = new Float64Array(still.legs.length * 3);
    angles[1] = still.legs[0].joints.femur.maxDeg;
    expect(checkAngleFrames(still, angles, { fps: 50 }).flags).toEqual([]);
    angles[1] += 1e-6;
    expect(checkAngleFrames(still, angles, { fps: 50 }).flags.map((flag) => `${flag.kind} ${flag.leg} ${flag.joint}`)).toEqual(["joint-limit LF femur"]);
  });

  it("refuses part of a frame, a rate that is not positive, and a check that needs the feet", () => {
    expect(() => checkAngleFrames(robot, new Float64Array(17), { fps: 50 })).toThrow("angles must hold whole frames of 18 values (got 17)");
    expect(() => checkAngleFrames(robot, new Float64Array(18), { fps: 0 })).toThrow("fps must be positive (got 0)");
    // @ts-expect-error foot-slip is not a check of the angles alone
    expect(() => checkAngleFrames(robot, new Float64Array(18), { fps: 50, checks: ["foot-slip"] })).toThrow("foot-slip needs the feet, not only the angles");
  });
});
