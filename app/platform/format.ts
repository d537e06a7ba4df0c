// How times and numbers read on a page, in a mail or in a refusal. Times are
// UTC in one fixed ISO-like format, never the reader's locale, so the server's
// HTML and the browser's first render agree (a locale string differs between
// the two and breaks hydration).

type Moment = Date | string | number;

/** The first `characters` of the ISO 8601 form, with a space for the T. */
const isoUtc = (value: Moment, characters: 10 | 16 | 19) => new Date(value).toISOString().slice(0, characters).replace("T", " ");

/** 2025-03-04 (the UTC date). */
export const formatDate = (value: Moment) => isoUtc(value, 10);

/**
 * 2025-03-04 14:05 UTC. `seconds` adds them (an audit log, a mail's arrival);
 * `zone: false` leaves out "UTC" where the column heading already says it.
 */
export function formatTime(value: Moment, { seconds = false, zone = true }: { seconds?: boolean; zone?: boolean } = {}): string {
  const text = isoUtc(value, seconds ? 19 : 16);
  return zone ? `${text} UTC` : text;
}

/**
 * The reader's own clock and locale, for what only ever renders in the browser
 * (edits kept in this browser's storage): "4 Mar 2025, 15:05".
 */
export const formatLocalTime = (value: Moment) => new Date(value).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

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

/** A content hash short enough to read and still tell versions apart. */
export const shortHash = (hash: string) => hash.slice(0, 12);
