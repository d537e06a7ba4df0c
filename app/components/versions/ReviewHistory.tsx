// Every review step of a version, oldest first: who moved it where, what they
// wrote, and any override with its reason.
import type { VersionState } from "../../../db/schema";
import { stateWord } from "~/features/versions/state-labels";
import { formatTime } from "~/platform/format";
import { StateBadge } from "./StateBadge";

export type ReviewHistoryEvent = {
  id: number;
  fromState: VersionState | null;
  toState: VersionState;
  comment: string;
  overrideReason: string | null;
  actor: { name: string } | null;
  createdAt: Date | string;
};

const VERBS: Record<VersionState, string> = {
  committed: "committed it",
  "in-review": "asked for a review",
  "sent-back": "sent it back",
  approved: "approved it",
  released: "released it",
  retired: "retired it",
};

export function ReviewHistory({ events }: { events: readonly ReviewHistoryEvent[] }) {
  if (events.length === 0) return <p className="text-sm text-ink-muted">No review steps yet.</p>;
  return (
    <ol className="space-y-3" aria-label="Review steps, oldest first">
      {events.map((event) => (
        <li key={event.id} className="rounded-lg border border-line bg-surface px-4 py-3 text-sm">
          <div className="flex flex-wrap items-center gap-2">
            <StateBadge state={event.toState} />
            <span>
              <span className="font-medium">{event.actor?.name ?? "Someone"}</span> {VERBS[event.toState]}
              {event.fromState && event.fromState !== "committed" && event.toState === "in-review" ? ` again (was ${stateWord(event.fromState)})` : ""}
            </span>
            <time className="ml-auto text-xs text-ink-muted tabular-nums" dateTime={new Date(event.createdAt).toISOString()}>
              {formatTime(event.createdAt)}
            </time>
          </div>
          {event.comment ? <p className="mt-2 whitespace-pre-wrap">{event.comment}</p> : null}
          {event.overrideReason ? (
            <p className="mt-2 rounded bg-warning-soft px-2 py-1 text-warning">
              <span aria-hidden="true">⚑ </span>Override: {event.overrideReason}
            </p>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
