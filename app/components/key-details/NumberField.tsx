// A number typed in full before it counts: committed on Enter or leaving the
// field (one undo step per change), put back with Escape; a value that is not
// a number is shown as such and not committed.
import { useEffect, useId, useState } from "react";
import { decimalInput } from "~/components/common/decimal-input";

export type NumberFieldProps = {
  label: string;
  value: number | undefined;
  onCommit: (value: number | undefined) => void;
  unit?: string;
  placeholder?: string;
  disabled?: boolean;
  /** Empty means "the default" for optional fields. */
  optional?: boolean;
  digits?: number;
  min?: number;
  max?: number;
  width?: string;
};

const format = (value: number | undefined, digits: number) => (value === undefined ? "" : String(Math.round(value * 10 ** digits) / 10 ** digits));

export function NumberField({ label, value, onCommit, unit, placeholder, disabled, optional, digits = 1, min, max, width = "w-20" }: NumberFieldProps) {
  const [text, setText] = useState(format(value, digits));
  const [problem, setProblem] = useState<string | null>(null);
  const id = useId();
  useEffect(() => {
    setText(format(value, digits));
    setProblem(null);
  }, [value, digits]);

  const commit = () => {
    const trimmed = text.trim();
    if (trimmed === "") {
      if (optional) {
        setProblem(null);
        if (value !== undefined) onCommit(undefined);
        return;
      }
      setProblem("needs a number");
      return;
    }
    const number = Number(trimmed.replace(",", "."));
    if (!Number.isFinite(number)) return setProblem(`"${trimmed}" is not a number`);
    if (min !== undefined && number < min) return setProblem(`must be at least ${min}`);
    if (max !== undefined && number > max) return setProblem(`must be at most ${max}`);
    setProblem(null);
    if (number !== value) onCommit(number);
  };

  return (
    <div className="flex flex-col">
      <label htmlFor={id} className="text-xs text-ink-muted">
        {label}
        {unit ? ` (${unit})` : ""}
      </label>
      <input
        id={id}
        {...decimalInput}
        disabled={disabled}
        value={text}
        placeholder={placeholder}
        aria-invalid={problem ? true : undefined}
        aria-describedby={problem ? `${id}-problem` : undefined}
        onChange={(event) => setText(event.currentTarget.value)}
        onBlur={commit}
        onKeyDown={(event) => {
          if (event.key === "Enter") {
            event.preventDefault();
            commit();
          } else if (event.key === "Escape") {
            setText(format(value, digits));
            setProblem(null);
          }
        }}
        className={`${width} rounded border bg-surface px-1.5 py-0.5 text-right font-mono text-sm tabular-nums disabled:bg-transparent ${problem ? "border-danger bg-danger-soft" : "border-line"}`}
      />
      {problem ? (
        <span id={`${id}-problem`} className="text-xs text-danger">
          <span aria-hidden>⚠ </span>
          {problem}
        </span>
      ) : null}
    </div>
  );
}
