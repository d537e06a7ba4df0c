// C header table: compiles cleanly with `gcc -std=c99 -Wall -Wextra -Werror
// -pedantic`. With <gait> the sanitised gait name and <unit> deg10, rad10000 or us:
//
//   /* comment block: robot, revision, gait, version, content hash, units,
//      rate, calibration profile, override reason, flags, clamped cells,
//      exporter and solver versions, the safety notice, the column list */
//   #ifndef GAITLOOM_<GAIT>_<UNIT>_H
//   #define GAITLOOM_<GAIT>_<UNIT>_H
//   #include <stdint.h>
//   #define GAITLOOM_<GAIT>_<UNIT>_FRAMES           frame count
//   #define GAITLOOM_<GAIT>_<UNIT>_CHANNELS         channel (column) count
//   #define GAITLOOM_<GAIT>_<UNIT>_FRAME_PERIOD_US  1e6 / rate, whole µs
//   #define GAITLOOM_<GAIT>_<UNIT>_SCALE            cell = value × SCALE
//   #define GAITLOOM_<GAIT>_<UNIT>_LOOP             1 loop, 0 once (when known)
//   static const uint8_t gaitloom_<gait>_<unit>_channel[CHANNELS];   servo channel of each column
//   static const int16_t gaitloom_<gait>_deg10[FRAMES][CHANNELS];    (int32_t _rad10000, uint16_t _us)
//   #endif
//
// Every name carries the unit, so a degree and a pulse header of one gait can
// be included together. The cells are the same integers the CSV and JSON
// tables print with decimals; the comment says what a cell is and how to get
// back to the unit (radians = cell / 10000), as the JSON's meta.values does.
import { TableExportError } from "./errors";
import { CONTROL_CHARACTERS } from "./one-line";
import { UNIT_ROUNDING, formatFixed } from "./rounding";
import { NO_PROFILE, type AngleTableData } from "./table";

const MAX_IDENTIFIER_PART = 40;

/** The gait name as a C identifier part: lower-case ASCII letters, digits and single underscores ("gait" if nothing is left). */
export function cIdentifier(name: string, fallback = "gait", maxLength = MAX_IDENTIFIER_PART): string {
  const ascii = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "_")
    .replace(/^_+|_+$/g, "")
    .slice(0, maxLength)
    .replace(/_+$/, "");
  return ascii || fallback;
}

/**
 * Text safe inside a C block comment on one line: no control characters or
 * line breaks, no comment delimiters (gcc's -Wcomment warns of a nested "/*"),
 * no trigraphs ("??/" before a line end would splice lines). Our own unit
 * symbols become ASCII; other characters of names (UTF-8) are kept.
 */
