// Checks: the flags of the sequence as runs of frames, each a button that
// moves the playhead there. Two sources, labelled: the server's reference
// solve (POST /api/v1/solve, after edits pause) and this browser's preview
// (solved at once on every edit). The timeline always draws the preview.
import { useId, useMemo, useState } from "react";
import { Panel } from "~/components/common/Panel";
import type { Flag } from "~/gait";
import { checkSummary, flagRuns, framesText, runPlace, type FlagRun } from "~/features/gaits/editor/flag-runs";
import { FLAG_LABELS } from "~/features/gaits/flag-labels";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import { SEVERITY_GLYPH } from "~/features/gaits/editor/flag-badges";
import type { useServerReference } from "./use-server-reference";

const LIST_LIMIT = 150;
const EMPTY: Flag[] = [];

type Source = "server" | "preview";

const sameFlags = (a: readonly Flag[], b: readonly Flag[]) =>
  a.length === b.length &&
  a.every((flag, index) => flag.frame === b[index].frame && flag.kind === b[index].kind && flag.leg === b[index].leg && flag.joint === b[index].joint);

export function ChecksList({ reference }: { reference: ReturnType<typeof useServerReference> }) {
  const preview = useEditor((state) => state.preview);
  const previewError = useEditor((state) => state.previewError);
  const [source, setSource] = useState<Source>("server");
  const [showAll, setShowAll] = useState(false);
  const id = useId();
  const previewFlags = preview?.flags ?? EMPTY;
  const serverFlags = reference.data?.flags;
  const shown = source === "server" && serverFlags ? serverFlags : previewFlags;
  const runs = useMemo(() => flagRuns(shown), [shown]);
  const visible = showAll ? runs : runs.slice(0, LIST_LIMIT);
  const summary = useMemo(() => checkSummary(shown), [shown]);

  let status: string;
  if (reference.isError) status = `The server check failed (${reference.error.message}); showing what it last said.`;
  else if (!serverFlags) status = "Asking the server for its reference check…";
  else if (!reference.current || reference.isFetching) status = "Server reference is for an earlier edit; checking again…";
  else if (sameFlags(serverFlags, previewFlags)) status = "Server reference agrees with the browser preview.";
  else status = `Server reference differs from the browser preview (server ${serverFlags.length} flags, preview ${previewFlags.length}).`;

  return (
    <Panel
      title="Checks"
      layout="flex flex-wrap items-center justify-between gap-2"
      testId="checks"
      tools={
        <div role="radiogroup" aria-label="Whose checks to list" className="flex rounded-md border border-line text-sm">
          {(["server", "preview"] as const).map((value) => (
            <label key={value} className={`cursor-pointer px-2 py-0.5 ${source === value ? "bg-accent-soft text-accent-strong" : ""}`}>
              <input type="radio" name={`${id}-source`} value={value} checked={source === value} onChange={() => setSource(value)} className="sr-only" />
              {value === "server" ? "Server reference" : "Browser preview"}
            </label>
          ))}
        </div>
      }
    >
      <div className="px-3 py-2">
        <p className="text-xs text-ink-muted" role="status" data-testid="checks-status">
          {source === "server" ? status : "Browser preview: solved here at once on every edit, with the same engine as the server."}
        </p>
        {previewError ? (
          <p role="alert" className="mt-2 rounded bg-danger-soft px-2 py-1 text-sm text-danger">
            The preview cannot solve this sequence: {previewError}
          </p>
        ) : null}
        <p className="numeric mt-1 text-sm" data-testid="checks-count">
          {source === "server" && serverFlags ? "Server: " : "Preview: "}
          {runs.length === 0 ? "no flags — every frame passes every check." : `${summary.text} in ${runs.length} ${runs.length === 1 ? "run" : "runs"}.`}
        </p>
        {runs.length > 0 ? (
          <ul
            className="mt-2 max-h-72 divide-y divide-line overflow-y-auto rounded border border-line"
            aria-label={`Flags (${source === "server" && serverFlags ? "server reference" : "browser preview"})`}
          >
            {visible.map((run) => (
              <RunItem key={run.id} run={run} />
            ))}
          </ul>
        ) : null}
        {runs.length > visible.length ? (
          <button type="button" onClick={() => setShowAll(true)} className="mt-2 text-sm text-accent underline underline-offset-4">
            Show all {runs.length} runs
          </button>
        ) : null}
      </div>
    </Panel>
  );
}

function RunItem({ run }: { run: FlagRun }) {
  const store = useEditorStore();
  const error = run.severity === "error";
  return (
    <li>
      <button
        type="button"
        data-flag-kind={run.kind}
        data-leg={run.leg ?? "body"}
        data-from={run.fromFrame}
        data-to={run.toFrame}
        onClick={() => {
          store.getState().setPlaying(false);
          store.getState().setFrame(run.fromFrame);
          if (run.leg) store.getState().focusLeg(run.leg);
        }}
        className="flex w-full items-start gap-2 px-2 py-1.5 text-left text-sm hover:bg-sunken"
      >
        <span aria-hidden className={`mt-0.5 ${error ? "text-danger" : "text-warning"}`}>
          {SEVERITY_GLYPH[run.severity]}
        </span>
        <span className="min-w-0 flex-1">
          <span className="font-medium">
            <span className={error ? "text-danger" : "text-warning"}>{error ? "Error" : "Warning"}</span> · {FLAG_LABELS[run.kind]} ·{" "}
            <span className="font-mono">{runPlace(run)}</span> · <span className="numeric">{framesText(run)}</span>
          </span>
          <span className="block truncate text-xs text-ink-muted">{run.message}</span>
        </span>
      </button>
    </li>
  );
}
