// Filters of the version table, as a GET form: the result has its own URL.
import { useId } from "react";
import { Form, Link } from "react-router";
import { FLAG_FILTER_LABELS, FLAG_FILTERS, isFiltered, type VersionQueryValues } from "./version-query";
import { STATE_LABELS, VERSION_STATES } from "~/features/versions/state-labels";

const field = "rounded-md border border-line bg-canvas px-2 py-1 text-sm";

export function VersionFilters({ query, authors }: { query: VersionQueryValues; authors: readonly { login: string; name: string }[] }) {
  const id = useId();
  return (
    <Form key={JSON.stringify(query)} method="get" className="flex flex-wrap items-end gap-2" aria-label="Filter versions">
      <input type="hidden" name="sort" value={query.sort} />
      <input type="hidden" name="dir" value={query.dir} />
      <div className="flex flex-col gap-0.5 text-xs text-ink-muted">
        <label htmlFor={`${id}-state`}>Status</label>
        <select id={`${id}-state`} name="state" defaultValue={query.state ?? ""} className={field}>
          <option value="">Any</option>
          {VERSION_STATES.map((state) => (
            <option key={state} value={state}>
              {STATE_LABELS[state]}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-0.5 text-xs text-ink-muted">
        <label htmlFor={`${id}-author`}>Author</label>
        <select id={`${id}-author`} name="author" defaultValue={query.author ?? ""} className={field}>
          <option value="">Anyone</option>
          {authors.map((author) => (
            <option key={author.login} value={author.login}>
              {author.name}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-0.5 text-xs text-ink-muted">
        <label htmlFor={`${id}-flags`}>Flags</label>
        <select id={`${id}-flags`} name="flags" defaultValue={query.flags ?? ""} className={field}>
          <option value="">Any</option>
          {FLAG_FILTERS.map((filter) => (
            <option key={filter} value={filter}>
              {FLAG_FILTER_LABELS[filter]}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-0.5 text-xs text-ink-muted">
        <label htmlFor={`${id}-q`}>Message contains</label>
        <input id={`${id}-q`} type="search" name="q" defaultValue={query.q ?? ""} maxLength={200} className={field} />
      </div>
      <button type="submit" className="rounded-md border border-line bg-surface px-3 py-1 text-sm font-medium hover:bg-sunken">
        Filter
      </button>
      {isFiltered(query) ? (
        <Link to={`?sort=${query.sort}&dir=${query.dir}`} className="py-1 text-sm text-accent underline underline-offset-2">
          Clear filters
        </Link>
      ) : null}
    </Form>
  );
}
