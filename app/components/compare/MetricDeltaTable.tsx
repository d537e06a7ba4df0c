// The metrics of A and B with their change, and which side is better where
// better has a direction; shown by word and arrow, not colour alone.
import type { MetricRow } from "~/features/compare";
import { formatDelta, formatNumber } from "~/platform/format";

export function MetricDeltaTable({ rows }: { rows: readonly MetricRow[] }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-surface">
      <table className="w-full border-collapse text-left text-sm" aria-label="Metric deltas, B against A">
        <thead className="border-b border-line text-xs text-ink-muted">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">
              Metric
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              A
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              B
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Change (B − A)
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Better
            </th>
          </tr>
        </thead>
        <tbody>
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
        </tbody>
      </table>
    </div>
  );
}
