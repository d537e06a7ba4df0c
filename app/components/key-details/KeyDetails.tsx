// Key details: everything about the selected key — when (frame and ms),
// contact, foot position, apex height and the easing of the segment that
// leaves it, with a curve editor and named presets of our own.
import { CSS_EASE, type BodyKey, type Ease, type LegKey } from "~/gait";
import type { Vec3 } from "~/kinematics";
import { EASE_PRESETS, presetOf } from "~/features/gaits/editor/ease-presets";
import { keyAt, keyPlacesFoot } from "~/features/gaits/editor/key-edits";
import { msOfFrame } from "~/features/gaits/editor/timing";
import { useEditor, useEditorStore } from "~/stores/editor-context";
import type { KeyRef } from "~/stores/editor-store";
import { BezierEditor } from "./BezierEditor";
import { NumberField } from "./NumberField";
import { Panel } from "~/components/common/Panel";

export function KeyDetails() {
  const selection = useEditor((state) => state.selection);
  const key = useEditor((state) => (state.selection ? keyAt(state.sequence, state.selection) : undefined));
  return (
    <Panel title="Key details">
      <div className="p-3">
        {!selection || !key ? (
          <p className="text-sm text-ink-muted">Select a key on the Timeline to see and change it.</p>
        ) : selection.legId === null ? (
          <BodyKeyForm index={selection.index} keyData={key as BodyKey} />
        ) : (
          <LegKeyForm keyRef={selection} keyData={key as LegKey} />
        )}
      </div>
    </Panel>
  );
}

function KeyTime({ keyRef, t }: { keyRef: KeyRef; t: number }) {
  const store = useEditorStore();
  const cycleFrames = useEditor((state) => state.cycleFrames);
  const fps = useEditor((state) => state.sequence.fps);
  const readOnly = useEditor((state) => state.readOnly);
  const frame = t * cycleFrames;
  return (
    <div className="flex items-end gap-3">
      <NumberField
        label="Frame"
        value={frame}
        digits={1}
        min={0}
        max={cycleFrames}
        disabled={readOnly}
        onCommit={(value) => {
          if (value === undefined) return;
          store.getState().moveKey(keyRef, value / cycleFrames, !Number.isInteger(value));
          const placed = keyAt(store.getState().sequence, keyRef);
          if (placed && Math.abs(placed.t * cycleFrames - value) > 1e-6)
            store.getState().announce(`The key stops at frame ${Math.round(placed.t * cycleFrames * 10) / 10}, one frame from its neighbour.`, "error");
        }}
      />
      <p className="numeric pb-1 font-mono text-sm text-ink-muted">
        {Math.round(msOfFrame(frame, fps))} ms · t = {t.toFixed(4)}
      </p>
    </div>
  );
}

function EaseFields({ ease, disabled, onChange }: { ease: Ease; disabled: boolean; onChange: (ease: Ease) => void }) {
  const store = useEditorStore();
  const preset = presetOf(ease);
  return (
    <fieldset className="mt-3">
      <legend className="text-sm font-medium">Easing of the segment leaving this key</legend>
      <div className="mt-1 flex flex-wrap items-start gap-3">
        <BezierEditor
          ease={ease}
          disabled={disabled}
          onChange={onChange}
          onGestureStart={() => store.getState().beginGesture()}
          onGestureEnd={() => store.getState().endGesture()}
        />
        <div className="flex flex-col gap-2">
          <label className="flex flex-col text-xs text-ink-muted">
            Preset
            <select
              disabled={disabled}
              value={preset?.name ?? ""}
              onChange={(event) => {
                const chosen = EASE_PRESETS.find((candidate) => candidate.name === event.currentTarget.value);
                if (chosen) onChange([...chosen.ease]);
              }}
              className="rounded border border-line bg-surface px-1 py-0.5 text-sm text-ink"
            >
              {preset ? null : <option value="">Own curve</option>}
              {EASE_PRESETS.map((candidate) => (
                <option key={candidate.name} value={candidate.name}>
                  {candidate.name} — {candidate.hint}
                </option>
              ))}
            </select>
          </label>
          <div className="grid grid-cols-2 gap-2">
            {(["x1", "y1", "x2", "y2"] as const).map((name, index) => (
              <NumberField
                key={name}
                label={`Control ${name}`}
                value={ease[index]}
                digits={3}
                min={name.startsWith("x") ? 0 : -1}
                max={name.startsWith("x") ? 1 : 2}
                width="w-16"
                disabled={disabled}
                onCommit={(value) => {
                  if (value === undefined) return;
                  const next = [...ease] as Ease;
                  next[index] = value;
                  onChange(next);
                }}
              />
            ))}
          </div>
        </div>
      </div>
    </fieldset>
  );
}

