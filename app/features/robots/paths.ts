// Reading and writing a robot definition at a field path (["legs", 0, "mount", "x"]),
// the same paths parseRobot reports its issues at. Pure: runs in the browser editor
// and on the server alike.
import { formatPath } from "~/kinematics";

export type FieldPath = readonly (string | number)[];

/** The path as issues name it: `legs[0].mount.x`. */
export const pathText = (path: FieldPath): string => formatPath(path);

/** An id for the field's input, usable in `href="#…"` and `aria-describedby`. */
export function fieldId(path: FieldPath): string {
  return `field-${path.map((key) => String(key).replace(/[^A-Za-z0-9_-]/g, "_")).join("-")}`;
}

export function getAt(document: unknown, path: FieldPath): unknown {
  let node = document;
  for (const key of path) {
    if (node === null || typeof node !== "object") return undefined;
    node = (node as Record<string | number, unknown>)[key];
  }
  return node;
}

/** A copy of `document` with `value` at `path`; only the objects along the path are copied. `undefined` removes the key. */
export function setAt<T>(document: T, path: FieldPath, value: unknown): T {
  if (path.length === 0) return value as T;
  const [key, ...rest] = path;
  const node = (document ?? (typeof key === "number" ? [] : {})) as Record<string | number, unknown> | unknown[];
  const copy = (Array.isArray(node) ? [...node] : { ...node }) as Record<string | number, unknown>;
  const next = setAt(copy[key], rest, value);
  if (next === undefined && !Array.isArray(copy)) delete copy[key];
  else copy[key] = next;
  return copy as T;
}

/** `legs[0].mount.x` → ["legs", 0, "mount", "x"]: the inverse of pathText. */
export function parsePathText(text: string): (string | number)[] {
  const out: (string | number)[] = [];
  const token = /\.?([A-Za-z_$][A-Za-z0-9_$]*)|\[(\d+)\]|\[("(?:[^"\\]|\\.)*")\]/g;
  for (const match of text.matchAll(token)) {
    if (match[1] !== undefined) out.push(match[1]);
    else if (match[2] !== undefined) out.push(Number(match[2]));
    else out.push(JSON.parse(match[3]) as string);
  }
  return out;
}

// The fields the robot form has an input for; an issue elsewhere (the leg count,
// a rest entry for a leg that is gone) is shown in the summary only.
const FORM_FIELDS = [
  /^(name|description|standHeight)$/,
  /^body\.(massKg|com\[[0-2]\])$/,
  /^legs\[\d+\]\.(id|side|row|coxa|femur|tibia|mount\.(x|y|z|yawDeg))$/,
  /^legs\[\d+\]\.joints\.(coxa|femur|tibia)\.(minDeg|maxDeg|zeroOffsetDeg|maxSpeedDegS|servo\.(channel|reversed|centerUs|usPerDeg|minUs|maxUs))$/,
  /^rest\.[A-Za-z][A-Za-z0-9_]*\.(coxa|femur|tibia)$/,
];

/** The id of the form input an issue at `path` belongs to, or null when the form has none. */
export function formFieldIdFor(path: string): string | null {
  return FORM_FIELDS.some((pattern) => pattern.test(path)) ? fieldId(parsePathText(path)) : null;
}
