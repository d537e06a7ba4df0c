// The table itself, before any format: metadata, columns, frame times and one
// fixed-point integer per cell (rounding.ts). CSV, JSON and the C header are
// printers of this one structure, so they cannot disagree on a number.
//
// Cells: servoDeg of the solved frame plus the calibration's trim, in the
// joint's own sign (degree and radian tables); pulse tables map it with
// angleToPulse (us = centerUs ± usPerDeg · servoDeg, the sign flipped when the
// servo is reversed), clamp to minUs..maxUs and round to whole µs. A cell whose
// pulse lies outside minUs..maxUs is listed in `clamped`, whatever the units.
import { FLAG_KINDS, type FlagKind, type SolvedSequence } from "../gait/index";
import { JOINT_NAMES, RAD_PER_DEG, angleToPulse, type JointName, type Robot } from "../kinematics/index";
import { tableChannels, type TableChannel } from "./channels";
import { TableExportError } from "./errors";
import { parseTableOptions, type TableOptions, type TableUnits } from "./options";
import { UNIT_ROUNDING, timeToMicroseconds, toFixedPoint } from "./rounding";
import { SAFETY_NOTICE } from "./safety";
import { EXPORTER_VERSION } from "./version";

/** A cell whose pulse lies outside the servo's minUs..maxUs: a pulse table holds clampedUs there. */
export type ClampedCell = {
  frame: number;
  column: number;
  channel: number;
  /** `LF.tibia` */
  name: string;
  /** The pulse the angle asks for, whole µs. */
  requestedUs: number;
  /** The pulse in the table, whole µs, inside minUs..maxUs. */
  clampedUs: number;
};

/** One column as the JSON table and the metadata give it. */
export type ChannelInfo = {
  column: number;
  channel: number;
  leg: string;
  joint: JointName;
  name: string;
  reversed: boolean;
  centerUs: number;
  usPerDeg: number;
  minUs: number;
  maxUs: number;
  trimDeg: number;
};

/** The calibration line of a table's header when no profile was applied. */
export const NO_PROFILE = "none (the robot's own servo settings)";

/**
 * What the numbers of a CSV or JSON table are, said in full: plain values in
 * `unit` (never scaled: the C header's fixed-point integers are its own and
 * say so in its comment), rounded to `step`, printed with `decimals` decimals.
 */
export type TableValues = {
  unit: TableUnits;
  /** The numbers in a sentence, naming the calibration profile applied (or that none was). */
  description: string;
  step: number;
  decimals: number;
};

/** Everything a table says about itself; the JSON table's `meta`, and what angleTableMetadata gives for a CSV download. */
export type TableMetadata = {
  exporterVersion: string;
  solverVersion: string | null;
  exportedAt: string | null;
  robot: { name: string; revision: number | string };
  gait: { name: string; version: number | string; contentHash: string; loop: boolean | null };
  /** The profile's name as the header gives it (a stored one with its revision), or null: the robot's own servo settings. */
  calibrationProfile: string | null;
  units: TableUnits;
  values: TableValues;
  rateHz: number;
  /** 1000 / rateHz, rounded to whole µs. */
  framePeriodMs: number;
  frameCount: number;
  channelCount: number;
  overrideReason: string | null;
  flags: { errors: number; warnings: number; byKind: Partial<Record<FlagKind, number>> };
  clamped: ClampedCell[];
  safety: readonly string[];
};

export type AngleTableData = {
  meta: TableMetadata;
  channels: ChannelInfo[];
  /** Per row: the solved frame's index and its time in whole µs. */
  frameIndex: Int32Array;
  timeUs: Float64Array;
  /** frameCount × channelCount fixed-point integers, row by row. */
  values: Int32Array;
};

function channelInfo(entry: TableChannel): ChannelInfo {
  const { servo } = entry;
  return {
    column: entry.column,
    channel: entry.channel,
    leg: entry.legId,
    joint: entry.joint,
    name: entry.name,
    reversed: servo.reversed,
    centerUs: servo.centerUs,
    usPerDeg: servo.usPerDeg,
    minUs: servo.minUs,
    maxUs: servo.maxUs,
    trimDeg: entry.trimDeg,
  };
}

