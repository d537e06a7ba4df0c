import type { ReactNode } from "react";
import { Form } from "react-router";

type Props = {
  /** The action's intent, sent with the row's id under `idName`. */
  intent: string;
  idName: string;
  id: string;
  /** What a screen reader hears: the action and the row it acts on. */
  label: string;
  /** A danger action (revoke, sign out) reads red. */
  danger?: boolean;
  children: ReactNode;
};

/** One row's action in a table of settings: a form of its own with the intent and the row's id, and a small button. */
export function RowAction({ intent, idName, id, label, danger = false, children }: Props) {
  return (
    <Form method="post">
      <input type="hidden" name="intent" value={intent} />
      <input type="hidden" name={idName} value={id} />
      <button type="submit" className={`rounded-md border border-line px-3 py-1 text-sm hover:bg-sunken ${danger ? "text-danger" : ""}`} aria-label={label}>
        {children}
      </button>
    </Form>
  );
}
