// @vitest-environment jsdom
// A released version's table beside its release record: the same bytes, or
// which change since the release made them differ.
import { cleanup, render, screen } from "@testing-library/react";
import { afterEach, expect, test } from "vitest";
import { ReleaseTableCheck, type ReleaseTableCheckData } from "~/components/export/ReleaseTableCheck";

afterEach(cleanup);

const check = (change: Partial<ReleaseTableCheckData>): ReleaseTableCheckData => ({
  recorded: {
    sha256: "a".repeat(64),
    exporterVersion: "1.0.0",
    solverVersion: "1.0.0",
    tableFormat: "format=csv&units=deg",
    createdAt: "2026-12-01T10:00:00Z",
  },
  today: { sha256: "b".repeat(64), exporterVersion: "2.0.0", solverVersion: "1.0.0", problem: null },
  matches: false,
  reasons: ["the exporter changed from 1.0.0 to 2.0.0"],
  downloadPath: "/api/v1/gaits/g/versions/1/table?format=csv&units=deg",
  ...change,
});

test("differs: says so, names what changed, and shows both hashes", () => {
  render(<ReleaseTableCheck check={check({})} />);
  const status = screen.getByTestId("release-table-differs");
  expect(status.textContent).toContain("Today's table differs from the one recorded at the release.");
  expect(status.textContent).toContain("Since the release, the exporter changed from 1.0.0 to 2.0.0, so the same query now gives other bytes.");
  expect(screen.getByTitle("a".repeat(64)).textContent).toBe("aaaaaaaaaaaa");
  expect(screen.getByTitle("b".repeat(64)).textContent).toBe("bbbbbbbbbbbb");
  expect(screen.getByRole("link", { name: "Download today's table" }).getAttribute("href")).toBe("/api/v1/gaits/g/versions/1/table?format=csv&units=deg");
});

test("matches: one quiet line, no warning; no download link for those who may not download", () => {
  render(<ReleaseTableCheck check={check({ matches: true, reasons: [], downloadPath: null, today: { ...check({}).today, sha256: "a".repeat(64) } })} />);
  expect(screen.queryByTestId("release-table-differs")).toBeNull();
  expect(screen.getByText("Today's table is the one recorded at the release, byte for byte.")).toBeTruthy();
  expect(screen.queryByRole("link")).toBeNull();
});

test("a table that cannot be made today says why", () => {
  render(<ReleaseTableCheck check={check({ today: { ...check({}).today, sha256: null, problem: "Version 1 cannot be solved." } })} />);
  expect(screen.getByTestId("release-table-differs").textContent).toContain("It cannot be made again today: Version 1 cannot be solved.");
});
