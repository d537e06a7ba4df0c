// The robot form: body, legs, joints and servos, rest pose, with live top and
// side views. The working copy is checked with parseRobot on every change and
// each problem is shown next to its field. Save sends the whole definition with
// the revision it started from; the server makes it the next revision or says why not.
// Leaving with unsaved changes asks first (LeaveGuard).
import { useCallback, useMemo, useRef, useState } from "react";
import { Link, type FetcherWithComponents } from "react-router";
import { IssueList } from "~/components/common/IssueList";
import { Section } from "~/components/common/Section";
import { RobotViews } from "~/components/robot-view";
import type { Robot } from "~/kinematics";
import { changedFields } from "~/features/robots/changes";
import { checkDraft, removeLegAt, renameLeg, valueFromNumberText, type RobotDocument } from "~/features/robots/form-draft";
import { defaultRest } from "~/features/robots/leg-tools";
import { formFieldIdFor, pathText, setAt, type FieldPath } from "~/features/robots/paths";
import type { SaveResult } from "~/features/robots/results";
import { BodySection } from "./BodySection";
import { EditorActionsProvider, EditorDataProvider, type EditorActions, type EditorData, type EditorMode } from "./robot-form-context";
import { IssueSummary } from "./IssueSummary";
import { JointTable } from "./JointTable";
import { LeaveGuard } from "./LeaveGuard";
import { LegTable } from "./LegTable";
import { LegTools } from "./LegTools";
import { RestPoseSection } from "./RestPoseSection";

export type RobotEditorProps = {
  robotId: string;
  /** The definition the form starts from. */
  initial: Robot;
  /** The newest revision's number, which a save must still find newest. */
  baseRevision: number;
  mode: EditorMode;
  /**
   * Sends the saves (needed unless the mode is "read"). It belongs to the page,
   * not the editor: the editor is remounted on every new revision, and the
   * outcome of the save that made it must outlive that.
   */
  saveFetcher?: FetcherWithComponents<SaveResult>;
};

export function RobotEditor({ robotId, initial, baseRevision, mode, saveFetcher }: RobotEditorProps) {
  const [document, setDocument] = useState<RobotDocument>(() => structuredClone(initial) as RobotDocument);
  const [texts, setTexts] = useState<Record<string, string>>({});
  const [toolNote, setToolNote] = useState<string | null>(null);
  const check = useMemo(() => checkDraft(document), [document]);
  // The views keep showing the last valid robot while a field is being fixed.
  const lastValid = useRef<Robot>(initial);
  if (check.robot) lastValid.current = check.robot;
  const viewRobot = check.robot ?? lastValid.current;
  const dirty = useMemo(() => changedFields(initial, document).length > 0, [initial, document]);

  // Stable for the life of the form, so memoised rows re-render only for their own changes.
  const actions = useMemo<EditorActions>(
    () => ({
      mode,
      setNumber: (path: FieldPath, text: string) => {
        setTexts((current) => ({ ...current, [pathText(path)]: text }));
        setDocument((current) => setAt(current, path, valueFromNumberText(text)));
      },
      setValue: (path: FieldPath, value: unknown) => setDocument((current) => setAt(current, path, value)),
      renameLeg: (index: number, id: string) => setDocument((current) => renameLeg(current, index, id)),
    }),
    [mode],
  );
  const data = useMemo<EditorData>(() => ({ document, texts, issuesByPath: check.byPath }), [document, texts, check.byPath]);

  const removeLeg = useCallback((index: number) => {
    setDocument((current) => removeLegAt(current, index));
    setTexts({});
    setToolNote("Removed a leg.");
  }, []);

  const replaceAll = (next: Robot | RobotDocument, note: string | null) => {
    setDocument(structuredClone(next) as RobotDocument);
    setTexts({});
    setToolNote(note);
  };

  const editing = mode !== "read";

  return (
    <EditorActionsProvider value={actions}>
      <EditorDataProvider value={data}>
        <div className="space-y-8">
          {mode === "calibrate" ? (
            <p className="rounded-lg border border-line bg-accent-soft px-4 py-3 text-sm">
              As firmware you can change each joint&apos;s zero offset and servo mapping. The other fields are locked.
            </p>
          ) : null}
          {editing ? <IssueSummary issues={check.issues} fieldFor={formFieldIdFor} /> : null}

          <Section title="Neutral stance">
            {check.robot || !editing ? null : (
              <p className="text-sm text-warning">
                <span aria-hidden>⚠ </span>The views show the last valid definition until the problems are fixed.
              </p>
            )}
            <RobotViews robot={viewRobot} />
          </Section>

          <Section title="Body">
            <BodySection />
          </Section>

          <Section title="Legs">
            <LegTable onRemove={mode === "edit" ? removeLeg : undefined} />
            {mode === "edit" ? <LegTools robot={check.robot} onApply={(next, note) => replaceAll(next, note)} /> : null}
            <p role="status" aria-live="polite" className="text-sm text-ok">
              {toolNote}
            </p>
          </Section>

          <Section title="Joints and servos">
            <p className="text-sm text-ink-muted">
              Limits are in servo degrees; servo angle = geometric angle − zero offset. Pulse = centre ± µs/° × servo angle, the sign flipped when reversed.
            </p>
            <JointTable />
          </Section>

          <Section title="Rest pose">
            <RestPoseSection
              onToggle={(on) => {
                if (!on) replaceAll(setAt(document, ["rest"], undefined), "Removed the rest pose.");
                else if (check.robot)
                  replaceAll({ ...check.robot, rest: defaultRest(check.robot) }, "Added a rest pose: every joint at 0° or its nearest limit.");
                else setToolNote("Fix the problems listed above before adding a rest pose.");
              }}
            />
          </Section>

          {editing && saveFetcher ? (
            <SaveBar
              fetcher={saveFetcher}
              robotId={robotId}
              document={document}
              baseRevision={baseRevision}
              dirty={dirty}
              problemCount={check.issues.length}
              onDiscard={() => replaceAll(initial, "Changes discarded.")}
            />
          ) : null}
        </div>
      </EditorDataProvider>
    </EditorActionsProvider>
  );
}

