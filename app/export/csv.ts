// CSV table: a comment header, then RFC 4180 records. RFC 4180 has no
// comments, so the header is lines starting with "# " before the first
// record, the convention the common readers skip when told to (decision 013):
// pandas `read_csv(path, comment="#")`, R `read.csv(path, comment.char = "#")`
// and readr `read_csv(path, comment = "#")`, papaparse `{ comments: "#" }`.
// Python's csv module and NumPy's loadtxt get the lines without them
// (`csv.reader(line for line in f if not line.startswith("#"))`); NumPy's
// genfromtxt(names=True) would take the first comment line for the names.
// The comment names the robot, revision, gait version, content hash,
// calibration profile, what the numbers are, rate, flags, override reason,
// exporter and the safety notice, each line made safe (no line breaks: names
// are the users' own text). Then one header record — `frame`, `time_ms`, then
// `LF.coxa`-style names in servo-channel order (leg ids are letters, digits
// and _, so no "#" ever starts or sits in a record) — and one record per
// frame; CRLF after every line (the last one too), fields quoted only when
// they hold a comma, a double quote, CR or LF (a quote inside doubled).
import { oneLine } from "./one-line";
import { UNIT_ROUNDING, formatFixed } from "./rounding";
import { NO_PROFILE, type AngleTableData, type TableMetadata } from "./table";
import { TABLE_FORMAT } from "./version";

const NEEDS_QUOTES = /[",\r\n]/;

/** One field as RFC 4180 writes it. */
export function csvField(text: string): string {
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export const CSV_FRAME_COLUMN = "frame";
export const CSV_TIME_COLUMN = "time_ms";
/** What starts every line of the comment header. */
export const CSV_COMMENT_PREFIX = "# ";

function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? "" : "s"}`;
}

/** The comment header's lines, without their "# ". */
export function csvComment(meta: TableMetadata): string[] {
  const rounding = UNIT_ROUNDING[meta.units];
  const periodMs = formatFixed(Math.round(meta.framePeriodMs * 1000), 3).replace(/\.?0+$/, "");
  const byKind = Object.entries(meta.flags.byKind).map(([kind, count]) => `${kind} ${count}`);
  return [
    `Gaitloom angle table (${TABLE_FORMAT}). Lines starting with # are comments; the data starts at the record "${CSV_FRAME_COLUMN},${CSV_TIME_COLUMN},...". Generated; do not edit.`,
    `Robot: ${meta.robot.name}, revision ${meta.robot.revision}`,
    `Gait: ${meta.gait.name}, version ${meta.gait.version}`,
    `Content hash: ${meta.gait.contentHash}`,
    `Calibration profile: ${meta.calibrationProfile ?? NO_PROFILE}`,
    `Units: ${meta.units}. Each joint column is ${rounding.meaning}. ${CSV_TIME_COLUMN} is milliseconds from the first frame.`,
    `Rate: ${meta.rateHz} Hz, ${plural(meta.frameCount, "frame")}, frame period ${periodMs} ms` +
      (meta.gait.loop === null ? "" : meta.gait.loop ? "; plays as a loop (the frame after the last is frame 0)" : "; plays once"),
    `Flags: ${plural(meta.flags.errors, "error")}, ${plural(meta.flags.warnings, "warning")}${byKind.length ? ` (${byKind.join(", ")})` : ""}; clamped pulses: ${meta.clamped.length === 0 ? "none" : `${meta.clamped.length} (see the JSON table's meta.clamped)`}`,
    `Override: ${meta.overrideReason ?? "none"}`,
    `Exporter: ${meta.exporterVersion}${meta.solverVersion ? `, solver ${meta.solverVersion}` : ""}${meta.exportedAt ? `, exported ${meta.exportedAt}` : ""}`,
    ...meta.safety.map((line) => `SAFETY: ${line}`),
  ].map(oneLine);
}

export function formatCsv(table: AngleTableData): string {
  const { meta, channels, frameIndex, timeUs, values } = table;
  const { decimals } = meta.values;
  const channelCount = channels.length;
  const comment = csvComment(meta).map((line) => `${CSV_COMMENT_PREFIX}${line}`);
  const header = [CSV_FRAME_COLUMN, CSV_TIME_COLUMN, ...channels.map((entry) => entry.name)].map(csvField).join(",");
  const records: string[] = new Array(frameIndex.length + 1);
  records[0] = header;
  const cells: string[] = new Array(channelCount + 2);
  for (let row = 0; row < frameIndex.length; row += 1) {
    cells[0] = String(frameIndex[row]);
    cells[1] = formatFixed(timeUs[row], 3);
    const base = row * channelCount;
    for (let column = 0; column < channelCount; column += 1) cells[column + 2] = formatFixed(values[base + column], decimals);
    records[row + 1] = cells.join(",");
  }
  return `${comment.join("\r\n")}\r\n${records.join("\r\n")}\r\n`;
}
