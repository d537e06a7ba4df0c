import { describe, expect, it } from "vitest";
import { forwardLeg, neutralStance } from "~/kinematics/index";
import { FLAG_KINDS, GaitInputError, generateGait, parseSequence, solveSequence, type Sequence } from "~/gait/index";
import { SEQUENCE_FORMAT } from "~/gait/sequence";
import { DEMO_ROBOTS, loadDemoRobot, type DemoRobotFile } from "../support/robots";
import { numbersIn, worldFoot } from "./helpers";

function parsed(json: unknown): Sequence {
  const result = parseSequence(json);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.sequence;
}

describe("solveSequence: frames (DESIGN.md, Gait sequence)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const gait = generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 1200, fps: 50 });

  it("a loop has frames 0..N−1 with N = round(cycleMs·fps/1000), at i·1000/fps ms", () => {
    const solved = solveSequence(robot, gait);
    expect(solved.frames).toHaveLength(60);
    expect(solved.summary.frames).toBe(60);
    solved.frames.forEach((frame, index) => {
      expect(frame.index).toBe(index);
      expect(frame.timeMs).toBeCloseTo(index * 20, 9);
    });
  });

  it("a one-shot move has frames 0..N, the last at t = 1", () => {
    const move = parsed({ ...gait, loop: false });
    const solved = solveSequence(robot, move);
    expect(solved.frames).toHaveLength(61);
    expect(solved.frames[60].timeMs).toBeCloseTo(1200, 9);
  });

  it("the fps option re-solves at another rate (not interpolated): 30 fps gives 36 frames on the same path", () => {
    const at30 = solveSequence(robot, gait, { fps: 30 });
    const at60 = solveSequence(robot, gait, { fps: 60 });
    expect(at30.frames).toHaveLength(36);
    expect(at30.summary.fps).toBe(30);
    // Frame 12 at 30 fps and frame 24 at 60 fps are both t = 1/3.
    expect(at30.frames[12].legs.LF.angles.femur).toBeCloseTo(at60.frames[24].legs.LF.angles.femur, 9);
  });

  it("body at the world origin and standHeight at frame 0, leg tables in servo degrees and µs", () => {
    const frame = solveSequence(robot, gait).frames[0];
    expect(frame.body).toEqual({ x: 0, y: 0, z: 90, roll: 0, pitch: 0, yaw: 0 });
    expect(Object.keys(frame.legs)).toEqual(["LF", "LM", "LR", "RF", "RM", "RR"]);
    for (const leg of Object.values(frame.legs)) {
      expect(leg.reachable).toBe(true);
      expect(Object.keys(leg.angles)).toEqual(["coxa", "femur", "tibia"]);
      for (const us of Object.values(leg.pulses)) expect(us).toBeGreaterThan(500);
    }
  });

  it("summary: duty factor per leg from the keys, stride, body speed, peak speeds and a clean flag count", () => {
    const { summary, flags } = solveSequence(robot, gait);
    expect(flags).toEqual([]);
    expect(summary.flagsByKind).toEqual({});
    expect(summary.errors + summary.warnings).toBe(0);
    for (const legId of Object.keys(gait.legs)) expect(summary.dutyFactor[legId]).toBeCloseTo(0.5, 12);
    expect(summary.strideMm).toBe(40);
    expect(summary.bodySpeedMmS).toBeCloseTo(40 / 1.2, 9);
    expect(summary.peakSpeedDegS.LF.femur).toBeGreaterThan(0);
    expect(summary.worstMarginMm).toBeGreaterThan(10);
    expect(summary.speedHeadroom).toBeGreaterThan(1);
    // Headroom = min over joints of maxSpeedDegS / peak speed.
    const expected = Math.min(
      ...robot.legs.flatMap((leg) =>
        (["coxa", "femur", "tibia"] as const).map((joint) => leg.joints[joint].maxSpeedDegS / summary.peakSpeedDegS[leg.id][joint]),
      ),
    );
    expect(summary.speedHeadroom).toBeCloseTo(expected, 12);
  });

  it("keys without a foot take the generator's placement: neutral stance ± half the body's travel during the stance", () => {
    const keys = {
      keys: [
        { t: 0, contact: "swing" },
        { t: 0.5, contact: "stance" },
      ],
    };
    const bare = parsed({
      format: SEQUENCE_FORMAT,
      cycleMs: 1200,
      fps: 50,
      loop: true,
      generator: { strideMm: 40 },
      legs: Object.fromEntries(robot.legs.map((leg) => [leg.id, keys])),
    });
    const frames = solveSequence(robot, bare, { checks: [] }).frames;
    const neutral = neutralStance(robot, robot.standHeight);
    // At touch-down (frame 30) the foot is 10 mm ahead of neutral (β·stride/2), at lift-off (frame 0) 10 mm behind.
    expect(frames[30].legs.LF.foot[0] - neutral.LF[0]).toBeCloseTo(10, 9);
    expect(frames[0].legs.LF.foot[0] - neutral.LF[0]).toBeCloseTo(-10, 9);
    expect(frames[0].legs.LF.foot[1]).toBeCloseTo(neutral.LF[1], 9);
  });

  it("a one-shot move holds its first key's foot (world-fixed) before the first key and its last after the last", () => {
    const foot = gait.legs.LF.keys[0].foot!;
    const late = parsed({
      ...gait,
      loop: false,
      legs: {
        ...gait.legs,
        LF: {
          keys: [
            { t: 0.25, contact: "stance", foot },
            { t: 0.5, contact: "swing", foot },
            { t: 0.75, contact: "stance", foot: [foot[0] + 20, foot[1], foot[2]] },
          ],
        },
      },
    });
    const frames = solveSequence(robot, late, { checks: [] }).frames;
    // Frames 0..14 hold the foot where key 0 puts it at t = 0.25, fixed in the world.
    const anchor = worldFoot(frames[15], "LF");
    for (let frame = 0; frame < 15; frame += 1) {
      expect(Math.hypot(...worldFoot(frames[frame], "LF").map((v, i) => v - anchor[i])), `frame ${frame}`).toBeLessThan(1e-9);
      expect(frames[frame].legs.LF.contact).toBe("stance");
    }
    const end = worldFoot(frames[45], "LF");
    for (let frame = 45; frame <= 60; frame += 1) expect(Math.hypot(...worldFoot(frames[frame], "LF").map((v, i) => v - end[i]))).toBeLessThan(1e-9);
  });

  it("the angles put each reachable foot where the frame says, to 1e-6 mm (the kinematics' forwardLeg, moved body frame)", () => {
    const turning = generateGait(robot, {
      template: "ripple",
      strideMm: 50,
      turnDegPerCycle: 25,
      bodyKeys: [
        { t: 0, pose: { roll: 3, z: -8 } },
        { t: 0.5, pose: { pitch: -4, yaw: 6, x: 5 } },
      ],
    });
    for (const frame of solveSequence(robot, turning, { checks: [] }).frames) {
      for (const [legId, leg] of Object.entries(frame.legs)) {
        const foot = forwardLeg(robot, legId, leg.angles);
        const error = Math.hypot(...foot.map((value, i) => value - leg.foot[i]));
        expect(error, `frame ${frame.index} ${legId}: forwardLeg(angles) is ${error} mm from the frame's foot`).toBeLessThan(1e-6);
      }
    }
  });

  it("a frame exactly on a key takes the key's contact (half-open)", () => {
    const frames = solveSequence(robot, gait, { checks: [] }).frames;
    expect(frames[0].legs.LF.contact).toBe("swing");
    expect(frames[30].legs.LF.contact).toBe("stance");
    expect(frames[29].legs.LF.contact).toBe("swing");
  });

  it("refuses a sequence whose legs do not match the robot, naming the legs", () => {
    const quad = loadDemoRobot(DEMO_ROBOTS.four);
    expect(() => solveSequence(quad, gait)).toThrow(GaitInputError);
    expect(() => solveSequence(quad, gait)).toThrow(/legs\.LM: names no leg of robot "Quay walker"/);
  });

  it("lists the flag kinds of DESIGN.md", () => {
    // Written out as DESIGN.md lists them, in its order.
    const designed =
      "unreachable joint-limit joint-speed pulse-range ground-penetration foot-slip support-count com-outside low-margin leg-clearance loop-jump";
    expect([...FLAG_KINDS].sort()).toEqual(designed.split(" ").sort());
  });
});

