// A long table that renders only the rows in view (plus a margin): fixed row
// height, spacer rows above and below, the header kept in place. Enough for a
// few thousand frames without a package.
import { useCallback, useState } from "react";

export type VirtualColumn = { key: string; label: string; title?: string };

const ROW_HEIGHT_PX = 28;
const OVERSCAN_ROWS = 8;

export function VirtualTable({
  caption,
  columns,
  rowCount,
  cell,
  heightPx = 420,
}: {
  caption: string;
  columns: VirtualColumn[];
  rowCount: number;
  /** The text of one cell. */
  cell: (row: number, column: number) => string;
  heightPx?: number;
}) {
  const [scrollTop, setScrollTop] = useState(0);
  const onScroll = useCallback((event: React.UIEvent<HTMLDivElement>) => setScrollTop(event.currentTarget.scrollTop), []);
  const visible = Math.ceil(heightPx / ROW_HEIGHT_PX);
  const first = Math.max(0, Math.floor(scrollTop / ROW_HEIGHT_PX) - OVERSCAN_ROWS);
  const last = Math.min(rowCount, first + visible + 2 * OVERSCAN_ROWS);
  const rows: number[] = [];
  for (let row = first; row < last; row += 1) rows.push(row);
  return (
    <div
      role="region"
      aria-label={caption}
      tabIndex={0}
      onScroll={onScroll}
      style={{ height: Math.min(heightPx, (rowCount + 1) * ROW_HEIGHT_PX + 2) }}
      className="overflow-auto rounded-lg border border-line bg-surface"
    >
      <table className="w-max min-w-full border-collapse text-right font-mono text-xs" aria-rowcount={rowCount + 1}>
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 z-10 bg-sunken text-ink-muted">
          <tr aria-rowindex={1} style={{ height: ROW_HEIGHT_PX }}>
            {columns.map((column) => (
              <th key={column.key} scope="col" title={column.title} className="border-b border-line px-2 font-medium whitespace-nowrap">
                {column.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {first > 0 ? <tr aria-hidden="true" style={{ height: first * ROW_HEIGHT_PX }} /> : null}
          {rows.map((row) => (
            <tr key={row} aria-rowindex={row + 2} style={{ height: ROW_HEIGHT_PX }} className="border-b border-line last:border-0 even:bg-canvas">
              {columns.map((column, index) => (
                <td key={column.key} className="px-2 whitespace-nowrap">
                  {cell(row, index)}
                </td>
              ))}
            </tr>
          ))}
          {last < rowCount ? <tr aria-hidden="true" style={{ height: (rowCount - last) * ROW_HEIGHT_PX }} /> : null}
        </tbody>
      </table>
    </div>
  );
}
