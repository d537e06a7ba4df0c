// JSON table, format "gaitloom.table/2":
//   {
//     "format": "gaitloom.table/2",
//     "meta": { exporterVersion, solverVersion, exportedAt, robot: { name, revision },
//               gait: { name, version, contentHash, loop }, calibrationProfile, units,
//               values: { unit, description, step, decimals },
//               rateHz, framePeriodMs, frameCount, channelCount,
//               overrideReason, flags: { errors, warnings, byKind }, clamped: [...], safety: [...] },
//     "channels": [ { column, channel, leg, joint, name, reversed, centerUs, usPerDeg, minUs, maxUs, trimDeg } ],
//     "frames": [ { "index": 0, "timeMs": 0.000, "values": [ ... one per channel, in channel order ] } ]
//   }
// Numbers in `frames` are plain values in meta.values.unit (never scaled),
// printed from the same fixed-point integers as the CSV and C tables with the
// same decimals (so the text of a cell is the CSV's text); one frame per line
// so that long tables stay readable and diffable.
import { formatFixed } from "./rounding";
import type { AngleTableData } from "./table";
import { TABLE_FORMAT } from "./version";

function indented(value: unknown, indent: string): string {
  return JSON.stringify(value, null, 2).replace(/\n/g, `\n${indent}`);
}

export function formatJson(table: AngleTableData): string {
  const { meta, channels, frameIndex, timeUs, values } = table;
  const { decimals } = meta.values;
  const channelCount = channels.length;
  const frames: string[] = new Array(frameIndex.length);
  const cells: string[] = new Array(channelCount);
  for (let row = 0; row < frameIndex.length; row += 1) {
    const base = row * channelCount;
    for (let column = 0; column < channelCount; column += 1) cells[column] = formatFixed(values[base + column], decimals);
    frames[row] = `    {"index":${frameIndex[row]},"timeMs":${formatFixed(timeUs[row], 3)},"values":[${cells.join(",")}]}`;
  }
  return [
    "{",
    `  "format": ${JSON.stringify(TABLE_FORMAT)},`,
    `  "meta": ${indented(meta, "  ")},`,
    `  "channels": [`,
    channels.map((entry) => `    ${JSON.stringify(entry)}`).join(",\n"),
    "  ],",
    `  "frames": [`,
    frames.join(",\n"),
    "  ]",
    "}",
    "",
  ].join("\n");
}
