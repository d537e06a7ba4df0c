// The template and its parameters. Changing one regenerates the keys at once,
// or after a confirmation when the keys hold hand edits that would be lost
// (regenerating is one undo step either way). Body keys are kept.
import { useId, useMemo, useRef, useState } from "react";
import type { GaitParams, TemplateName } from "~/gait";
import { NumberField } from "~/components/key-details/NumberField";
import { hasHandEdits } from "~/features/gaits/editor/hand-edits";
import { paramsOfSequence, suitableTemplates } from "~/features/gaits/editor/templates";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import { SETTING_LABELS, type SettingPath } from "~/features/gaits";

type NumberParam = "cycleMs" | "fps" | "strideMm" | "stepHeightMm" | "directionDeg" | "turnDegPerCycle" | "bodyHeightMm" | "dutyFactor";

// Names and units from the one list every page uses (the comparison's changed settings too).
const FIELDS: { name: NumberParam; setting: SettingPath; min?: number; max?: number; optional?: boolean; digits?: number }[] = [
  { name: "cycleMs", setting: "cycleMs", min: 1, max: 600_000, digits: 0 },
  { name: "fps", setting: "fps", min: 1, max: 1000, digits: 0 },
  { name: "strideMm", setting: "generator.strideMm" },
  { name: "stepHeightMm", setting: "generator.stepHeightMm", min: 0, max: 1000 },
  { name: "directionDeg", setting: "generator.directionDeg" },
  { name: "turnDegPerCycle", setting: "generator.turnDegPerCycle" },
  { name: "bodyHeightMm", setting: "generator.bodyHeightMm", min: 1, optional: true },
  { name: "dutyFactor", setting: "generator.dutyFactor", min: 0.01, max: 0.99, optional: true, digits: 3 },
];

const labelOf = (setting: SettingPath): { label: string; unit?: string } => SETTING_LABELS[setting];

export function GeneratorPanel() {
  const store = useEditorStore();
  const robot = useEditor((state) => state.robot);
  const sequence = useEditor((state) => state.sequence);
  const readOnly = useEditor((state) => state.readOnly);
  const templates = useMemo(() => suitableTemplates(robot), [robot]);
  const current = useMemo(() => paramsOfSequence(sequence), [sequence]);
  const [pending, setPending] = useState<GaitParams | null>(null);
  // Kept keys put the typed value back: the fields start again from the sequence.
  const [fieldsKey, setFieldsKey] = useState(0);
  const confirm = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const params: GaitParams = current ?? { template: templates[0]?.name ?? "wave", cycleMs: sequence.cycleMs, fps: sequence.fps };

  const change = (next: GaitParams) => {
    if (readOnly) return;
    if (hasHandEdits(robot, sequence)) {
      setPending(next);
      confirm.current?.showModal();
      return;
    }
    store.getState().regenerate(next);
  };

  return (
    // Not a Panel: a compact block (a heading line, then the fields), so it fits above the timeline at 1280×800.
    <section aria-labelledby={titleId} className="rounded-lg border border-line bg-surface">
      <div
        key={fieldsKey}
        className="grid grid-cols-2 gap-x-3 gap-y-2 px-3 pt-2 pb-3 sm:grid-cols-3 md:grid-cols-[minmax(9.5rem,1.5fr)_repeat(4,minmax(0,1fr))]"
      >
        <h2 id={titleId} className="col-span-full font-semibold">
          Template and parameters
        </h2>
        <label className="flex flex-col text-xs text-ink-muted">
          {SETTING_LABELS["generator.template"].label}
          <select
            disabled={readOnly}
            value={current ? params.template : ""}
            onChange={(event) => change({ ...params, template: event.currentTarget.value as TemplateName, dutyFactor: undefined })}
            className="rounded border border-line bg-surface px-1 py-0.5 text-sm text-ink"
          >
            {current ? null : <option value="">(none: hand-made keys)</option>}
            {templates.map((template) => (
              <option key={template.name} value={template.name}>
                {template.label}
              </option>
            ))}
          </select>
        </label>
        {FIELDS.map((field) => (
          <NumberField
            key={field.name}
            label={labelOf(field.setting).label}
            unit={labelOf(field.setting).unit}
            value={params[field.name] as number | undefined}
            placeholder={field.name === "bodyHeightMm" ? String(robot.standHeight) : field.name === "dutyFactor" ? "template's" : undefined}
            optional={field.optional}
            digits={field.digits ?? 1}
            min={field.min}
            max={field.max}
            disabled={readOnly}
            width="w-24"
            onCommit={(value) => change({ ...params, [field.name]: value })}
          />
        ))}
        <p className="self-end text-xs text-ink-muted max-md:col-span-full">
          A change writes new keys; hand edits are asked about first, and Undo brings them back.
        </p>
      </div>
      <dialog
        ref={confirm}
        aria-labelledby="regenerate-title"
        className="m-auto w-[28rem] max-w-[95vw] rounded-lg border border-line bg-surface p-5 text-ink shadow-xl backdrop:bg-ink/40"
        onClose={() => {
          setPending(null);
          setFieldsKey((value) => value + 1);
        }}
      >
        <h2 id="regenerate-title" className="text-lg font-semibold">
          Replace the hand-edited keys?
        </h2>
        <p className="mt-2 text-sm">
          The keys differ from what the {params.template} template writes. Regenerating with the new parameters replaces every leg key (body keys stay). You can
          undo it.
        </p>
        <form method="dialog" className="mt-4 flex justify-end gap-2">
          <button type="submit" value="keep" className="rounded-md border border-line px-3 py-1.5 hover:bg-sunken">
            Keep my keys
          </button>
          <button
            type="submit"
            value="replace"
            className="rounded-md bg-danger px-3 py-1.5 font-medium text-surface hover:opacity-90"
            onClick={() => {
              if (pending) store.getState().regenerate(pending);
            }}
          >
            Replace them
          </button>
        </form>
      </dialog>
    </section>
  );
}
