import { describe, expect, it } from "vitest";
import { angleTable, calibrationProfileJsonSchema, parseCalibrationProfile, TableExportError, type CalibrationProfile } from "~/export/index";
import { demoGait, metaFor, readCsv, readJsonTable } from "./helpers";

function thrown(run: () => unknown): TableExportError {
  try {
    run();
  } catch (error) {
    if (error instanceof TableExportError) return error;
    throw error;
  }
  throw new Error("expected a TableExportError, nothing was thrown");
}

// Issue 8: calibration profiles per physical unit (trim, reversal, channel overrides), applied at export and recorded in the header.
describe("calibration profiles (issue 8): applied at export, recorded in the header", () => {
  const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });
  const profile: CalibrationProfile = {
    name: "SN-0042",
    joints: {
      LF: { coxa: { trimDeg: 2.5, channel: 1 }, femur: { channel: 0, reversed: true } },
      RR: { tibia: { trimDeg: -1.25 } },
    },
  };

  it("validated with zod: issues with path and message", () => {
    const parsed = parseCalibrationProfile({ name: " ", joints: { LF: { femur: { trimDeg: 60, channel: 300, flipped: true } } } });
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.issues).toEqual(
      expect.arrayContaining([
        { path: "name", message: "must not be empty" },
        { path: "joints.LF.femur.trimDeg", message: "must be at most 45 (got 60)" },
        { path: "joints.LF.femur.channel", message: "must be at most 255 (got 300)" },
        { path: "joints.LF.femur.flipped", message: "is not a known field (check the spelling)" },
      ]),
    );
    expect(parseCalibrationProfile(profile).ok).toBe(true);
    expect(calibrationProfileJsonSchema().title).toBe("Gaitloom calibration profile");
  });

  it("trim adds to servoDeg in degree tables; a channel swap reorders the columns; the reversal override flips pulses", () => {
    const plain = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait) }));
    const calibrated = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait), calibration: profile }));
    expect(calibrated.channels.slice(0, 3).map((channel) => `${channel.channel}:${channel.name}`)).toEqual(["0:LF.femur", "1:LF.coxa", "2:LF.tibia"]);
    const csvHeader = readCsv(angleTable(gait.robot, gait.solved, { format: "csv", units: "deg", meta: metaFor(gait), calibration: profile }))[0];
    expect(csvHeader.slice(2, 5)).toEqual(["LF.femur", "LF.coxa", "LF.tibia"]);
    const at = (table: typeof plain, name: string) => table.channels.findIndex((channel) => channel.name === name);
    gait.solved.frames.forEach((frame, row) => {
      const coxa = calibrated.frames[row].values[at(calibrated, "LF.coxa")];
      const expectedCoxa = Math.round((frame.legs.LF.angles.coxa + 2.5) * 10) / 10;
      expect(coxa, `frame ${row} LF.coxa: expected ${expectedCoxa}° (solved + 2.5° trim), got ${coxa}°`).toBeCloseTo(expectedCoxa, 9);
      // Reversal belongs to pulses: the femur's degrees are unchanged.
      expect(calibrated.frames[row].values[at(calibrated, "LF.femur")]).toBe(plain.frames[row].values[at(plain, "LF.femur")]);
    });
    const plainUs = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "us", meta: metaFor(gait) }));
    const calibratedUs = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "us", meta: metaFor(gait), calibration: profile }));
    const centerUs = gait.robot.legs[0].joints.femur.servo.centerUs;
    plainUs.frames.forEach((frame, row) => {
      const before = frame.values[at(plainUs, "LF.femur")];
      const after = calibratedUs.frames[row].values[at(calibratedUs, "LF.femur")];
      expect(Math.abs(before + after - 2 * centerUs), `frame ${row} LF.femur: ${before} µs and reversed ${after} µs about ${centerUs} µs`).toBeLessThanOrEqual(
        1,
      );
    });
  });

  it("the profile name and the overrides are recorded in the JSON meta and channels and in the C header", () => {
    const json = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "us", meta: metaFor(gait), calibration: profile }));
    expect(json.meta.calibrationProfile).toBe("SN-0042");
    const lfCoxa = json.channels.find((channel) => channel.name === "LF.coxa")!;
    expect(lfCoxa).toMatchObject({ channel: 1, trimDeg: 2.5, reversed: false });
    expect(json.channels.find((channel) => channel.name === "LF.femur")).toMatchObject({ channel: 0, reversed: true, trimDeg: 0 });
    const c = angleTable(gait.robot, gait.solved, { format: "c", units: "us", meta: metaFor(gait), calibration: profile });
    expect(c).toContain(" * Calibration:  SN-0042\n");
    expect(c).toContain(" *   1: channel 1, LF.coxa, trim 2.5 deg\n");
    expect(c).toContain(" *   0: channel 0, LF.femur, reversed\n");
    const plain = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "us", meta: metaFor(gait) }));
    expect(plain.meta.calibrationProfile).toBeNull();
  });

  it("two joints on one channel after the overrides are refused with a message naming the channel and both joints", () => {
    const clash: CalibrationProfile = { name: "SN-0099", joints: { LF: { coxa: { channel: 1 } } } };
    const error = thrown(() => angleTable(gait.robot, gait.solved, { format: "c", units: "deg", meta: metaFor(gait), calibration: clash }));
    expect(error.code).toBe("duplicate-channel");
    expect(error.issues).toEqual([
      { path: "joints.LF.coxa.channel", message: 'channel 1 would drive both LF.coxa (set by calibration "SN-0099") and LF.femur (from the robot)' },
    ]);
  });

  it("a profile naming a leg the robot lacks, or an invalid one, is refused (calibration-mismatch)", () => {
    const stranger = thrown(() =>
      angleTable(gait.robot, gait.solved, {
        format: "json",
        units: "deg",
        meta: metaFor(gait),
        calibration: { name: "SN-1", joints: { L9: { coxa: { trimDeg: 1 } } } },
      }),
    );
    expect(stranger.code).toBe("calibration-mismatch");
    expect(stranger.issues[0].path).toBe("joints.L9");
    const invalid = thrown(() =>
      angleTable(gait.robot, gait.solved, {
        format: "json",
        units: "deg",
        meta: metaFor(gait),
        calibration: { name: "SN-1", joints: { LF: { coxa: { trimDeg: -50 } } } },
      }),
    );
    expect(invalid.code).toBe("calibration-mismatch");
    expect(invalid.issues).toEqual([{ path: "joints.LF.coxa.trimDeg", message: "must be at least -45 (got -50)" }]);
  });
});