describe("no NaN anywhere, and plain JSON", () => {
  const cases: [string, DemoRobotFile, Record<string, unknown>][] = [
    ["tripod, everything out of reach (stride 900 mm)", DEMO_ROBOTS.six, { template: "tripod", strideMm: 900 }],
    ["wave lifting too many legs, turning hard", DEMO_ROBOTS.six, { template: "wave", dutyFactor: 0.3, strideMm: 80, turnDegPerCycle: 90 }],
    [
      "trot on the spot, crouching",
      DEMO_ROBOTS.four,
      {
        template: "trot",
        strideMm: 0,
        bodyKeys: [
          { t: 0, pose: { z: -40 } },
          { t: 0.5, pose: { z: 60, pitch: 30 } },
        ],
      },
    ],
    ["eight legs, body far too high", DEMO_ROBOTS.eight, { template: "wave", bodyHeightMm: 400 }],
  ];
  for (const [name, file, params] of cases) {
    it(name, () => {
      const robot = loadDemoRobot(file);
      const solved = solveSequence(robot, generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, ...params } as never));
      const numbers = numbersIn(solved);
      expect(numbers.length).toBeGreaterThan(1000);
      expect(
        numbers.filter((value) => !Number.isFinite(value)),
        "non-finite numbers",
      ).toEqual([]);
      expect(JSON.parse(JSON.stringify(solved))).toEqual(solved);
      for (const frame of solved.frames) for (const legId of Object.keys(frame.legs)) expect(worldFoot(frame, legId).every(Number.isFinite)).toBe(true);
    });
  }
});
