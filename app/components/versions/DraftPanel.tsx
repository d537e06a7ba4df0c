// The gait's working draft: what it pins, who saved it last, and the form that
// commits it as the next version.
import { useEffect, useRef } from "react";
import { Form } from "react-router";
import { formatTime } from "~/platform/format";
import { Section } from "~/components/common/Section";

export type DraftPanelProps = {
  gait: {
    id: string;
    robot: { name: string; latestRevision: number };
    draft: {
      revision: number;
      updatedAt: Date | string;
      updatedBy: { name: string } | null;
      hasSequence: boolean;
      robotRevision: number | null;
      sameAsVersion: number | null;
    };
  };
  /** The draft revision a commit names: the newest the page knows of. */
  draftRevision: number;
  canCommit: boolean;
  committing: boolean;
  messageError: string | null;
  /** Changes after each successful commit, which empties the message box. */
  resetKey?: string;
};

export function DraftPanel({ gait, draftRevision, canCommit, committing, messageError, resetKey }: DraftPanelProps) {
  const { draft } = gait;
  const formRef = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (resetKey) formRef.current?.reset();
  }, [resetKey]);
  return (
    <Section title="Working draft" className="rounded-lg border border-line bg-surface p-4">
      {" "}
      {draft.hasSequence ? (
        <p className="mt-1 text-sm text-ink-muted">
          Draft revision <span className="font-mono tabular-nums">{draftRevision}</span>, saved {formatTime(draft.updatedAt)}
          {draft.updatedBy ? ` by ${draft.updatedBy.name}` : ""}; pins {gait.robot.name} revision{" "}
          <span className="font-mono tabular-nums">{draft.robotRevision ?? "?"}</span>
          {draft.robotRevision !== null && draft.robotRevision < gait.robot.latestRevision
            ? ` (the robot is at revision ${gait.robot.latestRevision}; moving the draft to it is done in the editor)`
            : ""}
          .
        </p>
      ) : (
        <p className="mt-1 text-sm text-ink-muted">This gait has no working draft yet. Start one from a version below, or in the editor.</p>
      )}
      {draft.hasSequence && draft.sameAsVersion !== null ? (
        <p className="mt-2 text-sm">
          <span aria-hidden="true">= </span>The draft holds exactly what version {draft.sameAsVersion} holds; a commit now would repeat it under a new number.
        </p>
      ) : null}
      {canCommit && draft.hasSequence ? (
        <Form method="post" ref={formRef} className="mt-3 flex flex-wrap items-end gap-3">
          <input type="hidden" name="intent" value="commit" />
          <input type="hidden" name="draftRevision" value={draftRevision} />
          <label className="flex min-w-72 flex-1 flex-col gap-1 text-sm">
            <span className="font-medium">Version message</span>
            <input
              name="message"
              required
              maxLength={500}
              placeholder="What changed, and why"
              aria-invalid={messageError ? true : undefined}
              aria-describedby={messageError ? "commit-message-error" : undefined}
              className="rounded-md border border-line bg-canvas px-3 py-1.5"
            />
          </label>
          <button
            type="submit"
            disabled={committing}
            className="rounded-md bg-accent px-4 py-1.5 font-medium text-on-accent hover:bg-accent-strong disabled:opacity-60"
          >
            {committing ? "Committing…" : "Commit version"}
          </button>
          {messageError ? (
            <p id="commit-message-error" role="alert" className="w-full text-sm text-danger">
              <span aria-hidden="true">✕ </span>
              {messageError}
            </p>
          ) : null}
        </Form>
      ) : null}
    </Section>
  );
}
