// What the editor says about the draft's safety: a stale save (someone else
// saved first) with the two ways out that lose nothing, and unsaved changes
// found in this browser from an earlier visit.
import { useEffect, useRef, useState } from "react";
import { useFetcher, useRevalidator } from "react-router";
import type { Sequence } from "~/gait";
import { clearLocalDraft, markLocalDraftSynced, pendingLocalDraft, writeLocalDraft, type LocalDraft } from "~/features/gaits/editor/local-draft";
import { formatLocalTime } from "~/platform/format";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import { draftUrl } from "./use-autosave";

const action = "rounded-md border border-line bg-surface px-3 py-1 text-sm font-medium hover:bg-sunken disabled:opacity-60";

export function ConflictBanner({ gaitId, gaitName, robotRevision }: { gaitId: string; gaitName: string; robotRevision: number }) {
  const store = useEditorStore();
  const revalidator = useRevalidator();
  const conflict = useEditor((state) => state.conflict);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [copyName, setCopyName] = useState(`${gaitName} (my copy)`);
  const copy = useFetcher<{ error?: string }>();
  useEffect(() => {
    // The copy was refused: keep the edits in this browser again.
    if (copy.state === "idle" && copy.data?.error) {
      const state = store.getState();
      writeLocalDraft(gaitId, { sequence: state.sequence, baseRevision: state.revision, savedAt: Date.now(), synced: false });
    }
  }, [copy.state, copy.data, gaitId, store]);
  if (!conflict) return null;

  const reloadTheirs = async () => {
    setBusy(true);
    setProblem(null);
    try {
      const response = await fetch(draftUrl(gaitId), { headers: { Accept: "application/json" } });
      const body = (await response.json()) as { sequence: Sequence; revision: number; updatedBy: { name: string } | null; robot: { revision: number } };
      if (!response.ok) throw new Error("the server did not send the draft");
      // Their draft is on another robot revision: the editor starts again on it; mine stays in this browser to restore.
      if (body.robot.revision !== robotRevision) {
        await revalidator.revalidate();
        return;
      }
      const state = store.getState();
      state.replaceSequence(
        body.sequence,
        `Loaded revision ${body.revision}${body.updatedBy ? ` by ${body.updatedBy.name}` : ""}. Undo brings your version back.`,
      );
      const after = store.getState();
      after.markSaved(after.sequenceVersion, body.revision);
      after.adoptRevision(body.revision);
      markLocalDraftSynced(gaitId, body.revision);
    } catch (error) {
      setProblem(`Could not load their draft: ${error instanceof Error ? error.message : String(error)}.`);
    } finally {
      setBusy(false);
    }
  };

  const keepMine = () => {
    const state = store.getState();
    clearLocalDraft(gaitId);
    copy.submit({ intent: "copy", sourceGaitId: gaitId, name: copyName, sequence: JSON.stringify(state.sequence) }, { method: "post", action: "/gaits/new" });
  };

  return (
    <section role="alert" aria-labelledby="conflict-title" className="rounded-lg border border-warning bg-warning-soft p-3 text-ink">
      <h2 id="conflict-title" className="font-semibold text-warning">
        <span aria-hidden>◆ </span>Someone else saved this draft
      </h2>
      <p className="mt-1 text-sm">{conflict.message} Your changes are still here and in this browser; choose what to do with them.</p>
      <div className="mt-2 flex flex-wrap items-end gap-2">
        <button type="button" className={action} disabled={busy} onClick={reloadTheirs}>
          Reload theirs (revision {conflict.currentRevision})
        </button>
        <span className="text-sm text-ink-muted">or</span>
        <label className="flex flex-col text-xs">
          Name of the copy
          <input
            value={copyName}
            onChange={(event) => setCopyName(event.currentTarget.value)}
            className="rounded border border-line bg-surface px-2 py-1 text-sm"
          />
        </label>
        <button type="button" className={action} disabled={copy.state !== "idle" || copyName.trim() === ""} onClick={keepMine}>
          Keep mine as a copy
        </button>
      </div>
      {problem || copy.data?.error ? <p className="mt-2 text-sm text-danger">{problem ?? copy.data?.error}</p> : null}
    </section>
  );
}

export function RestoreOffer({ gaitId, serverSequence, serverUpdatedAt }: { gaitId: string; serverSequence: Sequence; serverUpdatedAt: string }) {
  const store = useEditorStore();
  const readOnly = useEditor((state) => state.readOnly);
  const [local, setLocal] = useState<LocalDraft | null>(null);
  // localStorage exists only in the browser: looked at once, after the first render, against the draft
  // this editor opened with (later loader data would make this session's own unsaved edits look like leftovers).
  const opened = useRef({ gaitId, serverSequence, readOnly });
  useEffect(() => {
    const { gaitId: id, serverSequence: sequence, readOnly: viewing } = opened.current;
    setLocal(viewing ? null : pendingLocalDraft(id, sequence));
  }, []);
  if (!local) return null;
  const newer = local.savedAt > Date.parse(serverUpdatedAt);
  return (
    <section role="alert" aria-labelledby="restore-title" className="rounded-lg border border-accent bg-accent-soft p-3">
      <h2 id="restore-title" className="font-semibold text-accent-strong">
        Unsaved changes found in this browser
      </h2>
      <p className="mt-1 text-sm">
        This browser kept edits from {formatLocalTime(local.savedAt)} (on draft revision {local.baseRevision}) that never reached the server.{" "}
        {newer
          ? "They are newer than the saved draft."
          : `The saved draft changed after them (${formatLocalTime(serverUpdatedAt)}); restoring replaces it, and Undo brings it back.`}
      </p>
      <div className="mt-2 flex gap-2">
        <button
          type="button"
          className={action}
          onClick={() => {
            store.getState().replaceSequence(local.sequence, "Restored the changes kept in this browser.");
            setLocal(null);
          }}
        >
          Restore them
        </button>
        <button
          type="button"
          className={action}
          onClick={() => {
            clearLocalDraft(gaitId);
            setLocal(null);
          }}
        >
          Discard them
        </button>
      </div>
    </section>
  );
}
