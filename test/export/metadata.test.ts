// Issue 16, item 4: an exported table says which calibration profile was
// applied and exactly what its numbers are — in the file name, in a comment
// header the common CSV readers skip, in the JSON meta and the C comment.
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { angleTable, EXPORTER_VERSION, TABLE_FORMAT, tableFileName, type CalibrationProfile } from "~/export/index";
import { CSV_COMMENT_PREFIX } from "~/export/csv";
import { demoGait, metaFor, readCsv, readJsonTable } from "./helpers";

const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });
const profile: CalibrationProfile = { name: "SN-0042 (revision 3)", joints: { LF: { coxa: { trimDeg: 2.5 } } } };

const csvOf = (extra: { calibration?: CalibrationProfile; units?: "deg" | "rad" | "us"; gaitName?: string } = {}) =>
  angleTable(gait.robot, gait.solved, {
    format: "csv",
    units: extra.units ?? "deg",
    meta: metaFor(gait, extra.gaitName ? { gaitName: extra.gaitName } : {}),
    calibration: extra.calibration,
  });

/** The comment lines at the top of a CSV table, without their "# ". */
const commentOf = (csv: string) =>
  csv
    .split("\r\n")
    .filter((line) => line.startsWith("#"))
    .map((line) => line.slice(CSV_COMMENT_PREFIX.length));

describe("exporter version and format (issue 16: the bytes changed once)", () => {
  it("EXPORTER_VERSION is 2.0.0 and the JSON layout gaitloom.table/2", () => {
    expect(EXPORTER_VERSION).toBe("2.0.0");
    expect(TABLE_FORMAT).toBe("gaitloom.table/2");
  });
});

describe("the calibration profile in the file name", () => {
  it("names the profile when one is applied and says so when none is: the two files never share a name", () => {
    const plain = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait) })).meta;
    const calibrated = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "deg", meta: metaFor(gait), calibration: profile })).meta;
    expect(tableFileName(plain, "csv")).toBe("tripod_walk_v2_deg10_50hz_no-profile.csv");
    expect(tableFileName(calibrated, "csv")).toBe("tripod_walk_v2_deg10_50hz_profile-sn_0042_revision_3.csv");
    expect(tableFileName(calibrated, "c")).toBe("tripod_walk_v2_deg10_50hz_profile-sn_0042_revision_3.h");
  });
});

describe("the CSV's comment header: # lines before the header record", () => {
  it("names robot, revision, gait version, content hash, profile, units, rate, flags, exporter and the safety cautions", () => {
    const comment = commentOf(csvOf({ calibration: profile }));
    expect(comment[0]).toMatch(/^Gaitloom angle table \(gaitloom\.table\/2\)/);
    expect(comment).toContain(`Robot: ${gait.robot.name}, revision 3`);
    expect(comment).toContain("Gait: Tripod walk, version 2");
    expect(comment).toContain("Content hash: sha256:5d41402abc4b2a76b9719d911017c592");
    expect(comment).toContain("Calibration profile: SN-0042 (revision 3)");
    expect(comment.find((line) => line.startsWith("Units:"))).toBe(
      "Units: deg. Each joint column is the servo angle in degrees, in the joint's own sign, rounded to 0.1 degree; the numbers are degrees themselves, not scaled. time_ms is milliseconds from the first frame.",
    );
    expect(comment).toContain("Rate: 50 Hz, 60 frames, frame period 20 ms");
    expect(comment).toContain("Flags: 0 errors, 0 warnings; clamped pulses: none");
    expect(comment).toContain(`Exporter: ${EXPORTER_VERSION}`);
    expect(comment).toContain("SAFETY: This table drives real motors.");
    expect(commentOf(csvOf())).toContain("Calibration profile: none (the robot's own servo settings)");
  });

  it("radians and pulse widths say what the numbers are too, never a scale", () => {
    expect(commentOf(csvOf({ units: "rad" })).find((line) => line.startsWith("Units:"))).toContain(
      "the servo angle in radians, in the joint's own sign, rounded to 0.0001 rad; the numbers are radians themselves, not scaled",
    );
    expect(commentOf(csvOf({ units: "us" })).find((line) => line.startsWith("Units:"))).toContain("the servo pulse width in whole microseconds");
    for (const units of ["deg", "rad", "us"] as const) expect(commentOf(csvOf({ units })).join("\n")).not.toMatch(/scale[: =]+\d/i);
  });

  it("papaparse with comments: '#' (reference parser) reads the very records the CSV had before the comment header", () => {
    const csv = csvOf({ calibration: profile });
    const parsed = Papa.parse<string[]>(csv, { comments: "#", skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const withoutComments = csv
      .split("\r\n")
      .filter((line) => !line.startsWith("#"))
      .join("\r\n");
    expect(parsed.data).toEqual(readCsv(withoutComments));
    expect(parsed.data[0].slice(0, 3)).toEqual(["frame", "time_ms", "LF.coxa"]);
    expect(parsed.data.length).toBe(gait.solved.frames.length + 1);
  });

  it("every comment line starts with '#' and holds no line break, whatever the names hold", () => {
    const csv = csvOf({ gaitName: "Walk\r\nframe,time_ms\u2028# not a comment\nx", calibration: { ...profile, name: "SN\n1,2\r\n3" } });
    const lines = csv.split("\r\n");
    const header = lines.findIndex((line) => line.startsWith("frame,"));
    expect(
      lines.slice(0, header).every((line) => line.startsWith("# ")),
      "the lines before the header record",
    ).toBe(true);
    for (const line of lines.slice(0, header)) expect(line, "a comment line").not.toMatch(/[\n\r\u2028\u2029]/u);
    expect(commentOf(csv)).toContain("Calibration profile: SN 1,2 3");
  });
});

describe("the JSON meta says what the numbers are", () => {
  it("meta.values: the unit, its meaning and the rounding step; no scale beside plain radians", () => {
    const json = readJsonTable(angleTable(gait.robot, gait.solved, { format: "json", units: "rad", meta: metaFor(gait), calibration: profile }));
    expect(json.meta.values).toEqual({
      unit: "rad",
      description:
        "Each value is the servo angle in radians, in the joint's own sign, rounded to 0.0001 rad; the numbers are radians themselves, not scaled. Calibration profile SN-0042 (revision 3) applied.",
      step: 0.0001,
      decimals: 4,
    });
    expect(json.meta).not.toHaveProperty("scale");
    expect(json.meta).not.toHaveProperty("unitLabel");
    expect(json.meta.calibrationProfile).toBe("SN-0042 (revision 3)");
  });
});

describe("the C header's comment says what a cell is", () => {
  it("cells are fixed-point integers and the comment gives the division back to the unit", () => {
    const c = angleTable(gait.robot, gait.solved, { format: "c", units: "rad", meta: metaFor(gait), calibration: profile });
    const comment = c.slice(0, c.indexOf("*/"));
    expect(comment).toContain(" * Cells:        int32_t ten-thousandths of a radian: radians = cell / 10000 (GAITLOOM_TRIPOD_WALK_RAD10000_SCALE)");
    expect(comment).toContain(" * Calibration:  SN-0042 (revision 3)");
    const deg = angleTable(gait.robot, gait.solved, { format: "c", units: "deg", meta: metaFor(gait) });
    expect(deg).toContain(" * Cells:        int16_t tenths of a degree: degrees = cell / 10 (GAITLOOM_TRIPOD_WALK_DEG10_SCALE)");
    expect(deg).toContain(" * Calibration:  none (the robot's own servo settings)");
  });
});