function LegKeyForm({ keyRef, keyData }: { keyRef: KeyRef; keyData: LegKey }) {
  const store = useEditorStore();
  const readOnly = useEditor((state) => state.readOnly);
  const stepHeightMm = useEditor((state) => state.sequence.generator.stepHeightMm);
  const places = useEditor((state) => keyPlacesFoot(state.sequence, keyRef));
  const update = (patch: Partial<Omit<LegKey, "t">>) => store.getState().updateLegKey(keyRef, patch);
  const foot = keyData.foot;
  const setFootAxis = (axis: 0 | 1 | 2, value: number | undefined) => {
    if (value === undefined) return;
    const base: Vec3 = foot ? [...foot] : [0, 0, 0];
    base[axis] = value;
    update({ foot: base });
  };
  return (
    <div>
      <p className="mb-2 font-mono text-sm font-medium">
        {keyRef.legId} · key {keyRef.index + 1} · {keyData.contact === "swing" ? "lift-off" : "touch-down"}
      </p>
      <KeyTime keyRef={keyRef} t={keyData.t} />
      <div className="mt-3 flex flex-wrap items-end gap-3">
        <label className="flex flex-col text-xs text-ink-muted">
          Contact from here
          <select
            disabled={readOnly}
            value={keyData.contact}
            onChange={(event) => update({ contact: event.currentTarget.value as LegKey["contact"] })}
            className="rounded border border-line bg-surface px-1 py-0.5 text-sm text-ink"
          >
            <option value="stance">stance — foot on the ground</option>
            <option value="swing">swing — foot in the air</option>
          </select>
        </label>
        {keyData.contact === "swing" ? (
          <NumberField
            label="Apex height"
            unit="mm"
            value={keyData.apexMm}
            optional
            placeholder={String(stepHeightMm)}
            min={0}
            max={1000}
            disabled={readOnly}
            onCommit={(value) => update({ apexMm: value })}
          />
        ) : null}
      </div>
      <fieldset className="mt-3">
        <legend className="text-sm font-medium">Foot (neutral body frame)</legend>
        <div className="mt-1 flex flex-wrap items-end gap-2">
          {(["x", "y", "z"] as const).map((axis, index) => (
            <NumberField
              key={axis}
              label={`Foot ${axis}`}
              unit="mm"
              value={foot?.[index]}
              placeholder="planned"
              disabled={readOnly}
              onCommit={(value) => setFootAxis(index as 0 | 1 | 2, value)}
            />
          ))}
          {foot && !readOnly ? (
            <button type="button" onClick={() => update({ foot: undefined })} className="rounded-md border border-line px-2 py-0.5 text-sm hover:bg-sunken">
              Use the generator's placement
            </button>
          ) : null}
        </div>
        <p className="mt-1 text-xs text-ink-muted">
          {places
            ? "This key places the foot: drag it in the top view, or type it here."
            : "During a stance the foot stays where it touched down, so this key's foot follows from the touch-down before it; move that key's foot instead."}
        </p>
      </fieldset>
      <EaseFields ease={keyData.ease ?? [...CSS_EASE]} disabled={readOnly} onChange={(ease) => update({ ease })} />
    </div>
  );
}

const POSE_FIELDS = [
  { name: "x", unit: "mm" },
  { name: "y", unit: "mm" },
  { name: "z", unit: "mm" },
  { name: "roll", unit: "°" },
  { name: "pitch", unit: "°" },
  { name: "yaw", unit: "°" },
] as const;

function BodyKeyForm({ index, keyData }: { index: number; keyData: BodyKey }) {
  const store = useEditorStore();
  const readOnly = useEditor((state) => state.readOnly);
  const update = (patch: Parameters<ReturnType<typeof store.getState>["updateBodyKey"]>[1]) => store.getState().updateBodyKey(index, patch);
  return (
    <div>
      <p className="mb-2 font-mono text-sm font-medium">Body · key {index + 1}</p>
      <KeyTime keyRef={{ legId: null, index }} t={keyData.t} />
      <fieldset className="mt-3">
        <legend className="text-sm font-medium">Pose offset (heading frame)</legend>
        <div className="mt-1 grid grid-cols-3 gap-2">
          {POSE_FIELDS.map((field) => (
            <NumberField
              key={field.name}
              label={`Body ${field.name}`}
              unit={field.unit}
              value={keyData.pose[field.name]}
              disabled={readOnly}
              onCommit={(value) => update({ pose: { [field.name]: value ?? 0 } })}
            />
          ))}
        </div>
      </fieldset>
      <label className="mt-3 flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          disabled={readOnly}
          checked={keyData.resting ?? false}
          onChange={(event) => update({ resting: event.currentTarget.checked })}
          className="accent-accent"
        />
        Body rests on the ground from this key (support checks skip it)
      </label>
      <EaseFields ease={keyData.ease ?? [...CSS_EASE]} disabled={readOnly} onChange={(ease) => update({ ease })} />
    </div>
  );
}
