// Inputs of the robot editor. Each reads and writes the working document at its
// path and shows that path's validation messages right under it.
import { getAt, fieldId, pathText, type FieldPath } from "~/lib/robots/paths";
import { isLocked, issuesAt, useEditor } from "./editor-context";

function FieldMessages({ id, messages }: { id: string; messages: string[] }) {
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

export function NumberField({ path, label, width = "w-16", placeholder }: { path: FieldPath; label: string; width?: string; placeholder?: string }) {
  const state = useEditor();
  const key = pathText(path);
  const value = getAt(state.document, path);
  const text = state.texts[key] ?? (value === undefined || value === null ? "" : String(value));
  const messages = issuesAt(state, path);
  const id = fieldId(path);
  const locked = isLocked(state.mode, path);
  return (
    <>
      <input
        id={id}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        aria-label={label}
        aria-invalid={messages.length > 0 || undefined}
        aria-describedby={messages.length > 0 ? `${id}-issues` : undefined}
        readOnly={locked}
        placeholder={placeholder}
        value={text}
        onChange={(event) => state.setNumber(path, event.currentTarget.value)}
        className={`${inputBase} ${width} text-right font-mono tabular-nums ${messages.length > 0 ? "border-danger bg-danger-soft" : "border-line"}`}
      />
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}

export function TextField({
  path,
  label,
  width = "w-full",
  onChange,
  multiline,
}: {
  path: FieldPath;
  label: string;
  width?: string;
  onChange?: (value: string) => void;
  multiline?: boolean;
}) {
  const state = useEditor();
  const value = getAt(state.document, path);
  const messages = issuesAt(state, path);
  const id = fieldId(path);
  const locked = isLocked(state.mode, path);
  const props = {
    id,
    "aria-label": label,
    "aria-invalid": messages.length > 0 || undefined,
    "aria-describedby": messages.length > 0 ? `${id}-issues` : undefined,
    readOnly: locked,
    value: typeof value === "string" ? value : "",
    className: `${inputBase} ${width} ${messages.length > 0 ? "border-danger bg-danger-soft" : "border-line"}`,
  };
  const change = (next: string) => (onChange ? onChange(next) : state.setValue(path, next));
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

export function CheckboxField({ path, label }: { path: FieldPath; label: string }) {
  const state = useEditor();
  const value = getAt(state.document, path);
  const messages = issuesAt(state, path);
  const id = fieldId(path);
  const locked = isLocked(state.mode, path);
  return (
    <>
      <input
        id={id}
        type="checkbox"
        aria-label={label}
        aria-invalid={messages.length > 0 || undefined}
        aria-describedby={messages.length > 0 ? `${id}-issues` : undefined}
        checked={value === true}
        // A read-only checkbox: still focusable and announced, but it does not toggle.
        aria-readonly={locked || undefined}
        onChange={(event) => {
          if (!locked) state.setValue(path, event.currentTarget.checked);
        }}
        className="h-4 w-4 accent-accent"
      />
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}

export function SideField({ path, label, derived }: { path: FieldPath; label: string; derived: "left" | "right" }) {
  const state = useEditor();
  const value = getAt(state.document, path);
  const messages = issuesAt(state, path);
  const id = fieldId(path);
  const locked = isLocked(state.mode, path);
  return (
    <>
      <select
        id={id}
        aria-label={label}
        aria-invalid={messages.length > 0 || undefined}
        aria-describedby={messages.length > 0 ? `${id}-issues` : undefined}
        disabled={locked}
        value={value === "left" || value === "right" ? value : ""}
        onChange={(event) => state.setValue(path, event.currentTarget.value === "" ? undefined : event.currentTarget.value)}
        className={`${inputBase} ${messages.length > 0 ? "border-danger bg-danger-soft" : "border-line"} disabled:border-transparent disabled:bg-transparent disabled:text-ink`}
      >
        <option value="">{`${derived} (from y)`}</option>
        <option value="left">left</option>
        <option value="right">right</option>
      </select>
      <FieldMessages id={`${id}-issues`} messages={messages} />
    </>
  );
}
