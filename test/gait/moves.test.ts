import { describe, expect, it } from "vitest";
import { JOINT_NAMES, type Robot } from "~/kinematics/index";
import { GaitInputError, generateGait, solveSequence, type SolvedSequence } from "~/gait/index";
import { generateEntryMove, generateExitMove } from "~/gait/moves";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";
import { numbersIn } from "./helpers";

// Entry and exit moves: from the robot's rest pose into the gait's first frame
// and back, one-shot, timed so that no joint exceeds half its maxSpeedDegS.
function peakFraction(robot: Robot, solved: SolvedSequence): number {
  let peak = 0;
  for (const leg of robot.legs) {
    for (const joint of JOINT_NAMES) {
      peak = Math.max(peak, solved.summary.peakSpeedDegS[leg.id][joint] / leg.joints[joint].maxSpeedDegS);
    }
  }
  return peak;
}

describe("entry and exit moves", () => {
  for (const [file, template] of [
    [DEMO_ROBOTS.six, "tripod"],
    [DEMO_ROBOTS.four, "wave"],
    [DEMO_ROBOTS.eight, "alternating-tetrapod"],
  ] as const) {
    const robot = loadDemoRobot(file);
    const gait = generateGait(robot, { template, strideMm: 40, turnDegPerCycle: 10, cycleMs: 2000, fps: 50 });
    const gaitFirst = solveSequence(robot, gait).frames[0];

    it(`${robot.name}: entry starts at the rest angles, ends in the gait's first frame, at most 50% of any joint's speed, no error`, () => {
      const entry = generateEntryMove(robot, gait);
      expect(entry.loop).toBe(false);
      const solved = solveSequence(robot, entry);
      const first = solved.frames[0];
      const last = solved.frames[solved.frames.length - 1];
      for (const leg of robot.legs) {
        for (const joint of JOINT_NAMES) {
          expect(first.legs[leg.id].angles[joint], `${leg.id} ${joint} at frame 0: rest angle`).toBeCloseTo(robot.rest![leg.id][joint], 6);
          expect(last.legs[leg.id].angles[joint], `${leg.id} ${joint} at the end: the gait's first frame`).toBeCloseTo(gaitFirst.legs[leg.id].angles[joint], 6);
        }
        expect(last.legs[leg.id].contact).toBe(gaitFirst.legs[leg.id].contact);
      }
      const fraction = peakFraction(robot, solved);
      expect(fraction, `fastest joint at ${(100 * fraction).toFixed(1)}% of its limit, expected ≤ 50%`).toBeLessThanOrEqual(0.5);
      expect(fraction, "timed close to the limit, not needlessly slow").toBeGreaterThan(0.3);
      expect(solved.flags.filter((flag) => flag.severity === "error").map((flag) => flag.message)).toEqual([]);
      expect(numbersIn(solved).every(Number.isFinite)).toBe(true);
    });

    it(`${robot.name}: exit starts in the gait's first frame and ends at the rest angles, at most 50% of any joint's speed, no error`, () => {
      const solved = solveSequence(robot, generateExitMove(robot, gait));
      const first = solved.frames[0];
      const last = solved.frames[solved.frames.length - 1];
      for (const leg of robot.legs) {
        for (const joint of JOINT_NAMES) {
          expect(first.legs[leg.id].angles[joint], `${leg.id} ${joint} at frame 0`).toBeCloseTo(gaitFirst.legs[leg.id].angles[joint], 6);
          expect(last.legs[leg.id].angles[joint], `${leg.id} ${joint} at the end: rest angle`).toBeCloseTo(robot.rest![leg.id][joint], 6);
        }
      }
      expect(peakFraction(robot, solved)).toBeLessThanOrEqual(0.5);
      expect(solved.flags.filter((flag) => flag.severity === "error").map((flag) => flag.message)).toEqual([]);
    });
  }

  it("a ripple with a leg in the air at its first frame and a crouch: the entry lifts that leg last and lands in the gait's first frame", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.six);
    const gait = generateGait(robot, {
      template: "ripple",
      strideMm: 40,
      bodyKeys: [
        { t: 0, pose: { z: -10, pitch: 3 } },
        { t: 0.5, pose: { z: 0 } },
      ],
    });
    const gaitFirst = solveSequence(robot, gait).frames[0];
    const inAir = Object.entries(gaitFirst.legs).filter(([, leg]) => leg.foot[2] + gaitFirst.body.z > 0.01 && leg.contact === "swing");
    expect(inAir.length).toBeGreaterThan(0);
    const entry = solveSequence(robot, generateEntryMove(robot, gait));
    const last = entry.frames[entry.frames.length - 1];
    expect(last.body.z).toBeCloseTo(gaitFirst.body.z, 9);
    expect(last.body.pitch).toBeCloseTo(gaitFirst.body.pitch, 9);
    for (const legId of Object.keys(gaitFirst.legs)) {
      for (const joint of JOINT_NAMES) expect(last.legs[legId].angles[joint], `${legId} ${joint}`).toBeCloseTo(gaitFirst.legs[legId].angles[joint], 6);
    }
    expect(entry.flags.filter((flag) => flag.severity === "error").map((flag) => flag.message)).toEqual([]);
  });

  it("honours another speed fraction", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.six);
    const gait = generateGait(robot, { template: "tripod" });
    const slow = solveSequence(robot, generateEntryMove(robot, gait, { speedFraction: 0.2 }));
    expect(peakFraction(robot, slow)).toBeLessThanOrEqual(0.2);
  });

  it("needs the robot's rest pose", () => {
    const robot = { ...loadDemoRobot(DEMO_ROBOTS.six), rest: undefined };
    expect(() => generateEntryMove(robot, generateGait(robot, { template: "tripod" }))).toThrow(GaitInputError);
    expect(() => generateEntryMove(robot, generateGait(robot, { template: "tripod" }))).toThrow(/rest: is needed for entry and exit moves/);
  });
});