const INT32_MIN = -(2 ** 31);
const INT32_MAX = 2 ** 31 - 1;

/** Whole µs inside minUs..maxUs: rounding a clamped pulse must not step out of a range with fractional ends. */
function wholePulse(us: number, minUs: number, maxUs: number): number {
  const rounded = toFixedPoint(us, 1);
  if (rounded > maxUs) return Math.floor(maxUs);
  if (rounded < minUs) return Math.ceil(minUs);
  return rounded;
}

function countFlags(solved: SolvedSequence): TableMetadata["flags"] {
  const counts: Partial<Record<FlagKind, number>> = {};
  let errors = 0;
  for (const flag of solved.flags) {
    counts[flag.kind] = (counts[flag.kind] ?? 0) + 1;
    if (flag.severity === "error") errors += 1;
  }
  const byKind: Partial<Record<FlagKind, number>> = {};
  for (const kind of FLAG_KINDS) if (counts[kind] !== undefined) byKind[kind] = counts[kind];
  return { errors, warnings: solved.flags.length - errors, byKind };
}

function describeFlags(flags: TableMetadata["flags"]): string {
  return Object.entries(flags.byKind)
    .map(([kind, count]) => `${kind} ${count}`)
    .join(", ");
}

/**
 * The table of a solved result at its own rate. Throws TableExportError:
 * "rate-mismatch" when options.rateHz differs from the rate the result was
 * solved at (use buildAngleTable, which re-solves); "override-required" when
 * the result has error-severity flags or clamped pulses and no override
 * reason; "solved-mismatch", "invalid-options", "calibration-mismatch",
 * "duplicate-channel", "exporter-version" as their names say.
 */
