// The key commands above the tracks: add at the playhead, duplicate, delete,
// copy to other legs, mirror onto the other side. Each says what it acts on.
import { useId, useState } from "react";
import { partnerLeg } from "~/features/gaits/editor/key-edits";
import { useEditor, useEditorStore } from "~/stores/editor-context";

const toolButton = "rounded-md border border-line px-2 py-1 text-sm hover:bg-sunken disabled:cursor-not-allowed disabled:opacity-50";

export function KeyTools() {
  const robot = useEditor((state) => state.robot);
  const readOnly = useEditor((state) => state.readOnly);
  const focusLegId = useEditor((state) => state.focusLegId);
  const selection = useEditor((state) => state.selection);
  const store = useEditorStore();
  const actions = store.getState();
  const [addTo, setAddTo] = useState<"focus" | "body">("focus");
  const selectedLeg = selection?.legId ?? null;
  const mirrorFrom = selectedLeg ?? focusLegId;
  const partner = partnerLeg(robot, mirrorFrom);
  if (readOnly) return <p className="text-sm text-ink-muted">Read only: your role can view this gait.</p>;
  return (
    <div role="toolbar" aria-label="Key commands" className="flex flex-wrap items-center gap-2">
      <span className="flex items-center gap-1">
        <button type="button" className={toolButton} onClick={() => actions.addKeyAtPlayhead(addTo === "body" ? null : focusLegId)}>
          Add key
        </button>
        <label className="sr-only" htmlFor="add-key-track">
          Track to add the key to
        </label>
        <select
          id="add-key-track"
          value={addTo}
          onChange={(event) => setAddTo(event.currentTarget.value as "focus" | "body")}
          className="rounded-md border border-line bg-surface px-1 py-1 text-sm"
        >
          <option value="focus">{`on ${focusLegId} at the playhead`}</option>
          <option value="body">{"on the body at the playhead"}</option>
        </select>
      </span>
      <button type="button" className={toolButton} disabled={!selection} onClick={actions.duplicateSelected}>
        Duplicate key
      </button>
      <button type="button" className={toolButton} disabled={!selection} onClick={actions.deleteSelected}>
        Delete key
      </button>
      <CopyToLegs disabled={selectedLeg === null} />
      <button
        type="button"
        className={toolButton}
        disabled={!partner}
        onClick={() => actions.mirrorLeg(mirrorFrom)}
        title="Writes this leg's keys, mirrored, onto the leg opposite, at that leg's own phase"
      >
        {partner ? `Mirror ${mirrorFrom} onto ${partner}` : "Mirror onto the other side"}
      </button>
    </div>
  );
}

function CopyToLegs({ disabled }: { disabled: boolean }) {
  const robot = useEditor((state) => state.robot);
  const selection = useEditor((state) => state.selection);
  const copySelectedTo = useEditor((state) => state.copySelectedTo);
  const [targets, setTargets] = useState<string[]>([]);
  const [byPhase, setByPhase] = useState(true);
  const [open, setOpen] = useState(false);
  const id = useId();
  const source = selection?.legId ?? null;
  return (
    <div className="relative">
      <button type="button" className={toolButton} disabled={disabled} aria-expanded={open} aria-controls={id} onClick={() => setOpen(!open)}>
        Copy key to legs…
      </button>
      {open && !disabled ? (
        <div
          id={id}
          role="group"
          aria-label={`Copy the ${source} key to`}
          className="absolute z-30 mt-1 w-64 rounded-md border border-line bg-surface p-3 shadow-lg"
        >
          <fieldset>
            <legend className="text-sm font-medium">Copy the {source} key to</legend>
            <div className="mt-1 grid grid-cols-3 gap-1">
              {robot.legs
                .filter((leg) => leg.id !== source)
                .map((leg) => (
                  <label key={leg.id} className="flex items-center gap-1 font-mono text-sm">
                    <input
                      type="checkbox"
                      checked={targets.includes(leg.id)}
                      onChange={(event) => setTargets(event.currentTarget.checked ? [...targets, leg.id] : targets.filter((target) => target !== leg.id))}
                      className="accent-accent"
                    />
                    {leg.id}
                  </label>
                ))}
            </div>
          </fieldset>
          <label className="mt-2 flex items-start gap-2 text-sm">
            <input type="checkbox" checked={byPhase} onChange={(event) => setByPhase(event.currentTarget.checked)} className="mt-1 accent-accent" />
            <span>At each leg's own phase (shifted by the difference in lift-off time)</span>
          </label>
          <div className="mt-3 flex gap-2">
            <button
              type="button"
              className="rounded-md bg-accent px-3 py-1 text-sm font-medium text-on-accent hover:bg-accent-strong"
              onClick={() => {
                copySelectedTo(targets, byPhase);
                setOpen(false);
              }}
            >
              Copy
            </button>
            <button type="button" className={toolButton} onClick={() => setOpen(false)}>
              Cancel
            </button>
          </div>
        </div>
      ) : null}
    </div>
  );
}
