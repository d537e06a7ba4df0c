import { describe, expect, it } from "vitest";
import { angleTable, sweepTable, TABLE_MEDIA_TYPES, tableFileName } from "~/export/index";
import type { TableMetadata } from "~/export/table";
import type { SolvedSequence } from "~/gait/index";
import { JOINT_NAMES } from "~/kinematics/index";
import { loadDemoRobot } from "../support/robots";
import { OVERRIDE, codeOf, demoGait, metaFor, modifiedRobot, readCsv, readJsonTable } from "./helpers";

describe("table layout (DESIGN.md: one row per frame, one column per joint in servo-channel order)", () => {
  it("columns follow the servo channels, not the robot's leg order, and are named leg.joint", () => {
    const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });
    // Put the right legs on the low channels: RF, RM, RR get 0..8, the left legs 9..17.
    const robot = modifiedRobot(gait.robot, (json) => {
      json.legs.forEach((leg, index) => {
        const slot = leg.id.startsWith("R") ? index - 3 : index + 3;
        JOINT_NAMES.forEach((name, j) => (leg.joints[name].servo.channel = slot * 3 + j));
      });
    });
    const json = readJsonTable(angleTable(robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait) }));
    expect(json.channels.map((channel) => channel.channel)).toEqual([...Array(18).keys()]);
    expect(json.channels.slice(0, 4).map((channel) => channel.name)).toEqual(["RF.coxa", "RF.femur", "RF.tibia", "RM.coxa"]);
    const header = readCsv(angleTable(robot, gait.solved, { format: "csv", units: "deg", meta: metaFor(gait) }))[0];
    expect(header.slice(0, 5)).toEqual(["frame", "time_ms", "RF.coxa", "RF.femur", "RF.tibia"]);
    json.frames.forEach((frame, row) => {
      expect(frame.index).toBe(row);
      expect(frame.timeMs).toBe(row * 20);
      expect(frame.values[0], `frame ${row} RF.coxa`).toBe(Math.round(gait.solved.frames[row].legs.RF.angles.coxa * 10) / 10);
    });
  });

  it("unreachable frames hold the last reachable angles of the solve (DESIGN.md), never NaN", () => {
    const gait = demoGait("pier-crawler", { template: "wave", cycleMs: 1200, fps: 50, strideMm: 200, stepHeightMm: 60, name: "Long wave" });
    const unreachable = gait.solved.flags.filter((flag) => flag.kind === "unreachable");
    expect(unreachable.length, "unreachable flags in the long wave").toBeGreaterThan(0);
    const json = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait), overrideReason: OVERRIDE }));
    for (const flag of unreachable) {
      const frame = json.frames[flag.frame];
      const before = json.frames[(flag.frame - 1 + json.frames.length) % json.frames.length];
      json.channels.forEach((channel, c) => {
        if (channel.leg !== flag.leg) return;
        expect(frame.values[c], `frame ${flag.frame} ${channel.name}: expected the frame before's ${before.values[c]}°`).toBe(before.values[c]);
      });
    }
    for (const frame of json.frames) expect(frame.values.every(Number.isFinite), `frame ${frame.index} finite`).toBe(true);
  });

  it("refuses a solved result that does not fit the robot, and a value the C type cannot hold", () => {
    const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });
    const quay = loadDemoRobot("quay-walker");
    expect(codeOf(() => angleTable(quay, gait.solved, { format: "csv", units: "deg", meta: metaFor(gait) }))).toBe("solved-mismatch");
    const empty: SolvedSequence = { ...gait.solved, frames: [] };
    expect(codeOf(() => angleTable(gait.robot, empty, { format: "csv", units: "deg", meta: metaFor(gait) }))).toBe("solved-mismatch");
    const broken: SolvedSequence = structuredClone(gait.solved);
    broken.frames[3].legs.LM.angles.tibia = Number.NaN;
    expect(codeOf(() => angleTable(gait.robot, broken, { format: "json", units: "deg", meta: metaFor(gait) }))).toBe("solved-mismatch");
    const huge: SolvedSequence = structuredClone(gait.solved);
    huge.frames[0].legs.LF.angles.coxa = 4000; // 40000 tenths: beyond int16_t
    const options = { units: "deg" as const, meta: metaFor(gait), overrideReason: OVERRIDE };
    expect(codeOf(() => angleTable(gait.robot, huge, { ...options, format: "c" }))).toBe("value-out-of-range");
    expect(readJsonTable(angleTable(gait.robot, huge, { ...options, format: "json" })).frames[0].values[0]).toBe(4000);
  });

  it("download names and media types: text/csv with header=present (RFC 4180 §3), application/json, a .h for C", () => {
    const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });
    const meta = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait) })).meta as TableMetadata;
    expect(tableFileName(meta, "c")).toBe("tripod_walk_v2_deg10_50hz_no-profile.h");
    expect(tableFileName({ ...meta, units: "us", rateHz: 12.5 }, "csv")).toBe("tripod_walk_v2_us_12_5hz_no-profile.csv");
    expect(TABLE_MEDIA_TYPES.csv).toBe("text/csv; charset=utf-8; header=present");
    expect(TABLE_MEDIA_TYPES.json).toBe("application/json; charset=utf-8");
  });

  it("a sweep can hold the other joints at 0° instead of the neutral stance", () => {
    const robot = loadDemoRobot("quay-walker");
    const sweep = sweepTable(robot, { legId: "LF", joint: "tibia", hold: "centre" });
    for (const frame of sweep.frames) {
      for (const leg of robot.legs) {
        for (const name of JOINT_NAMES) if (!(leg.id === "LF" && name === "tibia")) expect(frame.legs[leg.id].angles[name]).toBe(0);
      }
    }
  });
});
