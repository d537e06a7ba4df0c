// The versions of a gait: sortable columns (links that change the query
// string), each version's status and checks, a pick of two to compare, and
// "start a new draft from this version" for those who may edit.
import { Form, Link } from "react-router";
import type { VersionState } from "../../../db/schema";
import { FlagCounts } from "./FlagCounts";
import { StateBadge } from "./StateBadge";
import { formatNumber, formatTime } from "~/platform/format";
import { SORT_LABELS, sortHref, type VersionQueryValues } from "./version-query";

export type VersionTableRow = {
  id: string;
  number: number;
  message: string;
  author: { name: string } | null;
  createdAt: Date | string;
  state: VersionState;
  errors: number;
  warnings: number;
  worstMarginMm: number | null;
  robotRevision: number;
};

export type VersionTableProps = {
  gaitId: string;
  rows: readonly VersionTableRow[];
  /** Every version of the gait, for the comparison picker's defaults. */
  allVersions: readonly { id: string; number: number }[];
  query: VersionQueryValues;
  canRestore: boolean;
  draftRevision: number;
  /** The version a restore is being sent for, to show progress. */
  restoring: string | null;
};

const COMPARE_FORM = "compare-versions";

function SortHeader({ query, sort, align = "left" }: { query: VersionQueryValues; sort: keyof typeof SORT_LABELS; align?: "left" | "right" }) {
  const active = query.sort === sort;
  const arrow = active ? (query.dir === "asc" ? "▲" : "▼") : "";
  return (
    <th
      scope="col"
      className={`px-3 py-2 font-medium ${align === "right" ? "text-right" : ""}`}
      aria-sort={active ? (query.dir === "asc" ? "ascending" : "descending") : undefined}
    >
      <Link to={sortHref(query, sort)} className="inline-flex items-center gap-1 hover:text-ink" preventScrollReset>
        {SORT_LABELS[sort]}
        <span aria-hidden="true" className="text-[10px]">
          {arrow}
        </span>
      </Link>
    </th>
  );
}

/** The row's pick as side A or B of the comparison form. */
function CompareCell({ side, row, picked }: { side: "A" | "B"; row: VersionTableRow; picked: boolean }) {
  return (
    <td className="px-2 py-2 text-center">
      <input
        type="radio"
        name={side.toLowerCase()}
        value={row.id}
        form={COMPARE_FORM}
        defaultChecked={picked}
        aria-label={`Compare version ${row.number} as ${side}`}
      />
    </td>
  );
}

export function VersionTable({ gaitId, rows, allVersions, query, canRestore, draftRevision, restoring }: VersionTableProps) {
  const byNumber = [...allVersions].sort((x, y) => y.number - x.number);
  const defaultB = byNumber[0]?.id;
  const defaultA = byNumber[1]?.id;
  if (rows.length === 0) {
    return (
      <p className="rounded-lg border border-dashed border-line bg-surface px-4 py-6 text-center text-ink-muted">
        {allVersions.length === 0 ? "No versions yet: commit the working draft to make version 1." : "No version matches these filters."}
      </p>
    );
  }
  return (
    <>
      <Form id={COMPARE_FORM} method="get" action="/gaits/compare" className="flex items-center justify-end gap-2 text-sm">
        <span className="text-ink-muted">Pick A and B in the table, then</span>
        <button type="submit" className="rounded-md border border-line bg-surface px-3 py-1 font-medium hover:bg-sunken">
          Compare A with B
        </button>
      </Form>
      <div className="overflow-x-auto rounded-lg border border-line bg-surface">
        <table className="w-full border-collapse text-left text-sm" aria-label="Versions of this gait">
          <thead className="border-b border-line text-xs text-ink-muted">
            <tr>
              <SortHeader query={query} sort="number" align="right" />
              <th scope="col" className="px-3 py-2 font-medium">
                Message
              </th>
              <SortHeader query={query} sort="author" />
              <SortHeader query={query} sort="date" align="right" />
              <SortHeader query={query} sort="state" />
              <SortHeader query={query} sort="flags" />
              <SortHeader query={query} sort="margin" align="right" />
              <th scope="col" className="px-2 py-2 text-center font-medium">
                A
              </th>
              <th scope="col" className="px-2 py-2 text-center font-medium">
                B
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-0" data-version={row.number}>
                <td className="px-3 py-2 text-right font-mono tabular-nums">
                  <Link
                    to={`/gaits/${gaitId}/versions/${row.number}`}
                    className="text-accent underline underline-offset-2"
                    aria-label={`Open version ${row.number}`}
                  >
                    v{row.number}
                  </Link>
                </td>
                <td className="max-w-80 px-3 py-2">{row.message}</td>
                <td className="px-3 py-2 whitespace-nowrap">{row.author?.name ?? <span className="text-ink-muted">unknown</span>}</td>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                  <time dateTime={new Date(row.createdAt).toISOString()}>{formatTime(row.createdAt)}</time>
                </td>
                <td className="px-3 py-2">
                  <StateBadge state={row.state} />
                </td>
                <td className="px-3 py-2">
                  <FlagCounts errors={row.errors} warnings={row.warnings} />
                </td>
                <td className="px-3 py-2 text-right font-mono whitespace-nowrap tabular-nums">{formatNumber(row.worstMarginMm, 1, "mm")}</td>
                <CompareCell side="A" row={row} picked={row.id === defaultA} />
                <CompareCell side="B" row={row} picked={row.id === defaultB} />
                <td className="px-3 py-2 whitespace-nowrap">
                  {canRestore ? (
                    <Form method="post" preventScrollReset>
                      <input type="hidden" name="intent" value="restore" />
                      <input type="hidden" name="versionId" value={row.id} />
                      <input type="hidden" name="draftRevision" value={draftRevision} />
                      <button
                        type="submit"
                        disabled={restoring === row.id}
                        className="text-accent underline underline-offset-2 disabled:opacity-60"
                        aria-label={`Start a new draft from version ${row.number}`}
                        title="Copies this version's sequence and robot revision into the working draft"
                      >
                        {restoring === row.id ? "Starting…" : "New draft from here"}
                      </button>
                    </Form>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
