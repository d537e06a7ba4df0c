// The robot editor's shared state. Two contexts: the actions and the mode,
// which never change while the form is open (so memoised table rows skip
// re-rendering), and the working document with its texts and issues, read by
// the small sections directly and handed to the table rows as slices.
import { createContext, useContext } from "react";
import { isCalibrationPath } from "~/features/robots/changes";
import type { RobotDocument } from "~/features/robots/form-draft";
import { getAt, pathText, type FieldPath } from "~/features/robots/paths";

/** edit: everything; calibrate: zero offsets and servo mapping only (firmware); read: nothing. */
export type EditorMode = "edit" | "calibrate" | "read";

export type EditorActions = {
  mode: EditorMode;
  setNumber: (path: FieldPath, text: string) => void;
  setValue: (path: FieldPath, value: unknown) => void;
  renameLeg: (index: number, id: string) => void;
};

export type EditorData = {
  document: RobotDocument;
  /** Text typed into number fields that does not read back the same from the document ("1.", "abc"). */
  texts: Readonly<Record<string, string>>;
  issuesByPath: ReadonlyMap<string, string[]>;
};

const ActionsContext = createContext<EditorActions | null>(null);
const DataContext = createContext<EditorData | null>(null);

export const EditorActionsProvider = ActionsContext.Provider;
export const EditorDataProvider = DataContext.Provider;

export function useEditorActions(): EditorActions {
  const actions = useContext(ActionsContext);
  if (!actions) throw new Error("robot editor fields need an EditorActionsProvider");
  return actions;
}

/** A leg of the working document, as far as the tables read it before it validates. */
export type LegDocument = { id?: unknown; mount?: { y?: unknown } } | undefined;

/** The working document's legs: a list, empty while the document holds anything else there. */
export function legsOf(data: EditorData): readonly LegDocument[] {
  const legs = getAt(data.document, ["legs"]);
  return Array.isArray(legs) ? legs : [];
}

export function useEditorData(): EditorData {
  const data = useContext(DataContext);
  if (!data) throw new Error("robot editor sections need an EditorDataProvider");
  return data;
}

export function isLocked(mode: EditorMode, path: FieldPath): boolean {
  if (mode === "read") return true;
  return mode === "calibrate" && !isCalibrationPath(path);
}

/** What a field shows: its value, the text typed into it, and its issues. */
export type FieldData = { value: unknown; text?: string; messages: readonly string[] };

const NO_MESSAGES: readonly string[] = [];

export function fieldData(data: EditorData, path: FieldPath): FieldData {
  const key = pathText(path);
  return { value: getAt(data.document, path), text: data.texts[key], messages: data.issuesByPath.get(key) ?? NO_MESSAGES };
}

/**
 * The texts and issues under `prefix` (e.g. `legs[2].`) as one string, so a
 * memoised row re-renders only when its own fields' texts or issues change.
 */
export function sliceSignature(data: EditorData, prefix: string): string {
  const texts: Record<string, string> = {};
  for (const [key, text] of Object.entries(data.texts)) if (key.startsWith(prefix)) texts[key] = text;
  const issues: Record<string, string[]> = {};
  for (const [key, messages] of data.issuesByPath) if (key.startsWith(prefix)) issues[key] = messages;
  return JSON.stringify({ texts, issues });
}

export type Slice = { texts: Record<string, string>; issues: Record<string, string[]> };

/** A field's data inside a row: its value from the row's own object, texts and issues from the row's slice. */
export function rowFieldData(slice: Slice, row: unknown, rowPath: FieldPath, relative: FieldPath): FieldData {
  const key = pathText([...rowPath, ...relative]);
  return { value: getAt(row, relative), text: slice.texts[key], messages: slice.issues[key] ?? NO_MESSAGES };
}
