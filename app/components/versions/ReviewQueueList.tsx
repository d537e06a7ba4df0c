// One list of the Reviews page: versions with their gait, state, checks, the
// newest review step, and links to the version and to a comparison.
import { Link } from "react-router";
import type { VersionState } from "../../../db/schema";
import { FlagCounts } from "./FlagCounts";
import { StateBadge } from "./StateBadge";
import { formatNumber, formatTime } from "~/platform/format";

export type QueueListItem = {
  versionId: string;
  number: number;
  message: string;
  state: VersionState;
  stateChangedAt: Date | string;
  gait: { id: string; name: string };
  robotName: string;
  author: { name: string } | null;
  reviewer: { name: string } | null;
  errors: number;
  warnings: number;
  worstMarginMm: number | null;
  lastStep: { toState: VersionState; comment: string; overrideReason: string | null; actor: { name: string } | null; createdAt: Date | string } | null;
  previousVersionId: string | null;
};

export function ReviewQueueList({
  id,
  title,
  empty,
  items,
  show,
}: {
  id: string;
  title: string;
  empty: string;
  items: readonly QueueListItem[];
  show: "author" | "decision";
}) {
  return (
    <section aria-labelledby={`${id}-heading`} className="space-y-2">
      <h2 id={`${id}-heading`} className="text-lg font-semibold">
        {title} <span className="text-sm font-normal text-ink-muted tabular-nums">({items.length})</span>
      </h2>
      {items.length === 0 ? (
        <p className="text-sm text-ink-muted">{empty}</p>
      ) : (
        <ul className="space-y-2">
          {items.map((item) => (
            <li key={item.versionId} className="rounded-lg border border-line bg-surface px-4 py-3 text-sm" aria-label={`${item.gait.name} v${item.number}`}>
              <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                <Link to={`/gaits/${item.gait.id}/versions/${item.number}`} className="font-medium text-accent underline underline-offset-2">
                  {item.gait.name} v{item.number}
                </Link>
                <span className="text-ink-muted">{item.robotName}</span>
                <StateBadge state={item.state} />
                <FlagCounts errors={item.errors} warnings={item.warnings} />
                <span className="font-mono text-xs text-ink-muted tabular-nums">margin {formatNumber(item.worstMarginMm, 1, "mm")}</span>
                <time className="ml-auto text-xs text-ink-muted tabular-nums" dateTime={new Date(item.stateChangedAt).toISOString()}>
                  {formatTime(item.stateChangedAt)}
                </time>
              </div>
              <p className="mt-1">“{item.message}”</p>
              <p className="mt-1 text-ink-muted">
                {show === "author"
                  ? `By ${item.author?.name ?? "unknown"}${item.lastStep?.toState === "in-review" && item.lastStep.comment ? ` — “${item.lastStep.comment}”` : ""}`
                  : item.state === "in-review"
                    ? `Waiting for ${item.reviewer?.name ?? "a reviewer"}`
                    : item.lastStep
                      ? `${item.lastStep.actor?.name ?? "Someone"}: ${item.lastStep.comment ? `“${item.lastStep.comment}”` : "no comment"}`
                      : ""}
              </p>
              {item.lastStep?.overrideReason ? <p className="mt-1 text-warning">Override: {item.lastStep.overrideReason}</p> : null}
              {item.previousVersionId ? (
                <Link
                  to={`/gaits/compare?a=${item.previousVersionId}&b=${item.versionId}`}
                  className="mt-1 inline-block text-accent underline underline-offset-2"
                >
                  Compare with the version before
                </Link>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
