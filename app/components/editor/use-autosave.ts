// Autosave: once edits pause (and no drag is in progress) the draft goes to
// PUT /api/v1/gaits/:gaitId/draft with the revision it started from. Every
// edit is also mirrored to localStorage first, so nothing is lost offline.
// A 409 stops saving until the person chooses (reload theirs, or keep mine
// as a copy); a lost connection retries with a growing pause.
import { useEffect } from "react";
import { markLocalDraftSynced, writeLocalDraft } from "~/features/gaits/editor/local-draft";
import { useEditorStore } from "~/stores/editor-context";

export const AUTOSAVE_DELAY_MS = 800;
const RETRY_FIRST_MS = 2000;
const RETRY_MOST_MS = 30_000;

export type DraftError = { error?: { code?: string; message?: string; details?: unknown } } | null;

export function draftUrl(gaitId: string) {
  return `/api/v1/gaits/${gaitId}/draft`;
}

export function useAutosave(gaitId: string) {
  const store = useEditorStore();
  useEffect(() => {
    if (store.getState().readOnly) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    let inFlight = false;
    let retryMs = RETRY_FIRST_MS;
    let disposed = false;

    const schedule = (ms: number) => {
      clearTimeout(timer);
      timer = setTimeout(save, ms);
    };

    async function save() {
      const state = store.getState();
      if (disposed || inFlight || state.gesture || state.saveStatus === "conflict") return;
      if (state.sequenceVersion === state.savedVersion) return;
      inFlight = true;
      const version = state.sequenceVersion;
      state.markSaving();
      try {
        const response = await fetch(draftUrl(gaitId), {
          method: "PUT",
          headers: { "Content-Type": "application/json", Accept: "application/json" },
          body: JSON.stringify({ sequence: state.sequence, baseRevision: state.revision }),
        });
        const body = (await response.json().catch(() => null)) as (DraftError & { revision?: number }) | null;
        const after = store.getState();
        if (response.ok && typeof body?.revision === "number") {
          retryMs = RETRY_FIRST_MS;
          after.markSaved(version, body.revision);
          if (after.sequenceVersion === version) markLocalDraftSynced(gaitId, body.revision);
        } else if (response.status === 409) {
          const details = (body?.error?.details ?? {}) as { currentRevision?: number; updatedBy?: { login: string; name: string } | null; updatedAt?: string };
          after.markConflict({
            message: body?.error?.message ?? "Someone saved the draft while you were editing.",
            currentRevision: details.currentRevision ?? after.revision,
            updatedBy: details.updatedBy ?? null,
            updatedAt: details.updatedAt ?? new Date().toISOString(),
          });
        } else if (response.status === 422 || response.status === 403 || response.status === 404) {
          const issues = Array.isArray(body?.error?.details) ? (body!.error!.details as { path: string; message: string }[]) : [];
          after.markInvalid(
            `${body?.error?.message ?? `The server refused the draft (${response.status}).`}${
              issues.length
                ? ` ${issues
                    .slice(0, 3)
                    .map((issue) => `${issue.path}: ${issue.message}`)
                    .join("; ")}`
                : ""
            } It is kept in this browser.`,
          );
        } else {
          throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
        }
      } catch (error) {
        store
          .getState()
          .markOffline(
            `Not saved yet (${error instanceof Error ? error.message : "no connection"}); kept in this browser and tried again in ${Math.round(retryMs / 1000)} s.`,
          );
        schedule(retryMs);
        retryMs = Math.min(RETRY_MOST_MS, retryMs * 2);
      } finally {
        inFlight = false;
        const now = store.getState();
        if (!disposed && now.saveStatus === "pending") schedule(AUTOSAVE_DELAY_MS);
      }
    }

    const unsubscribe = store.subscribe((state, previous) => {
      if (state.sequenceVersion !== previous.sequenceVersion) {
        writeLocalDraft(gaitId, { sequence: state.sequence, baseRevision: state.revision, savedAt: Date.now(), synced: false });
        if (!state.gesture) schedule(AUTOSAVE_DELAY_MS);
      }
      if (previous.gesture && !state.gesture) schedule(AUTOSAVE_DELAY_MS);
      if (previous.conflict && !state.conflict && state.saveStatus === "pending") schedule(0);
    });
    // A closing tab gets one last try; the local copy covers the rest.
    const onHide = () => {
      const state = store.getState();
      // Offline, the request would fail too; in a conflict it would be refused. The local copy has it either way.
      if (state.sequenceVersion === state.savedVersion || state.saveStatus === "conflict" || state.saveStatus === "offline") return;
      const body = JSON.stringify({ sequence: state.sequence, baseRevision: state.revision });
      if (body.length < 60_000)
        fetch(draftUrl(gaitId), { method: "PUT", headers: { "Content-Type": "application/json" }, body, keepalive: true }).catch(() => {});
    };
    window.addEventListener("pagehide", onHide);
    return () => {
      disposed = true;
      clearTimeout(timer);
      unsubscribe();
      window.removeEventListener("pagehide", onHide);
    };
  }, [store, gaitId]);
}
