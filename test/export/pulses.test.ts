import { describe, expect, it } from "vitest";
import { angleTable, angleTableMetadata, centreTable, sweepTable, TableExportError, type TableUnits } from "~/export/index";
import { solveSequence } from "~/gait/index";
import { JOINT_NAMES, type Robot } from "~/kinematics/index";
import type { SolvedSequence } from "~/gait/index";
import { DEMO_ROBOT_FILES, loadDemoRobot } from "../support/robots";
import { OVERRIDE, demoGait, metaFor, modifiedRobot, readJsonTable } from "./helpers";

function json(robot: Robot, solved: SolvedSequence, units: TableUnits, extra: { overrideReason?: string } = {}) {
  return readJsonTable(angleTable(robot, solved, { format: "json", units, meta: metaFor({ robot }), ...extra }));
}

function column(table: ReturnType<typeof json>, name: string): number[] {
  const index = table.channels.findIndex((channel) => channel.name === name);
  if (index < 0) throw new Error(`no column ${name}`);
  return table.frames.map((frame) => frame.values[index]);
}

describe("pulse widths against common practice (50 Hz servo frame: 1500 µs neutral, 1000–2000 µs nominal, about 500–2500 µs extended)", () => {
  it("common practice: 0 servo degrees with no offset is the 1500 µs neutral pulse", () => {
    const robot = modifiedRobot(loadDemoRobot("pier-crawler"), (json) => {
      for (const leg of json.legs) for (const name of JOINT_NAMES) leg.joints[name].servo.centerUs = 1500;
    });
    const table = json(robot, centreTable(robot, { seconds: 0.2, fps: 50 }), "us");
    for (const frame of table.frames) {
      frame.values.forEach((value, c) => expect(value, `frame ${frame.index} ${table.channels[c].name}: expected 1500 µs, got ${value} µs`).toBe(1500));
    }
  });

  it("a demo walk stays inside the 1000–2000 µs nominal range, and the demo servos' ranges are the ~500–2500 µs extended one (common practice)", () => {
    for (const file of DEMO_ROBOT_FILES) {
      const robot = loadDemoRobot(file);
      for (const leg of robot.legs) {
        for (const name of JOINT_NAMES) {
          const { minUs, maxUs } = leg.joints[name].servo;
          expect(minUs, `${file} ${leg.id}.${name} minUs`).toBeGreaterThanOrEqual(450);
          expect(maxUs, `${file} ${leg.id}.${name} maxUs`).toBeLessThanOrEqual(2550);
        }
      }
    }
    const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60 });
    const table = json(gait.robot, gait.solved, "us");
    for (const frame of table.frames) {
      frame.values.forEach((value, c) => {
        if (value < 1000 || value > 2000) expect.fail(`frame ${frame.index} ${table.channels[c].name}: expected 1000–2000 µs, got ${value} µs`);
      });
    }
  });

  it("common practice: a sweep of any demo joint to its limits asks for pulses inside the ~500–2500 µs extended range", () => {
    for (const file of DEMO_ROBOT_FILES) {
      const robot = loadDemoRobot(file);
      for (const leg of robot.legs) {
        for (const name of JOINT_NAMES) {
          const sweep = sweepTable(robot, { legId: leg.id, joint: name, speedFraction: 1, dwellMs: 0 });
          const values = column(json(robot, sweep, "us"), `${leg.id}.${name}`);
          const low = Math.min(...values);
          const high = Math.max(...values);
          expect(low, `${file} ${leg.id}.${name}: lowest pulse ${low} µs`).toBeGreaterThanOrEqual(500);
          expect(high, `${file} ${leg.id}.${name}: highest pulse ${high} µs`).toBeLessThanOrEqual(2500);
        }
      }
    }
  });

  it("every cell is us = centerUs ± usPerDeg · servoDeg (DESIGN.md), written out here, rounded to whole µs", () => {
    const gait = demoGait("quay-walker", { template: "wave", cycleMs: 1200, fps: 50, strideMm: 40 });
    const table = json(gait.robot, gait.solved, "us", { overrideReason: OVERRIDE });
    const legs = new Map(gait.robot.legs.map((leg) => [leg.id, leg]));
    table.frames.forEach((frame, row) => {
      table.channels.forEach((channel, c) => {
        const servo = legs.get(channel.leg)!.joints[channel.joint as "coxa"].servo;
        const deg = gait.solved.frames[row].legs[channel.leg].angles[channel.joint as "coxa"];
        const raw = servo.centerUs + (servo.reversed ? -1 : 1) * servo.usPerDeg * deg;
        const expected = Math.round(Math.min(servo.maxUs, Math.max(servo.minUs, raw)));
        if (frame.values[c] !== expected) expect.fail(`frame ${frame.index} ${channel.name}: expected ${expected} µs, got ${frame.values[c]} µs`);
      });
    });
  });
});

