// A version's content hash: SHA-256 of canonical JSON (keys sorted, no
// spaces) of what it plays — the sequence and the robot definition it was
// solved with — so equal content always hashes equal.
import { createHash } from "node:crypto";

export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value);
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, entry]) => entry !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([key, entry]) => `${JSON.stringify(key)}:${canonicalJson(entry)}`).join(",")}}`;
}

export function versionContentHash(sequence: unknown, robotDefinition: unknown): string {
  return createHash("sha256")
    .update(canonicalJson({ format: "gaitloom.version/1", sequence, robot: robotDefinition }))
    .digest("hex");
}