export function cCommentText(text: string): string {
  return text
    .replace(/°/g, " deg")
    .replace(/µ/g, "u")
    .replace(/[·×]/g, "x")
    .replace(/[−–—]/g, "-")
    .replace(CONTROL_CHARACTERS, " ")
    .replace(/\*\//g, "* /")
    .replace(/\/\*/g, "/ *")
    .replace(/\?\?/g, "? ?")
    .trimEnd();
}

export function formatCHeader(table: AngleTableData): string {
  const { meta, channels, frameIndex, timeUs, values } = table;
  const rounding = UNIT_ROUNDING[meta.units];
  const gait = cIdentifier(meta.gait.name);
  const array = `gaitloom_${gait}_${rounding.cSuffix}`;
  const macro = array.toUpperCase();
  const channelCount = channels.length;
  const frameCount = frameIndex.length;

  for (let i = 0; i < values.length; i += 1) {
    if (values[i] < rounding.min || values[i] > rounding.max) {
      const column = i % channelCount;
      throw new TableExportError(
        "value-out-of-range",
        `frame ${frameIndex[Math.floor(i / channelCount)]}, ${channels[column].name}: ${formatFixed(values[i], rounding.decimals)} does not fit the C table's ${rounding.cType}`,
      );
    }
  }

  const periodUs = Math.round(meta.framePeriodMs * 1000);
  const comment: string[] = [
    "Gaitloom angle table. Generated; do not edit.",
    "",
    `Cells:        ${rounding.cCell} (${macro}_SCALE)`,
    `Robot:        ${meta.robot.name}, revision ${meta.robot.revision}`,
    `Gait:         ${meta.gait.name}, version ${meta.gait.version}`,
    `Content hash: ${meta.gait.contentHash}`,
    `Rate:         ${meta.rateHz} Hz, ${frameCount} frames, frame period ${periodUs} us` +
      (meta.gait.loop === null ? "" : meta.gait.loop ? ", plays as a loop (frame N is frame 0)" : ", plays once"),
    `Units:        ${meta.units === "us" ? "pulse widths (us), reversal, centre and us/degree applied, clamped to each servo's range" : `servo ${meta.units === "deg" ? "degrees" : "radians"} in each joint's own sign (reversal belongs to pulses)`}`,
    `Calibration:  ${meta.calibrationProfile ?? NO_PROFILE}`,
    `Override:     ${meta.overrideReason ?? "none"}`,
    `Flags:        ${meta.flags.errors} errors, ${meta.flags.warnings} warnings` +
      (Object.keys(meta.flags.byKind).length
        ? ` (${Object.entries(meta.flags.byKind)
            .map(([kind, count]) => `${kind} ${count}`)
            .join(", ")})`
        : ""),
    `Clamped:      ${meta.clamped.length === 0 ? "none" : `${meta.clamped.length} cells whose pulse lies outside the servo range`}`,
  ];
  for (const cell of meta.clamped) {
    comment.push(`  frame ${cell.frame}, channel ${cell.channel} (${cell.name}): ${cell.requestedUs} us asked, ${cell.clampedUs} us given`);
  }
  comment.push(
    `Exporter:     ${meta.exporterVersion}${meta.solverVersion ? `, solver ${meta.solverVersion}` : ""}${meta.exportedAt ? `, exported ${meta.exportedAt}` : ""}`,
    "",
    "SAFETY:",
    ...meta.safety.map((line) => `  ${line}`),
    "",
    "Columns (column: channel, leg.joint):",
    ...channels.map(
      (entry) =>
        `  ${entry.column}: channel ${entry.channel}, ${entry.name}${entry.reversed ? ", reversed" : ""}${entry.trimDeg !== 0 ? `, trim ${entry.trimDeg} deg` : ""}`,
    ),
  );

  const lines: string[] = [];
  lines.push("/*");
  for (const line of comment) lines.push(line === "" ? " *" : ` * ${cCommentText(line)}`);
  lines.push(" */");
  lines.push(`#ifndef ${macro}_H`, `#define ${macro}_H`, "", "#include <stdint.h>", "");
  lines.push(`#define ${macro}_FRAMES ${frameCount}`);
  lines.push(`#define ${macro}_CHANNELS ${channelCount}`);
  lines.push(`#define ${macro}_FRAME_PERIOD_US ${periodUs}`);
  lines.push(`#define ${macro}_SCALE ${rounding.scale}`);
  if (meta.gait.loop !== null) lines.push(`#define ${macro}_LOOP ${meta.gait.loop ? 1 : 0}`);
  lines.push("");
  lines.push(`/* Servo channel of each column. */`);
  lines.push(`static const uint8_t ${array}_channel[${macro}_CHANNELS] = { ${channels.map((entry) => entry.channel).join(", ")} };`);
  lines.push("");
  lines.push(`/* [frame][column]: ${cCommentText(rounding.cCell)}. */`);
  lines.push(`static const ${rounding.cType} ${array}[${macro}_FRAMES][${macro}_CHANNELS] = {`);
  const cells: string[] = new Array(channelCount);
  for (let row = 0; row < frameCount; row += 1) {
    const base = row * channelCount;
    for (let column = 0; column < channelCount; column += 1) cells[column] = String(values[base + column]);
    lines.push(`  { ${cells.join(", ")} }${row + 1 < frameCount ? "," : ""} /* ${frameIndex[row]}: ${formatFixed(timeUs[row], 3)} ms */`);
  }
  lines.push("};", "", `#endif /* ${macro}_H */`, "");
  return lines.join("\n");
}
