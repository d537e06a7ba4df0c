// CSV table, RFC 4180: CRLF after every record (the last one too), fields
// quoted only when they hold a comma, a double quote, CR or LF (a quote inside
// doubled). One header record — `frame`, `time_ms`, then `LF.coxa`-style names
// in servo-channel order — and one record per frame. RFC 4180 has no comments,
// so the file is pure data: the metadata (robot, revision, gait version, hash,
// calibration profile, override reason, clamped cells, safety notice) is what
// angleTableMetadata returns, for the download's HTTP headers, and what the
// JSON and C tables carry inside.
import { formatFixed } from "./rounding";
import type { AngleTableData } from "./table";

const NEEDS_QUOTES = /[",\r\n]/;

/** One field as RFC 4180 writes it. */
export function csvField(text: string): string {
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export const CSV_FRAME_COLUMN = "frame";
export const CSV_TIME_COLUMN = "time_ms";

export function formatCsv(table: AngleTableData): string {
  const { meta, channels, frameIndex, timeUs, values } = table;
  const { decimals } = meta;
  const channelCount = channels.length;
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
  return `${records.join("\r\n")}\r\n`;
}
