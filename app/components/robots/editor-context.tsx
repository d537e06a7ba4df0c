// The robot editor's shared state, read by every field through context: the
// working document, what each field's text is, the issues by path, and which
// fields this person may change.
import { createContext, useContext } from "react";
import { isCalibrationPath } from "~/lib/robots/changes";
import type { RobotDocument } from "~/lib/robots/draft";
import { pathText, type FieldPath } from "~/lib/robots/paths";

/** edit: everything; calibrate: zero offsets and servo mapping only (firmware); read: nothing. */
export type EditorMode = "edit" | "calibrate" | "read";

export type EditorState = {
  document: RobotDocument;
  /** Text typed into number fields that does not read back the same from the document ("1.", "abc"). */
  texts: Readonly<Record<string, string>>;
  issuesByPath: ReadonlyMap<string, string[]>;
  mode: EditorMode;
  setNumber: (path: FieldPath, text: string) => void;
  setValue: (path: FieldPath, value: unknown) => void;
  renameLeg: (index: number, id: string) => void;
};

const EditorContext = createContext<EditorState | null>(null);

export const EditorProvider = EditorContext.Provider;

export function useEditor(): EditorState {
  const state = useContext(EditorContext);
  if (!state) throw new Error("robot editor fields need an EditorProvider");
  return state;
}

export function isLocked(mode: EditorMode, path: FieldPath): boolean {
  if (mode === "read") return true;
  return mode === "calibrate" && !isCalibrationPath(path);
}

export function issuesAt(state: EditorState, path: FieldPath): string[] {
  return state.issuesByPath.get(pathText(path)) ?? [];
}
