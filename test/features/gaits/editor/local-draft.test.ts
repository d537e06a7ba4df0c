// @vitest-environment jsdom
// The browser copy of the draft: offered back only when it never reached the
// server and differs from what the server holds.
import { afterEach, expect, test } from "vitest";
import { clearLocalDraft, markLocalDraftSynced, pendingLocalDraft, readLocalDraft, writeLocalDraft } from "~/features/gaits/editor/local-draft";
import { tripod } from "../../../support/editor";

afterEach(() => window.localStorage.clear());

test("unsynced and different: offered; synced or the same: not; cleared: gone", () => {
  const server = tripod();
  const mine = tripod({ strideMm: 55 });
  writeLocalDraft("g1", { sequence: mine, baseRevision: 4, savedAt: 1000, synced: false });
  expect(pendingLocalDraft("g1", server)?.baseRevision).toBe(4);
  expect(pendingLocalDraft("g1", mine)).toBeNull();
  markLocalDraftSynced("g1", 5);
  expect(readLocalDraft("g1")).toMatchObject({ synced: true, baseRevision: 5 });
  expect(pendingLocalDraft("g1", server)).toBeNull();
  clearLocalDraft("g1");
  expect(readLocalDraft("g1")).toBeNull();
});

test("a broken entry reads as none", () => {
  window.localStorage.setItem("gaitloom:draft:g2", "{not json");
  expect(readLocalDraft("g2")).toBeNull();
});