function SaveBar({
  fetcher,
  robotId,
  document,
  baseRevision,
  dirty,
  problemCount,
  onDiscard,
}: {
  fetcher: FetcherWithComponents<SaveResult>;
  robotId: string;
  document: RobotDocument;
  baseRevision: number;
  dirty: boolean;
  problemCount: number;
  onDiscard: () => void;
}) {
  const [message, setMessage] = useState("");
  const busy = fetcher.state !== "idle";
  const result = fetcher.data;
  const definition = JSON.stringify(document);

  const refusal = result && "error" in result ? result : null;
  const stale = refusal?.code === "stale" && refusal.details?.baseRevision === baseRevision ? refusal : null;
  const latest = stale?.details?.latest;
  const saved = result && "ok" in result && result.number === baseRevision && !dirty ? result : null;
  const failure = refusal && !stale && dirty ? refusal : null;
  const blocked = !dirty
    ? "No changes to save."
    : problemCount > 0
      ? `Fix ${problemCount === 1 ? "the problem" : `the ${problemCount} problems`} first.`
      : null;

  return (
    <section aria-label="Save" className="sticky bottom-0 z-10 space-y-2 rounded-lg border border-line bg-surface px-4 py-3 shadow-sm">
      <LeaveGuard dirty={dirty} />
      {stale && latest ? (
        <div role="alert" className="rounded-md border border-warning bg-warning-soft p-3 text-sm">
          <p className="font-semibold">
            <span aria-hidden>⚠ </span>Not saved: someone saved this robot while you were editing.
          </p>
          <p className="mt-1">{stale.error} Your edits are still in the form.</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Link
              to={`/robots/${robotId}/revisions/${latest.number}`}
              target="_blank"
              className="rounded-md border border-line bg-surface px-3 py-1 font-medium hover:bg-sunken"
            >
              Open revision {latest.number} in a new tab
            </Link>
            <button
              type="button"
              disabled={busy}
              className="rounded-md border border-line bg-surface px-3 py-1 font-medium hover:bg-sunken"
              onClick={() =>
                fetcher.submit({ intent: "save", baseRevision: String(latest.number), definition, message }, { method: "post", action: `/robots/${robotId}` })
              }
            >
              Save mine as revision {latest.number + 1} anyway
            </button>
            <Link to={`/robots/${robotId}`} className="rounded-md border border-line bg-surface px-3 py-1 font-medium hover:bg-sunken">
              Drop my edits and load revision {latest.number}
            </Link>
          </div>
        </div>
      ) : null}
      {failure ? (
        <div role="alert" className="rounded-md border border-danger bg-danger-soft p-3 text-sm text-danger">
          <p>
            <span aria-hidden>⚠ </span>
            {failure.error}
          </p>
          {failure.details?.issues?.length ? <IssueList issues={failure.details.issues} className="mt-1 list-inside list-disc" /> : null}
        </div>
      ) : null}
      <fetcher.Form method="post" action={`/robots/${robotId}`} className="flex flex-wrap items-center gap-3">
        <input type="hidden" name="intent" value="save" />
        <input type="hidden" name="baseRevision" value={baseRevision} />
        <input type="hidden" name="definition" value={definition} />
        <p role="status" aria-live="polite" className="w-40 text-sm text-ink-muted">
          {busy ? "Saving…" : saved ? <span className="text-ok">✓ Saved as revision {saved.number}.</span> : (blocked ?? "Unsaved changes.")}
        </p>
        <input
          name="message"
          aria-label="What changed (optional)"
          value={message}
          maxLength={500}
          onChange={(event) => setMessage(event.currentTarget.value)}
          placeholder="What changed (optional)"
          className="min-w-64 flex-1 rounded border border-line bg-surface px-2 py-1"
        />
        <button
          type="submit"
          disabled={busy || blocked !== null}
          className="rounded-md bg-accent px-4 py-1.5 font-medium text-on-accent hover:bg-accent-strong disabled:cursor-not-allowed disabled:opacity-50"
        >
          {busy ? "Saving…" : `Save as revision ${baseRevision + 1}`}
        </button>
        <button
          type="button"
          onClick={onDiscard}
          disabled={!dirty || busy}
          className="rounded-md border border-line px-3 py-1.5 font-medium hover:bg-sunken disabled:cursor-not-allowed disabled:opacity-50"
        >
          Discard changes
        </button>
      </fetcher.Form>
    </section>
  );
}
