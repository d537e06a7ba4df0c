// Archive, restore and delete one robot or gait: on its page (in the header)
// and in the archived list (in its row). Posts to /robots/:id/archive or
// /gaits/:id/archive; a delete asks once more, then goes to the archived list.
import { useState } from "react";
import { Link, useFetcher } from "react-router";
import { formatDate } from "~/platform/format";

type Answer = { ok: true; notice: string } | { error: string; code: string; details?: { references?: { kind: string; id: string; name?: string }[] } };

export type ArchiveControlsProps = {
  kind: "robot" | "gait";
  id: string;
  name: string;
  archivedAt: Date | string | null;
  /** What the role may do: archive and restore, delete. */
  can: { archive: boolean; delete: boolean };
  /** "page": beside the page's title, with the archived date; "row": in a list row. */
  variant?: "page" | "row";
};

const button = "rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken disabled:opacity-60";
const danger = "rounded-md border border-danger bg-surface px-3 py-1.5 text-sm font-medium text-danger hover:bg-danger-soft disabled:opacity-60";

export function ArchiveControls({ kind, id, name, archivedAt, can, variant = "page" }: ArchiveControlsProps) {
  const fetcher = useFetcher<Answer>();
  const [confirming, setConfirming] = useState(false);
  const answer = fetcher.state === "idle" ? fetcher.data : undefined;
  const busy = fetcher.state !== "idle";
  const action = `/${kind}s/${id}/archive`;
  const post = (intent: "archive" | "restore" | "delete") => fetcher.submit({ intent }, { method: "post", action });
  if (!can.archive && !can.delete && archivedAt === null) return null;
  const references = answer && "error" in answer ? (answer.details?.references ?? []) : [];
  return (
    <div className={variant === "page" ? "relative flex items-center" : "flex flex-col items-start gap-2"}>
      <div className="flex flex-wrap items-center gap-2">
        {archivedAt !== null && variant === "page" ? (
          <span className="rounded-full bg-sunken px-2.5 py-1 text-xs font-medium text-ink-muted">Archived {formatDate(archivedAt)}</span>
        ) : null}
        {archivedAt === null && can.archive ? (
          <button type="button" className={button} disabled={busy} onClick={() => post("archive")} aria-label={`Archive ${name}`}>
            Archive
          </button>
        ) : null}
        {archivedAt !== null && can.archive ? (
          <button type="button" className={button} disabled={busy} onClick={() => post("restore")} aria-label={`Restore ${name}`}>
            Restore
          </button>
        ) : null}
        {archivedAt !== null && can.delete && !confirming ? (
          <button type="button" className={danger} disabled={busy} onClick={() => setConfirming(true)} aria-label={`Delete ${name}…`}>
            Delete…
          </button>
        ) : null}
      </div>
      {/* On a page, what follows opens below the buttons, over the page, so the header keeps its height. */}
      <div className={variant === "page" ? "absolute top-full right-0 z-10 mt-2 flex w-max max-w-md flex-col items-end gap-2" : "contents"}>
        {confirming ? (
          <div
            role="group"
            aria-label={`Delete ${name} for good?`}
            className="flex max-w-md flex-wrap items-center gap-2 rounded-md border border-danger bg-danger-soft px-3 py-2 text-sm"
          >
            <span className="text-danger">Delete {name} for good? This cannot be undone.</span>
            <button
              type="button"
              className="rounded-md bg-danger px-3 py-1 font-medium text-on-accent disabled:opacity-60"
              disabled={busy}
              onClick={() => {
                setConfirming(false);
                post("delete");
              }}
            >
              Delete for good
            </button>
            <button type="button" className={button} onClick={() => setConfirming(false)}>
              Keep it
            </button>
          </div>
        ) : null}
        {answer && "error" in answer ? (
          <div role="alert" className="max-w-md rounded-md bg-danger-soft px-3 py-2 text-sm text-danger shadow-sm">
            <p>{answer.error}</p>
            {references.some((reference) => reference.kind === "gait") ? (
              <ul className="mt-1 list-disc pl-5">
                {references
                  .filter((reference) => reference.kind === "gait")
                  .map((reference) => (
                    <li key={reference.id}>
                      <Link to={`/gaits/${reference.id}`} className="underline underline-offset-2">
                        {reference.name}
                      </Link>
                    </li>
                  ))}
              </ul>
            ) : null}
          </div>
        ) : null}
        {answer && "ok" in answer ? (
          <p role="status" className="max-w-md rounded-md bg-ok-soft px-3 py-2 text-sm text-ok shadow-sm">
            {answer.notice}
          </p>
        ) : null}
      </div>
    </div>
  );
}

/** The two views of a list: what is in use, and what is archived. */
export function ArchiveFilter({ archived, label, hrefs }: { archived: boolean; label: string; hrefs: { inUse: string; archived: string } }) {
  const tab = (current: boolean) =>
    `-mb-px border-b-2 px-3 py-1.5 text-sm font-medium ${current ? "border-accent text-accent-strong" : "border-transparent text-ink-muted hover:text-ink"}`;
  return (
    <nav aria-label={label} className="mb-4 flex gap-1 border-b border-line">
      <Link to={hrefs.inUse} aria-current={archived ? undefined : "page"} className={tab(!archived)}>
        In use
      </Link>
      <Link to={hrefs.archived} aria-current={archived ? "page" : undefined} className={tab(archived)}>
        Archived
      </Link>
    </nav>
  );
}
