import { describe, expect, it } from "vitest";
import { angleTable, centreTable, sweepTable, TableExportError } from "~/export/index";
import { JOINT_NAMES, neutralStance, solveLeg } from "~/kinematics/index";
import { DEMO_ROBOT_FILES, loadDemoRobot } from "../support/robots";
import { OVERRIDE, metaFor, modifiedRobot, readJsonTable } from "./helpers";

/** The fastest step between frames of one joint, worked out here from the frames: max |Δangle| · fps, °/s. */
function peakSpeedDegS(frames: { legs: Record<string, { angles: Record<string, number> }> }[], legId: string, joint: string, fps: number): number {
  let peak = 0;
  for (let i = 1; i < frames.length; i += 1)
    peak = Math.max(peak, Math.abs(frames[i].legs[legId].angles[joint] - frames[i - 1].legs[legId].angles[joint]) * fps);
  return peak;
}

// Issue 8: bench test tables for bring-up, checked for speed like any sequence (the joint-speed rule of DESIGN.md).
describe("bench tables for bring-up (issue 8), checked for speed like any sequence", () => {
  const robot = loadDemoRobot("pier-crawler");

  it("centre: every servo at 0 servo degrees, i.e. its centerUs, for seconds · fps frames, no flags", () => {
    const centre = centreTable(robot, { seconds: 1.5, fps: 40 });
    expect(centre.frames.length).toBe(60);
    expect(centre.flags).toEqual([]);
    const deg = readJsonTable(
      angleTable(robot, centre, { format: "json", units: "deg", meta: metaFor({ robot }, { gaitName: centre.name, gaitVersion: "bench", loop: centre.loop }) }),
    );
    for (const frame of deg.frames)
      expect(
        frame.values.every((value) => value === 0),
        `frame ${frame.index}: all 0°`,
      ).toBe(true);
    const us = readJsonTable(angleTable(robot, centre, { format: "json", units: "us", meta: metaFor({ robot }, { gaitName: centre.name }) }));
    const centres = us.channels.map((channel) => robot.legs.find((leg) => leg.id === channel.leg)!.joints[channel.joint as "coxa"].servo.centerUs);
    for (const frame of us.frames) expect(frame.values, `frame ${frame.index}: each servo's centerUs`).toEqual(centres);
  });

  it("centre of a joint whose limits exclude 0° is flagged joint-limit; a calibration trim moves the centre pulse", () => {
    const shifted = modifiedRobot(robot, (json) => {
      json.legs[0].joints.tibia.minDeg = 5;
      if (json.rest) json.rest.LF.tibia = Math.max(json.rest.LF.tibia, 5);
    });
    const centre = centreTable(shifted, { seconds: 0.1, fps: 50 });
    expect(centre.flags.length).toBe(5);
    expect(centre.flags.every((flag) => flag.kind === "joint-limit" && flag.leg === "LF" && flag.joint === "tibia")).toBe(true);
    const trimmed = readJsonTable(
      angleTable(robot, centreTable(robot, { seconds: 0.1 }), {
        format: "json",
        units: "us",
        meta: metaFor({ robot }, { gaitName: "centre" }),
        calibration: { name: "SN-3", joints: { LF: { coxa: { trimDeg: 2 } } } },
      }),
    );
    expect(trimmed.frames[0].values[0], "LF.coxa: 1500 µs + 2° × 11.1 µs/°").toBe(Math.round(1500 + 2 * 11.1));
  });

  for (const file of DEMO_ROBOT_FILES) {
    it(`${file}: every joint's sweep goes centre → min → max → centre at ≤ ¼ of its maxSpeedDegS, others held at the neutral stance, no speed flags`, () => {
      const demo = loadDemoRobot(file);
      const feet = neutralStance(demo);
      for (const leg of demo.legs) {
        for (const joint of JOINT_NAMES) {
          const spec = leg.joints[joint];
          const sweep = sweepTable(demo, { legId: leg.id, joint, fps: 50, speedFraction: 0.25 });
          expect(sweep.name).toBe(`sweep-${leg.id}-${joint}`);
          expect(sweep.loop).toBe(false);
          const path = sweep.frames.map((frame) => frame.legs[leg.id].angles[joint]);
          const centre = Math.min(spec.maxDeg, Math.max(spec.minDeg, 0));
          expect(path[0], "starts at the centre").toBe(centre);
          expect(path[path.length - 1], "ends at the centre").toBe(centre);
          expect(Math.min(...path), `reaches minDeg ${spec.minDeg}°`).toBe(spec.minDeg);
          expect(Math.max(...path), `reaches maxDeg ${spec.maxDeg}°`).toBe(spec.maxDeg);
          expect(path.indexOf(spec.minDeg), "min before max").toBeLessThan(path.indexOf(spec.maxDeg));
          const peak = peakSpeedDegS(sweep.frames, leg.id, joint, 50);
          expect(peak, `${leg.id}.${joint}: peak ${peak.toFixed(3)} °/s, limit ¼ × ${spec.maxSpeedDegS} °/s`).toBeLessThanOrEqual(0.25 * spec.maxSpeedDegS);
          expect(peak, "and not much slower").toBeGreaterThan(0.2 * spec.maxSpeedDegS);
          expect(
            sweep.flags.filter((flag) => flag.kind === "joint-speed"),
            "joint-speed flags",
          ).toEqual([]);
          expect(sweep.summary.peakSpeedDegS[leg.id][joint]).toBeCloseTo(peak, 9);
          for (const other of demo.legs) {
            const hold = solveLeg(demo, other.id, feet[other.id]).angles;
            for (const name of JOINT_NAMES) {
              if (other.id === leg.id && name === joint) continue;
              expect(new Set(sweep.frames.map((frame) => frame.legs[other.id].angles[name])), `${other.id}.${name} held at ${hold[name]}°`).toEqual(
                new Set([hold[name]]),
              );
            }
          }
        }
      }
    });
  }

  it("a sweep faster than the joint's maxSpeedDegS carries joint-speed error flags, and its table then needs an override reason", () => {
    const sweep = sweepTable(robot, { legId: "RM", joint: "femur", fps: 50, speedFraction: 1.5, dwellMs: 200 });
    const limit = robot.legs.find((leg) => leg.id === "RM")!.joints.femur.maxSpeedDegS;
    const speedFlags = sweep.flags.filter((flag) => flag.kind === "joint-speed");
    expect(speedFlags.length, "joint-speed flags").toBeGreaterThan(0);
    for (const flag of speedFlags) {
      expect(flag).toMatchObject({ leg: "RM", joint: "femur", severity: "error", limit });
      expect(flag.value, `frame ${flag.frame}: ${flag.value} °/s over ${limit} °/s`).toBeGreaterThan(limit);
      expect(flag.value).toBeLessThanOrEqual(1.5 * limit);
    }
    expect(sweep.summary.speedHeadroom!).toBeLessThan(1);
    const meta = metaFor({ robot }, { gaitName: sweep.name, gaitVersion: "bench" });
    expect(() => angleTable(robot, sweep, { format: "c", units: "us", meta })).toThrow(TableExportError);
    expect(angleTable(robot, sweep, { format: "c", units: "us", meta, overrideReason: OVERRIDE })).toContain("joint-speed");
  });

  it("frame count: each stretch takes ⌈distance · fps / speed⌉ frames, plus the dwells at min and max", () => {
    const spec = robot.legs[0].joints.coxa;
    const fps = 40;
    // 0.13 × 375 °/s: no stretch is a whole number of frames (where it is, one frame more keeps round-off under the speed).
    const speed = 0.13 * spec.maxSpeedDegS;
    const sweep = sweepTable(robot, { legId: "LF", joint: "coxa", fps, speedFraction: 0.13, dwellMs: 250 });
    const steps = (distance: number) => Math.ceil((distance * fps) / speed);
    const expected = 1 + steps(-spec.minDeg) + 10 + steps(spec.maxDeg - spec.minDeg) + 10 + steps(spec.maxDeg);
    expect(sweep.frames.length, `frames: expected ${expected}`).toBe(expected);
    expect(sweep.summary.fps).toBe(fps);
    expect(sweep.frames[1].timeMs).toBe(25);
  });

  it("bad options come back as TableExportError issues with a path", () => {
    for (const [options, path] of [
      [{ legId: "XX", joint: "coxa" }, "legId"],
      [{ legId: "LF", joint: "knee" }, "joint"],
      [{ legId: "LF", joint: "coxa", speedFraction: 0 }, "speedFraction"],
      [{ legId: "LF", joint: "coxa", marginDeg: 50 }, "marginDeg"],
    ] as const) {
      try {
        sweepTable(robot, options as never);
        expect.fail(`${JSON.stringify(options)} was accepted`);
      } catch (error) {
        expect(error).toBeInstanceOf(TableExportError);
        expect((error as TableExportError).issues[0].path).toBe(path);
      }
    }
  });
});
