// The export and bring-up pages' GET form: a choice (a select or a radio
// button) shows its table at once, while text and number fields wait for
// Enter or the button, which also serves before the page has hydrated.
import type { FormEvent, ReactNode } from "react";
import { Form, useLocation, useNavigation, useSubmit } from "react-router";

/** Whether this page is loading its next table (the form's button says so, the preview dims). */
export function useTableBusy(): boolean {
  const navigation = useNavigation();
  const { pathname } = useLocation();
  return navigation.state === "loading" && navigation.location?.pathname === pathname;
}

/**
 * A new choice in the field `resets` names starts over without the fields in
 * `dropped` (another gait without the old gait's version and profile).
 */
export function TableQueryForm({
  label,
  resets,
  dropped,
  busy,
  children,
}: {
  label: string;
  resets: string;
  dropped: readonly string[];
  busy: boolean;
  children: ReactNode;
}) {
  const submit = useSubmit();
  const onChange = (event: FormEvent<HTMLFormElement>) => {
    const target = event.target as HTMLInputElement | HTMLSelectElement;
    if (target.tagName !== "SELECT" && target.type !== "radio") return;
    const drop = target.name === resets ? dropped : [];
    const search = new URLSearchParams();
    for (const [key, value] of new FormData(event.currentTarget)) if (typeof value === "string" && value !== "" && !drop.includes(key)) search.set(key, value);
    submit(search, { method: "get", replace: true, preventScrollReset: true });
  };
  return (
    <Form method="get" onChange={onChange} aria-label={label} className="grid grid-cols-2 gap-4 rounded-lg border border-line bg-surface p-5 lg:grid-cols-4">
      {children}
      <div className="flex items-end">
        <button type="submit" className="w-full rounded-md border border-line px-4 py-2 font-medium hover:bg-sunken">
          {busy ? "Making the table…" : "Show the table"}
        </button>
      </div>
    </Form>
  );
}
