// The one rounding of every table (DESIGN.md, "Core module contracts"):
// 0.1° (C: int16_t tenths of a degree), 0.0001 rad (C: int32_t ten-thousandths),
// whole µs (C: uint16_t). Each cell becomes one integer in those fixed-point
// units, once; CSV, JSON and C all print that integer, so every format holds
// exactly the same numbers.
//
// Rounding is half away from zero (−1.25° → −1.3°, 1.25° → 1.3°) of the value
// times the scale as computed in IEEE doubles, so a tie is a tie of that
// product; zero is always +0, never "-0.0".
import type { TableUnits } from "./options";

export type UnitRounding = {
  /** Table integer = value × scale. */
  scale: number;
  /** Decimals printed in CSV and JSON (log10 of scale). */
  decimals: number;
  /** The C type of the table array. */
  cType: "int16_t" | "int32_t" | "uint16_t";
  /** The C array's suffix: gaitloom_<gait>_<suffix>. */
  cSuffix: "deg10" | "rad10000" | "us";
  /** Smallest and largest integer the C type holds. */
  min: number;
  max: number;
  /** What a cell is, in words (for the page's preview). */
  label: string;
  /** The rounding step in the unit: 1 / scale. */
  step: number;
  /** What a CSV or JSON number is, in a sentence that follows "Each value is" or "Each joint column is". */
  meaning: string;
  /** What a C cell is and how to get back to the unit. */
  cCell: string;
};

export const UNIT_ROUNDING: Readonly<Record<TableUnits, UnitRounding>> = {
  deg: {
    scale: 10,
    decimals: 1,
    cType: "int16_t",
    cSuffix: "deg10",
    min: -32768,
    max: 32767,
    label: "servo degrees, 0.1° steps",
    step: 0.1,
    meaning: "the servo angle in degrees, in the joint's own sign, rounded to 0.1 degree; the numbers are degrees themselves, not scaled",
    cCell: "int16_t tenths of a degree: degrees = cell / 10",
  },
  rad: {
    scale: 10000,
    decimals: 4,
    cType: "int32_t",
    cSuffix: "rad10000",
    min: -2147483648,
    max: 2147483647,
    label: "servo radians, 0.0001 rad steps",
    step: 0.0001,
    meaning: "the servo angle in radians, in the joint's own sign, rounded to 0.0001 rad; the numbers are radians themselves, not scaled",
    cCell: "int32_t ten-thousandths of a radian: radians = cell / 10000",
  },
  us: {
    scale: 1,
    decimals: 0,
    cType: "uint16_t",
    cSuffix: "us",
    min: 0,
    max: 65535,
    label: "servo pulse widths, whole µs",
    step: 1,
    meaning: "the servo pulse width in whole microseconds, with the servo's centre, microseconds per degree and reversal applied, clamped to its range",
    cCell: "uint16_t whole microseconds: microseconds = cell",
  },
};

/** What a cell of a table in these units is, in a few words: "servo degrees, 0.1° steps". */
export function tableUnitLabel(units: TableUnits): string {
  return UNIT_ROUNDING[units].label;
}

/** Nearest integer, halves away from zero, never −0. */
export function roundHalfAwayFromZero(value: number): number {
  // Math.round rounds halves up (towards +∞) and is exact for 0.49999999999999994.
  const rounded = value < 0 ? -Math.round(-value) : Math.round(value);
  return rounded === 0 ? 0 : rounded;
}

/** The fixed-point integer of a value: roundHalfAwayFromZero(value × scale). */
export function toFixedPoint(value: number, scale: number): number {
  return roundHalfAwayFromZero(value * scale);
}

const POWERS_OF_TEN = [1, 10, 100, 1000, 10000, 100000, 1000000];

/** A fixed-point integer printed with `decimals` decimals: 1234, 1 → "123.4"; −5, 1 → "-0.5"; 0 → "0.0". */
export function formatFixed(integer: number, decimals: number): string {
  if (decimals === 0) return String(integer);
  const divisor = POWERS_OF_TEN[decimals];
  const magnitude = integer < 0 ? -integer : integer;
  const whole = Math.floor(magnitude / divisor);
  const fraction = String(magnitude - whole * divisor);
  const sign = integer < 0 ? "-" : "";
  return `${sign}${whole}.${fraction.length < decimals ? "0".repeat(decimals - fraction.length) + fraction : fraction}`;
}

/** Frame times and the frame period: milliseconds rounded to whole µs (3 decimals), the same in every format. */
export function timeToMicroseconds(timeMs: number): number {
  return toFixedPoint(timeMs, 1000);
}