describe("reversal (DESIGN.md: degree and radian tables hold servoDeg in the joint's own sign; reversal belongs to pulses)", () => {
  it("reversing LF.femur flips its pulses about centerUs and leaves degrees, radians and every other column alone", () => {
    const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60 });
    const reversedRobot = modifiedRobot(gait.robot, (json) => {
      json.legs[0].joints.femur.servo.reversed = !json.legs[0].joints.femur.servo.reversed;
    });
    const reversedSolved = solveSequence(reversedRobot, gait.sequence);
    for (const units of ["deg", "rad"] as const) {
      expect(json(reversedRobot, reversedSolved, units).frames, `${units} table`).toEqual(json(gait.robot, gait.solved, units).frames);
    }
    const before = json(gait.robot, gait.solved, "us");
    const after = json(reversedRobot, reversedSolved, "us");
    const centerUs = gait.robot.legs[0].joints.femur.servo.centerUs;
    const femur = before.channels.findIndex((channel) => channel.name === "LF.femur");
    expect(after.channels[femur].reversed).toBe(true);
    let moved = 0;
    before.frames.forEach((frame, row) => {
      frame.values.forEach((value, c) => {
        const flipped = after.frames[row].values[c];
        if (c !== femur) {
          expect(flipped, `frame ${frame.index} ${before.channels[c].name}: expected ${value} µs, got ${flipped} µs`).toBe(value);
          return;
        }
        // c + k·d and c − k·d, each rounded: their sum is 2c within the 1 µs of rounding.
        expect(
          Math.abs(value + flipped - 2 * centerUs),
          `frame ${frame.index} LF.femur: ${value} µs and reversed ${flipped} µs about ${centerUs} µs`,
        ).toBeLessThanOrEqual(1);
        if (value !== centerUs) moved += 1;
      });
    });
    expect(moved, "frames where LF.femur is off centre").toBeGreaterThan(0);
  });
});

describe("clamping (DESIGN.md: a pulse outside minUs..maxUs is clamped in any table and flagged)", () => {
  const narrowed = () => {
    const base = loadDemoRobot("pier-crawler");
    return modifiedRobot(base, (json) => {
      json.legs[0].joints.femur.servo.maxUs = 1600;
    });
  };

  it("pulses beyond maxUs hold maxUs and every clamped cell is listed in the metadata, JSON and C header; degrees stay unclamped", () => {
    const robot = narrowed();
    const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60 });
    const solved = solveSequence(robot, gait.sequence);
    expect(solved.summary.flagsByKind["pulse-range"], "the solve flags pulse-range").toBeGreaterThan(0);
    const us = json(robot, solved, "us", { overrideReason: OVERRIDE });
    const femur = us.channels.findIndex((channel) => channel.name === "LF.femur");
    const expectedClamped = solved.frames.filter((frame) => 1500 + 11.1 * frame.legs.LF.angles.femur > 1600).map((frame) => frame.index);
    expect(expectedClamped.length, "frames that need more than 1600 µs").toBeGreaterThan(0);
    for (const frame of us.frames) {
      const value = frame.values[femur];
      expect(value, `frame ${frame.index} LF.femur: expected at most 1600 µs, got ${value} µs`).toBeLessThanOrEqual(1600);
      if (expectedClamped.includes(frame.index)) expect(value, `frame ${frame.index} LF.femur clamped`).toBe(1600);
    }
    const listed = us.meta.clamped as { frame: number; name: string; requestedUs: number; clampedUs: number; channel: number }[];
    expect(
      listed.map((cell) => cell.frame),
      "clamped frames",
    ).toEqual(expectedClamped);
    for (const cell of listed) {
      expect(cell.name).toBe("LF.femur");
      expect(cell.clampedUs).toBe(1600);
      expect(cell.requestedUs, `frame ${cell.frame}: requested ${cell.requestedUs} µs`).toBeGreaterThan(1600);
    }
    const deg = json(robot, solved, "deg", { overrideReason: OVERRIDE });
    expect(deg.meta.clamped, "the degree table lists the same cells").toEqual(listed);
    const peakDeg = Math.max(...deg.frames.map((frame) => frame.values[femur]));
    expect(peakDeg, "degrees are not clamped to the pulse range (1600 µs is 9.0°)").toBeGreaterThan(9.1);
    const header = angleTable(robot, solved, { format: "c", units: "us", meta: metaFor({ robot }), overrideReason: OVERRIDE });
    expect(header).toContain(`Clamped:      ${listed.length} cells whose pulse lies outside the servo range`);
    expect(header).toContain(`  frame ${listed[0].frame}, channel ${listed[0].channel} (LF.femur): ${listed[0].requestedUs} us asked, 1600 us given`);
    expect(angleTableMetadata(robot, solved, { units: "us", meta: metaFor({ robot }), overrideReason: OVERRIDE }).clamped).toEqual(listed);
  });

  it("a clamped pulse needs an override reason like an error flag, even when it comes from a calibration trim alone", () => {
    const base = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60 });
    const robot = modifiedRobot(base.robot, (json) => {
      json.legs[0].joints.femur.servo.maxUs = 1950;
    });
    const gait = { ...base, robot, solved: solveSequence(robot, base.sequence) };
    expect(gait.solved.summary.errors, "the walk itself is clean on this robot").toBe(0);
    const calibration = { name: "SN-0007", joints: { LF: { femur: { trimDeg: 10 } } } };
    const peakDeg = Math.max(...gait.solved.frames.map((frame) => frame.legs.LF.angles.femur));
    expect(1500 + 11.1 * peakDeg, "the untrimmed peak fits under 1950 µs").toBeLessThan(1950);
    expect(1500 + 11.1 * (peakDeg + 10), "the trimmed peak asks for more than 1950 µs").toBeGreaterThan(1950);
    const attempt = () => angleTable(gait.robot, gait.solved, { format: "json", units: "us", meta: metaFor(gait), calibration });
    expect(attempt).toThrow(TableExportError);
    expect(attempt).toThrow(/pulses? clamped to the servo range/);
    const table = readJsonTable(
      angleTable(gait.robot, gait.solved, { format: "json", units: "us", meta: metaFor(gait), calibration, overrideReason: OVERRIDE }),
    );
    expect(table.meta.clamped.length).toBeGreaterThan(0);
    expect(Math.max(...column(table, "LF.femur")), "clamped to maxUs").toBe(1950);
  });
});
