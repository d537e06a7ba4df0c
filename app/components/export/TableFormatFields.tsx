// The fields every angle-table form shares (export page, bring-up tables):
// format and units, the calibration profile, the override reason, the button.
import type { ReactNode } from "react";
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

export function ProfileField({
  idPrefix,
  profiles,
  value,
  resetKey,
  invalid,
  children,
}: {
  idPrefix: string;
  profiles: { name: string; revision: number }[];
  value: string | null | undefined;
  /** Changes when the choices belong to another robot, so the select starts over. */
  resetKey: string;
  invalid?: boolean;
  /** Shown under the select (a link to the profiles). */
  children?: ReactNode;
}) {
  return (
    <div>
      <label htmlFor={`${idPrefix}-profile`} className={labelClass}>
        Calibration profile
      </label>
      <select
        id={`${idPrefix}-profile`}
        name="profile"
        defaultValue={value ?? ""}
        key={`profile-${resetKey}-${value}`}
        className={fieldClass}
        aria-invalid={invalid || undefined}
      >
        <option value="">None — the robot definition</option>
        {profiles.map((entry) => (
          <option key={entry.name} value={entry.name}>
            {entry.name} (revision {entry.revision})
          </option>
        ))}
      </select>
      {children}
    </div>
  );
}

export function OverrideField({
  idPrefix,
  value,
  needed,
  help,
  placeholder,
  className = "",
}: {
  idPrefix: string;
  value: string | null | undefined;
  /** The last request was refused for want of a reason: the field is marked and focused. */
  needed?: boolean;
  help: string;
  placeholder?: string;
  className?: string;
}) {
  return (
    <div className={`${className} ${needed ? "rounded-md bg-danger-soft p-2" : ""}`}>
      <label htmlFor={`${idPrefix}-override`} className={labelClass}>
        Override reason
      </label>
      <input
        id={`${idPrefix}-override`}
        name="override"
        type="text"
        maxLength={1000}
        defaultValue={value ?? ""}
        autoFocus={needed}
        aria-invalid={needed || undefined}
        aria-describedby={`${idPrefix}-override-help`}
        placeholder={placeholder}
        className={fieldClass}
      />
      <p id={`${idPrefix}-override-help`} className="mt-1 text-xs text-ink-muted">
        {help}
      </p>
    </div>
  );
}

export function ShowTableButton({ busy }: { busy: boolean }) {
  return (
    <div className="flex items-end">
      <button type="submit" className="w-full rounded-md border border-line px-4 py-2 font-medium hover:bg-sunken">
        {busy ? "Making the table…" : "Show the table"}
      </button>
    </div>
  );
}
