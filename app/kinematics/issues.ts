// Turns zod's issues into the { path, message } pairs users read next to a
// field: `legs[2].joints.femur.minDeg` / `must be below the maximum (got 40 ≥ 30)`.
// Given the names of the fields, each message starts with the field's name
// ("Leg LR, femur minimum must be below …") and the issue carries it as `field`;
// the path stays beside it for programs.
import type { z } from "zod";

export type DefinitionIssue = {
  /** Where, for programs: `legs[2].joints.femur.minDeg`; the document itself is the empty path. */
  path: string;
  /** What is wrong, a sentence for people; it starts with `field` when there is one. */
  message: string;
  /** The field's name for people ("Leg LR, femur minimum"), when the format names its fields. */
  field?: string;
};

/** What is wrong, without the field's name: for a place that names the field already (beside its input). */
export function issueProblem(issue: DefinitionIssue): string {
  return issue.field && issue.message.startsWith(`${issue.field} `) ? issue.message.slice(issue.field.length + 1) : issue.message;
}

/** The name people read for the field at a path. */
export type FieldNamer = (path: readonly PropertyKey[]) => string;

type ZodIssue = z.core.$ZodIssue;

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

/** `["legs", 2, "joints"]` → `legs[2].joints`; the document itself is the empty path. */
export function formatPath(path: readonly PropertyKey[]): string {
  let text = "";
  for (const key of path) {
    if (typeof key === "number") text += `[${key}]`;
    else if (typeof key === "string" && IDENTIFIER.test(key)) text += text === "" ? key : `.${key}`;
    else text += `[${JSON.stringify(String(key))}]`;
  }
  return text;
}

/** How a received value is quoted after "got". */
export function describeValue(value: unknown): string {
  if (value === undefined) return "nothing";
  if (value === null) return "null";
  if (Array.isArray(value)) return "an array";
  if (typeof value === "string") return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (typeof value === "object") return "an object";
  return String(value);
}

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

function messageOf(issue: ZodIssue): string {
  const got = describeValue(issue.input);
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined) return "is required";
      return `must be ${EXPECTED_WORDS[issue.expected] ?? issue.expected} (got ${got})`;
    case "too_small": {
      const minimum = Number(issue.minimum);
      if (issue.origin === "array") return `must have at least ${minimum} items (got ${(issue.input as unknown[] | undefined)?.length ?? "fewer"})`;
      if (issue.origin === "string") return minimum <= 1 ? "must not be empty" : `must be at least ${minimum} characters long`;
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
    case "invalid_format":
      return issue.message && !issue.message.startsWith("Invalid") ? issue.message : `has the wrong form (got ${got})`;
    default:
      return issue.message;
  }
}

/** Flattens zod issues; an unknown key becomes one issue at the key's own path. With `nameOf`, each message starts with its field's name. */
export function formatIssues(issues: readonly ZodIssue[], nameOf?: FieldNamer): DefinitionIssue[] {
  const out: DefinitionIssue[] = [];
  const add = (path: readonly PropertyKey[], message: string) => {
    if (!nameOf) {
      out.push({ path: formatPath(path), message });
      return;
    }
    const field = nameOf(path);
    out.push({ path: formatPath(path), field, message: `${field} ${message}` });
  };
  for (const issue of issues) {
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) add([...issue.path, key], "is not a known field (check the spelling)");
    } else {
      add(issue.path, messageOf(issue));
    }
  }
  return out;
}
