// The first rows of an angle table as the file holds them (the same rounding),
// in a windowed list so that thousands of frames scroll smoothly.
import { formatFixed } from "~/export";
import { VirtualTable } from "./VirtualTable";

export type TablePreviewData = {
  channels: { column: number; channel: number; name: string; reversed: boolean; trimDeg: number }[];
  frameIndex: number[];
  timeUs: number[];
  /** shownRows × channels fixed-point integers, row by row. */
  values: number[];
  decimals: number;
  unitLabel: string;
  /** What the numbers are, naming the calibration profile applied: the table's meta.values.description. */
  valuesDescription: string;
  frameCount: number;
  shownRows: number;
};

export function TablePreview({ preview }: { preview: TablePreviewData }) {
  const width = preview.channels.length;
  const columns = [
    { key: "frame", label: "frame" },
    { key: "time", label: "time_ms" },
    ...preview.channels.map((channel) => ({
      key: channel.name,
      label: channel.name,
      title: `channel ${channel.channel}${channel.reversed ? ", reversed" : ""}${channel.trimDeg ? `, trim ${channel.trimDeg}°` : ""}`,
    })),
  ];
  const cell = (row: number, column: number) => {
    if (column === 0) return String(preview.frameIndex[row]);
    if (column === 1) return formatFixed(preview.timeUs[row], 3);
    return formatFixed(preview.values[row * width + column - 2], preview.decimals);
  };
  return (
    <div>
      <VirtualTable caption={`Table preview: ${preview.unitLabel}`} columns={columns} rowCount={preview.shownRows} cell={cell} />
      <p className="mt-1 text-xs text-ink-muted">
        {preview.shownRows < preview.frameCount
          ? `The first ${preview.shownRows} of ${preview.frameCount} frames; the file holds them all.`
          : `All ${preview.frameCount} frames`}
        {" · "}
        {preview.valuesDescription} Hover a column name for its channel.
      </p>
    </div>
  );
}
