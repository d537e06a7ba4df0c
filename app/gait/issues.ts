// Turns zod's issues into the { path, message } pairs shown next to a field,
// in the same shape and wording as the robot's (`legs.LF.keys[2].t` /
// `must be at most 1 (got 1.2)`); the path spelling is the kinematics' formatPath.
import type { z } from "zod";
import { formatPath } from "../kinematics/index";

export type SequenceIssue = { path: string; message: string };

type ZodIssue = z.core.$ZodIssue;

const EXPECTED_WORDS: Record<string, string> = {
  number: "a number",
  int: "a whole number",
  string: "a string",
  boolean: "true or false",
  object: "an object",
  record: "an object",
  array: "an array",
  tuple: "an array",
};

function describeValue(value: unknown): string {
  if (value === undefined) return "nothing";
  if (value === null) return "null";
  if (Array.isArray(value)) return "an array";
  if (typeof value === "string") return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (typeof value === "object") return "an object";
  return String(value);
}

function messageOf(issue: ZodIssue): string {
  const got = describeValue(issue.input);
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined) return "is required";
      return `must be ${EXPECTED_WORDS[issue.expected] ?? issue.expected} (got ${got})`;
    case "too_small": {
      const minimum = Number(issue.minimum);
      if (issue.origin === "array") return `must have at least ${minimum} items (got ${(issue.input as unknown[] | undefined)?.length ?? "fewer"})`;
      if (issue.origin === "string") return "must not be empty";
      if (!issue.inclusive && minimum === 0) return `must be positive (got ${got})`;
      return issue.inclusive ? `must be at least ${minimum} (got ${got})` : `must be above ${minimum} (got ${got})`;
    }
    case "too_big": {
      const maximum = Number(issue.maximum);
      if (issue.origin === "array") return `must have at most ${maximum} items (got ${(issue.input as unknown[] | undefined)?.length ?? "more"})`;
      if (issue.origin === "string") return `must be at most ${maximum} characters long`;
      return issue.inclusive ? `must be at most ${maximum} (got ${got})` : `must be below ${maximum} (got ${got})`;
    }
    case "invalid_value": {
      const allowed = issue.values.map((value) => JSON.stringify(value));
      return allowed.length === 1 ? `must be ${allowed[0]} (got ${got})` : `must be one of ${allowed.join(", ")} (got ${got})`;
    }
    default:
      return issue.message;
  }
}

/** Flattens zod issues; an unknown key becomes one issue at the key's own path. */
export function formatSequenceIssues(issues: readonly ZodIssue[]): SequenceIssue[] {
  const out: SequenceIssue[] = [];
  for (const issue of issues) {
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) out.push({ path: formatPath([...issue.path, key]), message: "is not a known field (check the spelling)" });
    } else {
      out.push({ path: formatPath(issue.path), message: messageOf(issue) });
    }
  }
  return out;
}
