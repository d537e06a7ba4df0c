// A table in the app's frame: rounded border, scrolling sideways on narrow
// screens, small muted column headings; the caller gives the body's rows.
import type { ReactNode } from "react";

/** A column heading; numbers are right-aligned under a right-aligned heading; a hidden label is for screen readers only (a column of actions). */
export type Column = { label: string; align?: "right"; hidden?: boolean };

export function FramedTable({ label, columns, children }: { label: string; columns: readonly Column[]; children: ReactNode }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-surface">
      <table className="w-full border-collapse text-left text-sm" aria-label={label}>
        <thead className="border-b border-line text-xs text-ink-muted">
          <tr>
            {columns.map((column) => (
              <th key={column.label} scope="col" className={column.align === "right" ? "px-3 py-2 text-right font-medium" : "px-3 py-2 font-medium"}>
                {column.hidden ? <span className="sr-only">{column.label}</span> : column.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
