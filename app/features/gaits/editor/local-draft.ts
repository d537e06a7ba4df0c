// A copy of the draft in this browser's localStorage, written on every edit,
// so a lost connection or a closed tab loses nothing: on the next visit the
// editor offers it back when it never reached the server.
import type { Sequence } from "../../../gait/index";

export type LocalDraft = {
  sequence: Sequence;
  /** The server revision the edits started from. */
  baseRevision: number;
  /** When the copy was written, ms since the epoch. */
  savedAt: number;
  /** True once the server holds this very sequence. */
  synced: boolean;
};

const keyOf = (gaitId: string) => `gaitloom:draft:${gaitId}`;

function storage(): Storage | null {
  try {
    return typeof window === "undefined" ? null : window.localStorage;
  } catch {
    return null;
  }
}

export function readLocalDraft(gaitId: string): LocalDraft | null {
  const text = storage()?.getItem(keyOf(gaitId));
  if (!text) return null;
  try {
    const value = JSON.parse(text) as LocalDraft;
    return value && typeof value === "object" && value.sequence && typeof value.savedAt === "number" ? value : null;
  } catch {
    return null;
  }
}

export function writeLocalDraft(gaitId: string, draft: LocalDraft): void {
  try {
    storage()?.setItem(keyOf(gaitId), JSON.stringify(draft));
  } catch {
    // Storage full or refused (private mode): the server copy is all there is, as without this mirror.
  }
}

export function markLocalDraftSynced(gaitId: string, revision: number): void {
  const draft = readLocalDraft(gaitId);
  if (draft) writeLocalDraft(gaitId, { ...draft, synced: true, baseRevision: revision });
}

export function clearLocalDraft(gaitId: string): void {
  storage()?.removeItem(keyOf(gaitId));
}

/** Unsynced local edits that differ from what the server holds, or null. */
export function pendingLocalDraft(gaitId: string, server: Sequence): LocalDraft | null {
  const local = readLocalDraft(gaitId);
  if (!local || local.synced) return null;
  return JSON.stringify(local.sequence) === JSON.stringify(server) ? null : local;
}
