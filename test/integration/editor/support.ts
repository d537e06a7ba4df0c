// What the editor's integration tests alone use.
import { parseSequence, type Sequence } from "~/gait";

/**
 * A stored sequence (a gait's `draftSequence`, JSON and so `unknown` to Drizzle)
 * read as the app reads it; one that does not parse fails the test with its issues.
 */
export function sequenceOf(json: unknown): Sequence {
  const parsed = parseSequence(json);
  if (!parsed.ok) throw new Error(`the sequence does not parse: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.sequence;
}
