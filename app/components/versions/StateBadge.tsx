// A version's review state as a badge: a shape and a word, never colour alone.
import type { VersionState } from "../../../db/schema";
import { STATE_LABELS } from "~/features/versions/state-labels";

const LOOKS: Record<VersionState, { mark: string; className: string }> = {
  committed: { mark: "○", className: "bg-sunken text-ink" },
  "in-review": { mark: "◐", className: "bg-accent-soft text-accent-strong" },
  "sent-back": { mark: "↩", className: "bg-warning-soft text-warning" },
  approved: { mark: "✓", className: "bg-ok-soft text-ok" },
  released: { mark: "★", className: "bg-ok-soft text-ok font-semibold" },
  retired: { mark: "–", className: "bg-sunken text-ink-muted" },
};

export function StateBadge({ state }: { state: VersionState }) {
  const look = LOOKS[state];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded px-1.5 py-0.5 text-xs ${look.className}`} data-state={state}>
      <span aria-hidden="true">{look.mark}</span>
      {STATE_LABELS[state]}
    </span>
  );
}
