// The metrics of A and B with their change, and which side is better where
// better has a direction; shown by word and arrow, not colour alone.
import type { MetricRow } from "~/features/compare";
import { formatDelta, formatNumber } from "~/platform/format";
import { FramedTable, type Column } from "~/components/common/FramedTable";

const COLUMNS: readonly Column[] = [
  { label: "Metric" },
  { label: "A", align: "right" },
  { label: "B", align: "right" },
  { label: "Change (B − A)", align: "right" },
  { label: "Better" },
];

export function MetricDeltaTable({ rows }: { rows: readonly MetricRow[] }) {
  return (
    <FramedTable label="Metric deltas, B against A" columns={COLUMNS}>
      {rows.map((row) => (
        <tr key={row.id} className="border-b border-line last:border-0" data-metric={row.id}>
          <th scope="row" className="px-3 py-1.5 font-normal">
            {row.label}
          </th>
          <td className="px-3 py-1.5 text-right font-mono whitespace-nowrap tabular-nums">
            {formatNumber(row.a, row.digits, row.unit)}
            {row.whereA ? <span className="ml-1 font-sans text-xs text-ink-muted">{row.whereA}</span> : null}
          </td>
          <td className="px-3 py-1.5 text-right font-mono whitespace-nowrap tabular-nums">
            {formatNumber(row.b, row.digits, row.unit)}
            {row.whereB ? <span className="ml-1 font-sans text-xs text-ink-muted">{row.whereB}</span> : null}
          </td>
          <td className="px-3 py-1.5 text-right font-mono whitespace-nowrap tabular-nums">{formatDelta(row.delta, row.digits, row.unit)}</td>
          <td className="px-3 py-1.5 whitespace-nowrap">
            {row.better === "b" ? (
              <span className="text-ok">
                <span aria-hidden="true">▲ </span>B
              </span>
            ) : row.better === "a" ? (
              <span className="text-danger">
                <span aria-hidden="true">▼ </span>A
              </span>
            ) : (
              <span className="text-ink-muted">—</span>
            )}
          </td>
        </tr>
      ))}
    </FramedTable>
  );
}
