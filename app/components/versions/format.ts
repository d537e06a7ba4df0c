// How versions read on the page: state names, numbers with units, times.
import type { VersionState } from "../../../db/schema";

export { formatTime } from "~/components/robots/RevisionHistory";

export const VERSION_STATES = ["committed", "in-review", "sent-back", "approved", "released", "retired"] as const satisfies readonly VersionState[];

export const STATE_LABELS: Record<VersionState, string> = {
  committed: "Committed",
  "in-review": "In review",
  "sent-back": "Sent back",
  approved: "Approved",
  released: "Released",
  retired: "Retired",
};

/** A number with its unit, or a dash; the minus sign is a real minus. */
export function formatNumber(value: number | null | undefined, digits = 1, unit = ""): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const text = Math.abs(value).toFixed(digits);
  return `${value < 0 && Number(text) !== 0 ? "−" : ""}${text}${unit ? ` ${unit}` : ""}`;
}

/** A change with its sign: +5.0 mm, −200 ms, ±0. */
export function formatDelta(value: number | null | undefined, digits = 1, unit = ""): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const text = Math.abs(value).toFixed(digits);
  if (Number(text) === 0) return `±0${unit ? ` ${unit}` : ""}`;
  return `${value > 0 ? "+" : "−"}${text}${unit ? ` ${unit}` : ""}`;
}

export const shortHash = (hash: string) => hash.slice(0, 12);
