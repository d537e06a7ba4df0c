// The fields every angle-table form shares (export page, bring-up tables):
// the choices, format and units, the numbers, the calibration profile, the
// override reason.
import type { ReactNode } from "react";
import type { TableFormat, TableUnits } from "~/export";

export const fieldClass = "mt-1 w-full rounded-md border border-line bg-surface px-3 py-2";
export const labelClass = "block text-sm font-medium";

/** A choice of the table's query; `resetKey` changes when the choices or the chosen value come from elsewhere, so the select starts over. */
export function SelectField({
  id,
  name,
  label,
  value,
  resetKey,
  invalid,
  className,
  children,
  after,
}: {
  id: string;
  name: string;
  label: string;
  value: string;
  resetKey: string;
  invalid?: boolean;
  className?: string;
  /** The options. */
  children: ReactNode;
  /** Shown under the select (a link to the profiles). */
  after?: ReactNode;
}) {
  return (
    <div className={className}>
      <label htmlFor={id} className={labelClass}>
        {label}
      </label>
      <select id={id} name={name} defaultValue={value} key={resetKey} className={fieldClass} aria-invalid={invalid || undefined}>
        {children}
      </select>
      {after}
    </div>
  );
}

export function TableFormatFields({ idPrefix, format, units }: { idPrefix: string; format: TableFormat; units: TableUnits }) {
  return (
    <>
      <SelectField id={`${idPrefix}-format`} name="format" label="Format" value={format} resetKey={`format-${format}`}>
        <option value="csv">CSV</option>
        <option value="json">JSON (with metadata)</option>
        <option value="c">C header</option>
      </SelectField>
      <SelectField id={`${idPrefix}-units`} name="units" label="Units" value={units} resetKey={`units-${units}`}>
        <option value="deg">Degrees (0.1°)</option>
        <option value="rad">Radians (0.0001 rad)</option>
        <option value="us">Pulse widths (µs)</option>
      </SelectField>
    </>
  );
}

/** A number of the table's query, typed in full (the form sends it on Enter or the button). */
export function QueryNumberField({
  id,
  name,
  label,
  min,
  max,
  step = "any",
  value,
  placeholder,
  invalid,
  help,
}: {
  id: string;
  name: string;
  label: string;
  min: string;
  max: string;
  step?: string;
  value: number | string;
  placeholder?: string;
  invalid?: boolean;
  help?: string;
}) {
  return (
    <div>
      <label htmlFor={id} className={labelClass}>
        {label}
      </label>
      <input
        id={id}
        name={name}
        type="number"
        step={step}
        min={min}
        max={max}
        defaultValue={value}
        placeholder={placeholder}
        aria-describedby={help ? `${id}-help` : undefined}
        aria-invalid={invalid || undefined}
        className={`${fieldClass} text-right`}
      />
      {help ? (
        <p id={`${id}-help`} className="mt-1 text-xs text-ink-muted">
          {help}
        </p>
      ) : null}
    </div>
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
    <SelectField
      id={`${idPrefix}-profile`}
      name="profile"
      label="Calibration profile"
      value={value ?? ""}
      resetKey={`profile-${resetKey}-${value}`}
      invalid={invalid}
      after={children}
    >
      <option value="">None — the robot definition</option>
      {profiles.map((entry) => (
        <option key={entry.name} value={entry.name}>
          {entry.name} (revision {entry.revision})
        </option>
      ))}
    </SelectField>
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
