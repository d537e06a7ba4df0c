import { describe, expect, it } from "vitest";
import { angleTable, formatFixed, TABLE_UNITS } from "~/export/index";
import { toFixedPoint } from "~/export/rounding";
import type { SolvedSequence } from "~/gait/index";
import { demoGait, metaFor, modifiedRobot, readCsv, readJsonTable } from "./helpers";

// Angles whose tenths are exact binary ties, the ties negative too, and values that round to zero from below.
const PROBES = [-1.25, 1.25, -0.25, 0.25, -0.75, 0.75, -0.04, 0.04, -0.00001, -2.5, 2.5, 0];
// Worked by hand, half away from zero (as ISO C round(), checked against gcc in c-header.test.ts):
const EXPECTED_DEG_TEXT = ["-1.3", "1.3", "-0.3", "0.3", "-0.8", "0.8", "0.0", "0.0", "0.0", "-2.5", "2.5", "0.0"];
// LF.coxa made 2 µs/° about 1500 µs: −1.25° → 1497.5 → 1498, 0.25° → 1500.5 → 1501, −0.25° → 1499.5 → 1500 (away from zero).
const EXPECTED_US = [1498, 1503, 1500, 1501, 1499, 1502, 1500, 1500, 1500, 1495, 1505, 1500];

function probed() {
  const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Probe" });
  const robot = modifiedRobot(gait.robot, (json) => {
    json.legs[0].joints.coxa.servo.usPerDeg = 2;
    json.legs[0].joints.coxa.servo.centerUs = 1500;
  });
  const solved: SolvedSequence = structuredClone(gait.solved);
  PROBES.forEach((deg, frame) => (solved.frames[frame].legs.LF.angles.coxa = deg));
  return { robot, solved, meta: metaFor({ robot }, { gaitName: "Probe" }) };
}

describe("one rounding for every format (DESIGN.md: 0.1°, 0.0001 rad, whole µs; half away from zero as ISO C round())", () => {
  it("fixed-point helpers: halves away from zero, never −0", () => {
    expect(toFixedPoint(-1.25, 10)).toBe(-13);
    expect(toFixedPoint(1.25, 10)).toBe(13);
    expect(Object.is(toFixedPoint(-0.04, 10), 0)).toBe(true);
    expect(formatFixed(-5, 1)).toBe("-0.5");
    expect(formatFixed(0, 4)).toBe("0.0000");
    expect(formatFixed(-12345, 4)).toBe("-1.2345");
    expect(formatFixed(1500, 0)).toBe("1500");
  });

  it("CSV, JSON and C hold the same numbers for negative halves and near-zero negatives, in degrees and pulses", () => {
    const { robot, solved, meta } = probed();
    const csv = readCsv(angleTable(robot, solved, { format: "csv", units: "deg", meta }));
    const jsonText = angleTable(robot, solved, { format: "json", units: "deg", meta });
    const json = readJsonTable(jsonText);
    const c = angleTable(robot, solved, { format: "c", units: "deg", meta });
    const cRows = [...c.matchAll(/^ {2}\{ ([-0-9, ]+) \}/gm)].map((match) => match[1].split(", ").map(Number));
    const lfCoxa = json.channels.findIndex((channel) => channel.name === "LF.coxa");
    PROBES.forEach((deg, frame) => {
      const expected = EXPECTED_DEG_TEXT[frame];
      expect(csv[frame + 1][lfCoxa + 2], `CSV frame ${frame}: ${deg}° expected "${expected}"`).toBe(expected);
      expect(json.frames[frame].values[lfCoxa], `JSON frame ${frame}: ${deg}° expected ${expected}°`).toBe(Number(expected));
      expect(cRows[frame][lfCoxa], `C frame ${frame}: ${deg}° expected ${Math.round(Number(expected) * 10)} tenths`).toBe(Math.round(Number(expected) * 10));
    });
    const us = readJsonTable(angleTable(robot, solved, { format: "json", units: "us", meta }));
    const usCsv = readCsv(angleTable(robot, solved, { format: "csv", units: "us", meta }));
    PROBES.forEach((deg, frame) => {
      expect(us.frames[frame].values[lfCoxa], `frame ${frame}: ${deg}° at 2 µs/° about 1500 µs`).toBe(EXPECTED_US[frame]);
      expect(usCsv[frame + 1][lfCoxa + 2]).toBe(String(EXPECTED_US[frame]));
    });
  });

  it("no format ever prints a negative zero, in any units", () => {
    const { robot, solved, meta } = probed();
    const negativeZero = /(^|[^0-9.])-0(\.0*)?(?![0-9.])/m;
    for (const units of TABLE_UNITS) {
      for (const format of ["csv", "json", "c"] as const) {
        const text = angleTable(robot, solved, { format, units, meta });
        expect(negativeZero.exec(text)?.[0] ?? null, `${format} ${units}`).toBeNull();
      }
    }
  });

  it("degree cells are tenths, radian cells ten-thousandths, pulse cells whole µs, with the decimals the metadata states", () => {
    const { robot, solved, meta } = probed();
    const decimalsOf = (text: string) => (text.includes(".") ? text.split(".")[1].length : 0);
    for (const [units, decimals] of [
      ["deg", 1],
      ["rad", 4],
      ["us", 0],
    ] as const) {
      const json = readJsonTable(angleTable(robot, solved, { format: "json", units, meta }));
      expect(json.meta.values.decimals).toBe(decimals);
      const csv = readCsv(angleTable(robot, solved, { format: "csv", units, meta }));
      for (const record of csv.slice(1)) for (const cell of record.slice(2)) expect(decimalsOf(cell), `${units} cell "${cell}"`).toBe(decimals);
    }
  });
});
