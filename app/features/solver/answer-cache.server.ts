// Solves are pure functions of their request, and the editor, reviewers and
// build scripts send the same robot and sequence again and again: keep the
// answer bytes of recent requests, keyed by a hash of the body bytes, so a
// repeat costs a hash and a write.
import { createHash } from "node:crypto";

const MAX_BYTES = 64 * 1024 * 1024;
const entries = new Map<string, Uint8Array<ArrayBuffer>>();
let totalBytes = 0;

export function bodyKey(text: string): string {
  return createHash("sha256").update(text).digest("base64url");
}

export function cachedAnswer(key: string): Uint8Array<ArrayBuffer> | undefined {
  const answer = entries.get(key);
  if (answer !== undefined) {
    // Most recently used last, so the oldest entries are dropped first.
    entries.delete(key);
    entries.set(key, answer);
  }
  return answer;
}

export function rememberAnswer(key: string, answer: Uint8Array<ArrayBuffer>): void {
  if (answer.byteLength > MAX_BYTES / 4) return;
  if (entries.has(key)) return;
  entries.set(key, answer);
  totalBytes += answer.byteLength;
  for (const [oldest, value] of entries) {
    if (totalBytes <= MAX_BYTES) break;
    entries.delete(oldest);
    totalBytes -= value.byteLength;
  }
}
