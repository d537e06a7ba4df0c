// The editor's top line: which gait and robot revision, where saving stands,
// undo and redo, the shortcut list, moving to the robot's newest revision and
// committing a version (for the roles that may).
import { useRef } from "react";
import { Form, Link, useFetcher, useNavigation } from "react-router";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import type { SaveStatus } from "~/stores/editor-store";

export type EditorHeaderProps = {
  gait: { id: string; name: string; robotId: string; robotName: string };
  robotRevision: number;
  newestRobotRevision: number;
  canCommit: boolean;
  onHelp: () => void;
};

const button = "rounded-md border border-line px-2.5 py-1 text-sm hover:bg-sunken disabled:cursor-not-allowed disabled:opacity-50";

const STATUS_WORDS: Record<SaveStatus, string> = {
  saved: "Saved",
  pending: "Unsaved changes…",
  saving: "Saving…",
  offline: "Not saved yet",
  conflict: "Not saved: someone else saved first",
  invalid: "Not saved",
  "read-only": "Read only",
};

function SaveIndicator() {
  const status = useEditor((state) => state.saveStatus);
  const revision = useEditor((state) => state.revision);
  const message = useEditor((state) => state.saveMessage);
  const tone = status === "saved" || status === "read-only" ? "text-ink-muted" : status === "pending" || status === "saving" ? "text-ink" : "text-danger";
  return (
    <p role="status" className={`text-sm ${tone}`} data-testid="save-status" data-status={status} title={message ?? undefined}>
      {status === "saved" ? (
        <span aria-hidden>✓ </span>
      ) : status === "offline" || status === "conflict" || status === "invalid" ? (
        <span aria-hidden>▲ </span>
      ) : null}
      {STATUS_WORDS[status]}
      {status === "saved" || status === "read-only" ? ` · draft revision ${revision}` : ""}
      {message && status !== "conflict" ? <span className="block max-w-md text-xs">{message}</span> : null}
    </p>
  );
}

function UndoRedo() {
  const store = useEditorStore();
  const canUndo = useEditor((state) => state.past.length > 0 && !state.readOnly);
  const canRedo = useEditor((state) => state.future.length > 0 && !state.readOnly);
  return (
    <div className="flex gap-1">
      <button type="button" className={button} disabled={!canUndo} onClick={() => store.getState().undo()} aria-keyshortcuts="Control+Z">
        Undo
      </button>
      <button type="button" className={button} disabled={!canRedo} onClick={() => store.getState().redo()} aria-keyshortcuts="Control+Shift+Z">
        Redo
      </button>
    </div>
  );
}

function MoveToNewestRobot({ from, to }: { from: number; to: number }) {
  const fetcher = useFetcher<{ error?: string }>();
  const store = useEditorStore();
  const saved = useEditor((state) => state.saveStatus === "saved");
  const readOnly = useEditor((state) => state.readOnly);
  if (to <= from) return null;
  return (
    <div className="flex items-center gap-2 text-sm">
      <span className="text-warning">
        <span aria-hidden>◆ </span>Robot revision {to} is newer.
      </span>
      {readOnly ? null : (
        <button
          type="button"
          className={button}
          disabled={!saved || fetcher.state !== "idle"}
          title={saved ? undefined : "Wait until the draft is saved"}
          onClick={() => fetcher.submit({ intent: "move-to-newest-robot", baseRevision: String(store.getState().revision) }, { method: "post" })}
        >
          Move the draft to revision {to}
        </button>
      )}
      {fetcher.data?.error ? <span className="text-danger">{fetcher.data.error}</span> : null}
    </div>
  );
}

function CommitVersion({ gaitId }: { gaitId: string }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const saved = useEditor((state) => state.saveStatus === "saved");
  const navigation = useNavigation();
  return (
    <>
      <button
        type="button"
        className="rounded-md bg-accent px-3 py-1 text-sm font-medium text-on-accent hover:bg-accent-strong disabled:cursor-not-allowed disabled:opacity-60"
        disabled={!saved}
        title={saved ? undefined : "Wait until the draft is saved"}
        onClick={() => dialog.current?.showModal()}
      >
        Commit version
      </button>
      <dialog
        ref={dialog}
        aria-labelledby="commit-title"
        className="m-auto w-[28rem] max-w-[95vw] rounded-lg border border-line bg-surface p-5 text-ink shadow-xl backdrop:bg-ink/40"
      >
        <Form method="post" action={`/gaits/${gaitId}`} onSubmit={() => dialog.current?.close()}>
          <h2 id="commit-title" className="text-lg font-semibold">
            Commit the draft as a version
          </h2>
          <input type="hidden" name="intent" value="commit" />
          <label htmlFor="commit-message" className="mt-3 block text-sm font-medium">
            What changed
          </label>
          <textarea
            id="commit-message"
            name="message"
            required
            minLength={1}
            maxLength={500}
            rows={3}
            className="mt-1 w-full rounded-md border border-line bg-surface px-2 py-1"
          />
          <div className="mt-4 flex justify-end gap-2">
            <button type="button" className={button} onClick={() => dialog.current?.close()}>
              Cancel
            </button>
            <button
              type="submit"
              disabled={navigation.state !== "idle"}
              className="rounded-md bg-accent px-3 py-1.5 font-medium text-on-accent hover:bg-accent-strong"
            >
              Commit version
            </button>
          </div>
        </Form>
      </dialog>
    </>
  );
}

export function EditorHeader({ gait, robotRevision, newestRobotRevision, canCommit, onHelp }: EditorHeaderProps) {
  return (
    <header className="flex flex-wrap items-center gap-x-4 gap-y-2">
      <div className="mr-auto">
        <h1 className="text-xl font-semibold tracking-tight">{gait.name}</h1>
        <p className="text-sm text-ink-muted">
          Draft on{" "}
          <Link to={`/robots/${gait.robotId}`} className="underline underline-offset-2 hover:text-ink">
            {gait.robotName}
          </Link>
          , robot revision {robotRevision}
        </p>
      </div>
      <MoveToNewestRobot from={robotRevision} to={newestRobotRevision} />
      <SaveIndicator />
      <UndoRedo />
      <button type="button" className={button} onClick={onHelp} aria-keyshortcuts="?">
        Keyboard shortcuts
      </button>
      {canCommit ? <CommitVersion gaitId={gait.id} /> : null}
    </header>
  );
}
