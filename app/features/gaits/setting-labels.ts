// What a gait's settings are called wherever a person reads them: the
// editor's template fields and the comparison's list of changed settings. One
// name (and unit) for one setting everywhere, never the stored path
// (`generator.strideMm`). Pure: components import it.
import type { FieldChange } from "../robots/index";

export type SettingLabel = { label: string; unit?: string };

export const SETTING_LABELS = {
  cycleMs: { label: "Cycle time", unit: "ms" },
  fps: { label: "Frame rate", unit: "frames/s" },
  loop: { label: "Loops" },
  "generator.template": { label: "Template" },
  "generator.strideMm": { label: "Stride length", unit: "mm" },
  "generator.stepHeightMm": { label: "Step height", unit: "mm" },
  "generator.directionDeg": { label: "Direction", unit: "°" },
  "generator.turnDegPerCycle": { label: "Turn per cycle", unit: "°" },
  "generator.bodyHeightMm": { label: "Body height", unit: "mm" },
  "generator.dutyFactor": { label: "Duty factor" },
} as const satisfies Record<string, SettingLabel>;

export type SettingPath = keyof typeof SETTING_LABELS;

const PHASE = /^generator\.phase\.(.+)$/;

/** "Stride length (mm)"; a leg's phase "Lift-off time of LF (fraction of the cycle)"; a path we have no name for as it is. */
export function settingLabel(path: string): string {
  const known = (SETTING_LABELS as Record<string, SettingLabel>)[path];
  if (known) return known.unit ? `${known.label} (${known.unit})` : known.label;
  const phase = PHASE.exec(path);
  if (phase) return `Lift-off time of ${phase[1]} (fraction of the cycle)`;
  return path;
}

function valueText(path: string, value: unknown): string {
  if (value === undefined || value === null) {
    if (path === "generator.bodyHeightMm") return "the robot's";
    if (path === "generator.dutyFactor") return "the template's";
    if (path === "generator.template") return "none (hand-made keys)";
    return "none";
  }
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") return String(Math.round(value * 1000) / 1000);
  if (typeof value === "string") return value;
  return Array.isArray(value) ? "a list" : "set";
}

/** "Stride length (mm): 40 → 55" */
export function describeSettingChange(change: FieldChange): string {
  return `${settingLabel(change.path)}: ${valueText(change.path, change.before)} → ${valueText(change.path, change.after)}`;
}
