// What differs between the robot revisions two versions pin: every changed
// field of the definition, with the same field walk the robot editor uses. Pure.
import { changedFields, describeChange, type FieldChange } from "../robots/index";

export type RobotRevisionDiff = {
  /** The revision numbers A and B pin. */
  a: number;
  b: number;
  changes: FieldChange[];
  /** "legs[0].femur (62 → 70)" per change. */
  described: string[];
};

/** Null when both pin the same revision. */
export function robotRevisionDiff(a: { number: number; definition: unknown }, b: { number: number; definition: unknown }): RobotRevisionDiff | null {
  if (a.number === b.number) return null;
  const changes = changedFields(a.definition, b.definition);
  return { a: a.number, b: b.number, changes, described: changes.map(describeChange) };
}
