// What a save changes, field by field, and which of those changes firmware may
// make: only a joint's zero offset and its servo mapping (DESIGN.md, "Roles").
// Pure, so the editor can lock the other fields and the server can refuse them
// with the same rule.
import { pathText, type FieldPath } from "./paths";

export type FieldChange = { path: string; before: unknown; after: unknown };

/** True for `legs[i].joints.<joint>.zeroOffsetDeg` and everything under `legs[i].joints.<joint>.servo`. */
export function isCalibrationPath(path: FieldPath): boolean {
  if (path.length < 5 || path[0] !== "legs" || typeof path[1] !== "number" || path[2] !== "joints") return false;
  return (path[4] === "zeroOffsetDeg" && path.length === 5) || path[4] === "servo";
}

const isPlainObject = (value: unknown): value is Record<string, unknown> => value !== null && typeof value === "object" && !Array.isArray(value);

/**
 * Every field that differs between two definitions, in document order. Arrays
 * of different lengths count as one change of the array itself (legs added or
 * removed), after the changes of the items both have.
 */
export function changedFields(before: unknown, after: unknown): FieldChange[] {
  const out: FieldChange[] = [];
  walk(before, after, [], out, () => false);
  return out;
}

/** The changes a role with only the calibration permission may not make (empty when the save is allowed). */
export function nonCalibrationChanges(before: unknown, after: unknown): FieldChange[] {
  const out: FieldChange[] = [];
  walk(before, after, [], out, isCalibrationPath);
  return out;
}

function walk(before: unknown, after: unknown, path: (string | number)[], out: FieldChange[], skip: (path: FieldPath) => boolean): void {
  if (skip(path)) return;
  if (Array.isArray(before) && Array.isArray(after)) {
    const shared = Math.min(before.length, after.length);
    for (let index = 0; index < shared; index += 1) walk(before[index], after[index], [...path, index], out, skip);
    if (before.length !== after.length) out.push({ path: pathText(path), before: `${before.length} items`, after: `${after.length} items` });
    return;
  }
  if (isPlainObject(before) && isPlainObject(after)) {
    const keys = [...Object.keys(before), ...Object.keys(after).filter((key) => !(key in before))];
    for (const key of keys) walk(before[key], after[key], [...path, key], out, skip);
    return;
  }
  // 0 and −0 are the same setting.
  if (!Object.is(before, after) && !(before === 0 && after === 0)) out.push({ path: pathText(path), before, after });
}

function shown(value: unknown): string {
  if (value === undefined) return "nothing";
  if (typeof value === "string") return value.endsWith(" items") ? value : JSON.stringify(value);
  if (typeof value === "object") return Array.isArray(value) ? "a list" : "an object";
  return String(value);
}

/** `legs[0].femur (62 → 70)` */
export function describeChange(change: FieldChange): string {
  return `${change.path || "the definition"} (${shown(change.before)} → ${shown(change.after)})`;
}

/** A revision message for a save that gave none: what changed, briefly. */
export function summarizeChanges(changes: FieldChange[]): string {
  if (changes.length === 0) return "No changes";
  const shownChanges = changes.slice(0, 3).map(describeChange).join(", ");
  return changes.length > 3 ? `Changed ${shownChanges} and ${changes.length - 3} more` : `Changed ${shownChanges}`;
}
