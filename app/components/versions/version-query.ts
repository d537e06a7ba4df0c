// The gait page's query string: how its version table is sorted and filtered.
// Parsed with zod on the server; unknown or malformed values fall back to the
// defaults rather than failing the page, so an old pasted link still opens.
import { z } from "zod";
import { VERSION_STATES } from "~/features/versions/state-labels";

export const VERSION_SORTS = ["number", "date", "author", "state", "flags", "margin"] as const;
export const FLAG_FILTERS = ["errors", "warnings", "clean"] as const;

export const SORT_LABELS: Record<(typeof VERSION_SORTS)[number], string> = {
  number: "Version",
  date: "Date",
  author: "Author",
  state: "Status",
  flags: "Flags",
  margin: "Worst margin",
};

export const FLAG_FILTER_LABELS: Record<(typeof FLAG_FILTERS)[number], string> = {
  errors: "With errors",
  warnings: "Warnings only",
  clean: "Clean",
};

/** The natural first direction of each column: newest, most flagged, largest margin first. */
const DEFAULT_DIRECTIONS: Record<(typeof VERSION_SORTS)[number], "asc" | "desc"> = {
  number: "desc",
  date: "desc",
  author: "asc",
  state: "asc",
  flags: "desc",
  margin: "asc",
};

const optionalText = (limit: number) =>
  z
    .string()
    .trim()
    .max(limit)
    .optional()
    .catch(undefined)
    .transform((value) => (value ? value : undefined));

export const versionQuerySchema = z
  .object({
    sort: z.enum(VERSION_SORTS).catch("number").default("number"),
    dir: z.enum(["asc", "desc"]).optional().catch(undefined),
    state: z.enum(VERSION_STATES).optional().catch(undefined),
    author: optionalText(100),
    q: optionalText(200),
    flags: z.enum(FLAG_FILTERS).optional().catch(undefined),
  })
  .transform((query) => ({ ...query, dir: query.dir ?? DEFAULT_DIRECTIONS[query.sort] }));

export type VersionQueryValues = z.output<typeof versionQuerySchema>;

export function parseVersionQuery(search: URLSearchParams): VersionQueryValues {
  const raw: Record<string, string> = {};
  for (const key of ["sort", "dir", "state", "author", "q", "flags"]) {
    const value = search.get(key);
    if (value !== null && value !== "") raw[key] = value;
  }
  return versionQuerySchema.parse(raw);
}

/** The query string for the table sorted by `sort`: the same column again flips the direction. */
export function sortHref(query: VersionQueryValues, sort: (typeof VERSION_SORTS)[number]): string {
  const next = new URLSearchParams();
  const dir = query.sort === sort ? (query.dir === "asc" ? "desc" : "asc") : DEFAULT_DIRECTIONS[sort];
  next.set("sort", sort);
  next.set("dir", dir);
  for (const key of ["state", "author", "q", "flags"] as const) {
    const value = query[key];
    if (value) next.set(key, value);
  }
  return `?${next.toString()}`;
}

export const isFiltered = (query: VersionQueryValues) => Boolean(query.state || query.author || query.q || query.flags);
