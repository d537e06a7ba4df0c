// Inputs of the robot editor. Each shows the value it is given and that path's
// validation messages right under it, and writes through the editor's actions.
import { decimalInput } from "~/components/common/decimal-input";
import { fieldId, type FieldPath } from "~/features/robots/paths";
import { isLocked, useEditorActions, type FieldData } from "./robot-form-context";

function FieldMessages({ id, messages }: { id: string; messages: readonly string[] }) {
  if (messages.length === 0) return null;
  return (
    <span id={id} className="mt-0.5 block max-w-48 text-left text-xs leading-snug font-normal text-danger">
      {messages.map((message) => (
        <span key={message} className="block">
          <span aria-hidden>⚠ </span>
          {message}
        </span>
      ))}
    </span>
  );
}

const inputBase =
  "rounded border bg-surface px-1.5 py-0.5 text-sm outline-none focus-visible:border-accent read-only:border-transparent read-only:bg-transparent";

const invalidClass = (messages: readonly string[]) => (messages.length > 0 ? "border-danger bg-danger-soft" : "border-line");

function describedBy(id: string, messages: readonly string[]) {
  return {
    "aria-invalid": messages.length > 0 || undefined,
    "aria-describedby": messages.length > 0 ? `${id}-issues` : undefined,
  };
}

type FieldProps = { path: FieldPath; label: string; data: FieldData };

export function NumberField({ path, label, data, width = "w-16", placeholder }: FieldProps & { width?: string; placeholder?: string }) {
  const { mode, setNumber } = useEditorActions();
  const { value, messages } = data;
  const text = data.text ?? (value === undefined || value === null ? "" : String(value));
  const id = fieldId(path);
  return (
    <>
      <input
        id={id}
        {...decimalInput}
        aria-label={label}
        {...describedBy(id, messages)}
        readOnly={isLocked(mode, path)}
        placeholder={placeholder}
        value={text}
        onChange={(event) => setNumber(path, event.currentTarget.value)}
        className={`${inputBase} ${width} text-right font-mono tabular-nums ${invalidClass(messages)}`}
      />
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}

export function TextField({
  path,
  label,
  data,
  width = "w-full",
  onChange,
  multiline,
}: FieldProps & { width?: string; onChange?: (value: string) => void; multiline?: boolean }) {
  const { mode, setValue } = useEditorActions();
  const { value, messages } = data;
  const id = fieldId(path);
  const props = {
    id,
    "aria-label": label,
    ...describedBy(id, messages),
    readOnly: isLocked(mode, path),
    value: typeof value === "string" ? value : "",
    className: `${inputBase} ${width} ${invalidClass(messages)}`,
  };
  const change = (next: string) => (onChange ? onChange(next) : setValue(path, next));
  return (
    <>
      {multiline ? (
        <textarea {...props} rows={2} onChange={(event) => change(event.currentTarget.value)} />
      ) : (
        <input {...props} type="text" autoComplete="off" onChange={(event) => change(event.currentTarget.value)} />
      )}
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}

export function CheckboxField({ path, label, data }: FieldProps) {
  const { mode, setValue } = useEditorActions();
  const { value, messages } = data;
  const id = fieldId(path);
  const locked = isLocked(mode, path);
  return (
    <>
      <input
        id={id}
        type="checkbox"
        aria-label={label}
        {...describedBy(id, messages)}
        checked={value === true}
        // A read-only checkbox: still focusable and announced, but it does not toggle.
        aria-readonly={locked || undefined}
        onChange={(event) => {
          if (!locked) setValue(path, event.currentTarget.checked);
        }}
        className="h-4 w-4 accent-accent"
      />
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}

export function SideField({ path, label, data, derived }: FieldProps & { derived: "left" | "right" }) {
  const { mode, setValue } = useEditorActions();
  const { value, messages } = data;
  const id = fieldId(path);
  return (
    <>
      <select
        id={id}
        aria-label={label}
        {...describedBy(id, messages)}
        disabled={isLocked(mode, path)}
        value={value === "left" || value === "right" ? value : ""}
        onChange={(event) => setValue(path, event.currentTarget.value === "" ? undefined : event.currentTarget.value)}
        className={`${inputBase} ${invalidClass(messages)} disabled:border-transparent disabled:bg-transparent disabled:text-ink`}
      >
        <option value="">{`${derived} (from y)`}</option>
        <option value="left">left</option>
        <option value="right">right</option>
      </select>
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}
