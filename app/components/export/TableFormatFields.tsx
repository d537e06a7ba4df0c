// The format and units choices of every angle-table form (export page, bring-up tables).
import type { TableFormat, TableUnits } from "~/export";

export const fieldClass = "mt-1 w-full rounded-md border border-line bg-surface px-3 py-2";
export const labelClass = "block text-sm font-medium";

export function TableFormatFields({ idPrefix, format, units }: { idPrefix: string; format: TableFormat; units: TableUnits }) {
  return (
    <>
      <div>
        <label htmlFor={`${idPrefix}-format`} className={labelClass}>
          Format
        </label>
        <select id={`${idPrefix}-format`} name="format" defaultValue={format} key={`format-${format}`} className={fieldClass}>
          <option value="csv">CSV</option>
          <option value="json">JSON (with metadata)</option>
          <option value="c">C header</option>
        </select>
      </div>
      <div>
        <label htmlFor={`${idPrefix}-units`} className={labelClass}>
          Units
        </label>
        <select id={`${idPrefix}-units`} name="units" defaultValue={units} key={`units-${units}`} className={fieldClass}>
          <option value="deg">Degrees (0.1°)</option>
          <option value="rad">Radians (0.0001 rad)</option>
          <option value="us">Pulse widths (µs)</option>
        </select>
      </div>
    </>
  );
}
