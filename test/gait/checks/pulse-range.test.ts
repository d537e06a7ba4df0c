import { describe, expect, it } from "vitest";
import { angleToPulse, parseRobot, type Robot } from "~/kinematics/index";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";

// pulse-range: the angle asks for a pulse outside the servo's minUs..maxUs; the
// table holds the clamped pulse (DESIGN.md). Expected pulses from the
// kinematics' angleToPulse on the solved angles.
describe("pulse-range: flagged where angleToPulse clamps, and the table holds the clamped pulse", () => {
  const base = loadDemoRobot(DEMO_ROBOTS.six);
  const narrowed = structuredClone(base) as Robot;
  const femur = narrowed.legs[0].joints.femur;
  femur.servo = { ...femur.servo, minUs: femur.servo.centerUs - 150, maxUs: femur.servo.centerUs + 150 };
  const parsed = parseRobot(narrowed);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const robot = parsed.robot;
  const solved = solveSequence(robot, generateGait(robot, { template: "tripod", strideMm: 40, cycleMs: 1200, fps: 50 }));

  it("flags the LF femur in exactly the frames where its pulse is clamped", () => {
    const joint = robot.legs[0].joints.femur;
    const expected = solved.frames.filter((frame) => angleToPulse(joint, frame.legs.LF.angles.femur).clamped).map((frame) => frame.index);
    expect(expected.length).toBeGreaterThan(0);
    const got = solved.flags.filter((flag) => flag.kind === "pulse-range").map((flag) => `${flag.leg} ${flag.joint} ${flag.frame}`);
    expect(got).toEqual(expected.map((frame) => `LF femur ${frame}`));
    for (const frame of solved.frames) {
      const want = angleToPulse(joint, frame.legs.LF.angles.femur).us;
      expect(frame.legs.LF.pulses.femur, `frame ${frame.index}: pulse expected ${want} µs`).toBe(want);
    }
  });

  it("reads in degrees and µs and names the clamped pulse", () => {
    const flag = solved.flags.find((f) => f.kind === "pulse-range")!;
    const { servo } = robot.legs[0].joints.femur;
    expect(flag.severity).toBe("error");
    expect(flag.message).toMatch(
      new RegExp(
        `^LF femur at -?\\d+\\.\\d° at frame ${flag.frame} needs a pulse outside ${servo.minUs}–${servo.maxUs} µs \\(the range ends at -?\\d+\\.\\d°\\); clamped to (${servo.minUs}|${servo.maxUs}) µs$`,
      ),
    );
  });
});
