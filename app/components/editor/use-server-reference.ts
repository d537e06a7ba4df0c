// The server's solve of the sequence (POST /api/v1/solve), the reference the
// Checks list shows: asked for through react-query once edits pause, so a
// drag does not send a request per move. The browser preview stays the
// instant answer; this one confirms it with the server's copy of the engine.
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import type { Flag, Sequence, SolveSummary } from "~/gait";
import { useEditor, useEditorStore } from "~/stores/editor-context";

/** Edits pause this long before the server is asked. */
export const REFERENCE_DEBOUNCE_MS = 700;

export type Reference = { version: number; flags: Flag[]; summary: SolveSummary; solvedAt: number };

async function solveOnServer(robot: unknown, sequence: Sequence, version: number, signal: AbortSignal): Promise<Reference> {
  const response = await fetch("/api/v1/solve", {
    method: "POST",
    headers: { "Content-Type": "application/json", Accept: "application/json" },
    body: JSON.stringify({ robot, sequence, options: { layout: "checks" } }),
    signal,
  });
  const body = await response.json().catch(() => null);
  if (!response.ok) throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
  return { version, flags: body.flags, summary: body.summary, solvedAt: Date.now() };
}

export function useServerReference(gaitId: string) {
  const store = useEditorStore();
  const version = useEditor((state) => state.sequenceVersion);
  const solvable = useEditor((state) => state.preview !== null);
  const [asked, setAsked] = useState(() => ({ version: store.getState().sequenceVersion, sequence: store.getState().sequence }));
  useEffect(() => {
    if (version === asked.version) return;
    const timer = setTimeout(() => setAsked({ version, sequence: store.getState().sequence }), REFERENCE_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [version, asked.version, store]);
  const query = useQuery({
    queryKey: ["reference-solve", gaitId, asked.version],
    queryFn: ({ signal }) => solveOnServer(store.getState().robot, asked.sequence, asked.version, signal),
    enabled: solvable,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
    retry: 1,
    refetchOnWindowFocus: false,
  });
  return { ...query, current: query.data?.version === version };
}
