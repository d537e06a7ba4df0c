// A stored robot revision never changes, but the robot schema can move on: a
// revision that no longer parses cannot be solved or exported, and the one
// who asked has to move to (or make) a newer revision. Every service answers
// it the same way, from here.
import { parseRobot, type Robot } from "../../kinematics/index";
import { ServiceError } from "../../platform/errors.server";

export type RevisionContext = {
  /** The gait version that pins the revision, if the question came through one. */
  version?: number;
  robotName?: string;
  /** What to do about it, as the end of the sentence: "move the draft to a newer revision". */
  remedy?: string;
  /** The form field that chose the robot. */
  field?: string;
};

/** The revision's definition as a Robot; 409 `revision-unparseable` when it no longer parses. */
export function robotOfRevision(revision: { number: number; definition: unknown }, context: RevisionContext = {}): Robot {
  const parsed = parseRobot(revision.definition);
  if (parsed.ok) return parsed.robot;
  const subject =
    context.version !== undefined
      ? `Version ${context.version} pins robot revision ${revision.number}, which no longer parses`
      : `Robot revision ${revision.number}${context.robotName ? ` of ${context.robotName}` : ""} no longer parses`;
  throw new ServiceError(409, "revision-unparseable", `${subject}${context.remedy ? `; ${context.remedy}` : ""}.`, {
    robotRevision: revision.number,
    ...(context.field ? { field: context.field } : {}),
  });
}
