// The robot editor's working copy: a JSON document shaped like a robot
// definition that may be invalid while someone types. parseRobot checks it on
// every change and its issues are shown next to the fields they name.
import { issueProblem, parseRobot, type DefinitionIssue, type Robot } from "~/kinematics";
import { getAt, setAt, type FieldPath } from "./paths";

export type RobotDocument = Record<string, unknown>;

export type DraftCheck = {
  /** The parsed robot, or null while the document has problems. */
  robot: Robot | null;
  issues: DefinitionIssue[];
  /** What is wrong, by path (`legs[0].femur`), for the field that shows it: the message without the field's name, which the input has. */
  byPath: Map<string, string[]>;
};

export function checkDraft(document: RobotDocument): DraftCheck {
  const parsed = parseRobot(document);
  if (parsed.ok) return { robot: parsed.robot, issues: [], byPath: new Map() };
  const byPath = new Map<string, string[]>();
  for (const issue of parsed.issues) byPath.set(issue.path, [...(byPath.get(issue.path) ?? []), issueProblem(issue)]);
  return { robot: null, issues: parsed.issues, byPath };
}

const NUMBER_TEXT = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/;

/**
 * What a number field's text puts in the document: a number when it reads as
 * one (a decimal comma counts as a point), nothing when empty (so the check
 * says "is required"), else the text itself (so it says "must be a number").
 */
export function valueFromNumberText(text: string): number | string | undefined {
  if (text.trim() === "") return undefined;
  const normalised = text.replace(",", ".");
  return NUMBER_TEXT.test(normalised) ? Number(normalised) : text;
}

/** Renames leg `index` and carries its rest angles over to the new id. */
export function renameLeg(document: RobotDocument, index: number, newId: string): RobotDocument {
  const oldId = getAt(document, ["legs", index, "id"]);
  let next = setAt(document, ["legs", index, "id"], newId);
  const rest = getAt(next, ["rest"]);
  if (rest && typeof rest === "object" && typeof oldId === "string" && oldId in rest && !(newId in rest)) {
    const { [oldId]: angles, ...others } = rest as Record<string, unknown>;
    next = setAt(next, ["rest"], { ...others, [newId]: angles });
  }
  return next;
}

/** Removes leg `index` and its rest angles. */
export function removeLegAt(document: RobotDocument, index: number): RobotDocument {
  const legs = getAt(document, ["legs"]);
  if (!Array.isArray(legs)) return document;
  const id = getAt(legs, [index, "id"]);
  let next = setAt(
    document,
    ["legs"],
    legs.filter((_, position) => position !== index),
  );
  const rest = getAt(next, ["rest"]);
  if (rest && typeof rest === "object" && typeof id === "string" && id in rest) {
    const { [id]: _removed, ...others } = rest as Record<string, unknown>;
    next = setAt(next, ["rest"], others);
  }
  return next;
}

export function setField(document: RobotDocument, path: FieldPath, value: unknown): RobotDocument {
  return setAt(document, path, value);
}