export function angleTableData(robot: Robot, solved: SolvedSequence, options: TableOptions): AngleTableData {
  const parsed = parseTableOptions(options);
  const { units, meta } = parsed;
  if (meta.exporterVersion !== undefined && meta.exporterVersion !== EXPORTER_VERSION) {
    throw new TableExportError("exporter-version", `the table asks for exporter ${meta.exporterVersion}, this is exporter ${EXPORTER_VERSION}`, [
      { path: "meta.exporterVersion", message: `must be ${EXPORTER_VERSION} (got ${JSON.stringify(meta.exporterVersion)})` },
    ]);
  }
  const rateHz = solved.summary.fps;
  if (parsed.rateHz !== undefined && parsed.rateHz !== rateHz) {
    throw new TableExportError("rate-mismatch", `the result was solved at ${rateHz} Hz, not ${parsed.rateHz} Hz`, [
      { path: "rateHz", message: "another rate needs a new solve at that rate (buildAngleTable), never an interpolation of this one" },
    ]);
  }
  const frames = solved.frames;
  if (frames.length === 0) throw new TableExportError("solved-mismatch", "the solved result has no frames");
  const legIds = robot.legs.map((leg) => leg.id);
  const strangers = Object.keys(frames[0].legs).filter((legId) => !legIds.includes(legId));
  if (strangers.length) {
    throw new TableExportError(
      "solved-mismatch",
      `the solved result has legs robot "${robot.name}" lacks: ${strangers.join(", ")} (legs: ${legIds.join(", ")})`,
    );
  }
  const { channels, calibrationProfile } = tableChannels(robot, options.calibration);
  const unitRounding = UNIT_ROUNDING[units];
  const scale = unitRounding.scale;
  const channelCount = channels.length;
  const values = new Int32Array(frames.length * channelCount);
  const frameIndex = new Int32Array(frames.length);
  const timeUs = new Float64Array(frames.length);
  const clamped: ClampedCell[] = [];

  // Per joint in robot order (leg · 3 + joint): its column, trim and servo, so the loop reads each leg's angles once.
  const byJoint: TableChannel[] = new Array(channelCount);
  for (const entry of channels) byJoint[entry.legIndex * 3 + JOINT_NAMES.indexOf(entry.joint)] = entry;
  const legCount = legIds.length;
  for (let row = 0; row < frames.length; row += 1) {
    const frame = frames[row];
    frameIndex[row] = frame.index;
    timeUs[row] = timeToMicroseconds(frame.timeMs);
    if (!Number.isFinite(timeUs[row])) {
      throw new TableExportError("solved-mismatch", `frame ${frame.index} plays at ${frame.timeMs} ms; a table never holds a time that is not finite`);
    }
    const base = row * channelCount;
    for (let legIndex = 0; legIndex < legCount; legIndex += 1) {
      const leg = frame.legs[legIds[legIndex]];
      if (!leg) throw new TableExportError("solved-mismatch", `frame ${frame.index} has no leg ${legIds[legIndex]} of robot "${robot.name}"`);
      const { coxa, femur, tibia } = leg.angles;
      for (let j = 0; j < 3; j += 1) {
        const entry = byJoint[legIndex * 3 + j];
        const servoDeg = (j === 0 ? coxa : j === 1 ? femur : tibia) + entry.trimDeg;
        if (!Number.isFinite(servoDeg)) {
          throw new TableExportError(
            "solved-mismatch",
            `frame ${frame.index} holds ${servoDeg} for ${entry.name}; a table never holds a value that is not finite`,
          );
        }
        let cell: number;
        const pulse = angleToPulse(entry, servoDeg);
        const cellUs = wholePulse(pulse.us, entry.servo.minUs, entry.servo.maxUs);
        if (pulse.clamped) {
          const requested = angleToPulse({ servo: { ...entry.servo, minUs: -Infinity, maxUs: Infinity } }, servoDeg).us;
          clamped.push({
            frame: frame.index,
            column: entry.column,
            channel: entry.channel,
            name: entry.name,
            requestedUs: toFixedPoint(requested, 1),
            clampedUs: cellUs,
          });
        }
        if (units === "us") cell = cellUs;
        else if (units === "deg") cell = toFixedPoint(servoDeg, scale);
        else cell = toFixedPoint(servoDeg * RAD_PER_DEG, scale);
        // The cells are int32: a larger value would wrap silently into a wrong angle.
        if (!(cell >= INT32_MIN && cell <= INT32_MAX)) {
          throw new TableExportError(
            "value-out-of-range",
            `frame ${frame.index} holds ${servoDeg}° for ${entry.name}, more than a table's 32-bit integers hold in ${unitRounding.label}`,
          );
        }
        values[base + entry.column] = cell;
      }
    }
  }
  // In frame order, then column order, whatever order the legs were read in.
  clamped.sort((a, b) => a.frame - b.frame || a.column - b.column);

  const flags = countFlags(solved);
  if ((flags.errors > 0 || clamped.length > 0) && parsed.overrideReason === undefined) {
    const what = [
      flags.errors > 0 ? `${flags.errors} error flag${flags.errors === 1 ? "" : "s"} (${describeFlags(flags)})` : "",
      clamped.length > 0 ? `${clamped.length} pulse${clamped.length === 1 ? "" : "s"} clamped to the servo range` : "",
    ]
      .filter(Boolean)
      .join(" and ");
    throw new TableExportError("override-required", `gait "${meta.gaitName}" version ${meta.gaitVersion} has ${what}`, [
      { path: "overrideReason", message: "is required to export a table with errors; it is written into the table's header" },
    ]);
  }

  const tableMeta: TableMetadata = {
    exporterVersion: EXPORTER_VERSION,
    solverVersion: meta.solverVersion ?? null,
    exportedAt: meta.exportedAt ?? null,
    robot: { name: meta.robotName, revision: meta.robotRevision },
    gait: { name: meta.gaitName, version: meta.gaitVersion, contentHash: meta.contentHash, loop: meta.loop ?? null },
    calibrationProfile,
    units,
    values: {
      unit: units,
      description: `Each value is ${unitRounding.meaning}. ${calibrationProfile === null ? "No calibration profile applied: the robot's own servo settings." : `Calibration profile ${calibrationProfile} applied.`}`,
      step: unitRounding.step,
      decimals: unitRounding.decimals,
    },
    rateHz,
    framePeriodMs: timeToMicroseconds(1000 / rateHz) / 1000,
    frameCount: frames.length,
    channelCount,
    overrideReason: parsed.overrideReason ?? null,
    flags,
    clamped,
    safety: SAFETY_NOTICE,
  };
  return { meta: tableMeta, channels: channels.map(channelInfo), frameIndex, timeUs, values };
}
