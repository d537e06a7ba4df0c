// The worker pool runs the core's heavy work on worker threads; what comes
// back must be the very bytes the same work makes in-process.
import { afterAll, describe, expect, test } from "vitest";
import { angleTableData, formatAngleTable, solveForTable, type TableFormat } from "~/export";
import { generateGait } from "~/gait";
import { importUrdf } from "~/kinematics";
import { closeCorePool, corePoolStats, runCoreTask } from "~/platform/worker-pool.server";
import { CORE_TASKS, type VersionTableTask } from "~/workers/core-tasks";
import { fixtureText, loadDemoRobot } from "../support/robots";

afterAll(() => closeCorePool());

const robot = loadDemoRobot("pier-crawler");
// A stride long enough to raise flags, so the flags are compared too.
const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 400 });

const same = (a: Uint8Array, b: Uint8Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength).equals(Buffer.from(b.buffer, b.byteOffset, b.byteLength));

describe("runCoreTask", () => {
  test.each(["frames", "columns", "checks"] as const)("a solve in the %s layout: the same bytes from a worker thread as in-process", async (layout) => {
    const input = { robot, sequence, options: {}, layout, maxFlags: 100_000 };
    const pooled = await runCoreTask("solve", input);
    const inProcess = CORE_TASKS.solve(input);
    if (!pooled.ok || !inProcess.ok) throw new Error("expected both solves to answer");
    expect(pooled.answer.byteLength).toBeGreaterThan(0);
    expect(same(pooled.answer, inProcess.answer)).toBe(true);
    expect(corePoolStats().pooled).toBe(true);
  });

  test.each(["csv", "c"] as const)(
    "a version table as %s: the same bytes and hash from a worker thread as the exporter makes in-process",
    async (format: TableFormat) => {
      const table = {
        units: "deg" as const,
        meta: { robotName: robot.name, robotRevision: 3, gaitName: "Tripod", gaitVersion: 2, contentHash: "abc123", loop: sequence.loop },
        overrideReason: "bench test",
      };
      const input: VersionTableTask = { robot, sequence, rateHz: 100, format, table };
      const pooled = await runCoreTask("versionTable", input);
      if (!pooled.ok) throw new Error(`expected a table, got ${pooled.refusal.message}`);
      const expected = formatAngleTable(angleTableData(robot, solveForTable(robot, sequence, 100), table), format);
      expect(same(pooled.table.body, new TextEncoder().encode(expected))).toBe(true);
      const inProcess = CORE_TASKS.versionTable(input);
      if (!inProcess.ok) throw new Error("expected a table in-process too");
      expect(pooled.table.sha256).toBe(inProcess.table.sha256);
      expect(Array.from(pooled.table.data.values)).toEqual(Array.from(inProcess.table.data.values));
    },
  );

  test("a table that needs an override comes back as the exporter's refusal, with the error flags counted", async () => {
    const table = { units: "deg" as const, meta: { robotName: robot.name, robotRevision: 3, gaitName: "Tripod", gaitVersion: 2, contentHash: "abc123" } };
    const pooled = await runCoreTask("versionTable", { robot, sequence, rateHz: 50, format: "csv", table });
    expect(pooled.ok).toBe(false);
    if (pooled.ok) return;
    expect(pooled.refusal).toMatchObject({ kind: "table-export", code: "override-required" });
    expect(Object.values(pooled.errorFlags).reduce((sum, count) => sum + count, 0)).toBeGreaterThan(0);
  });

  test("a URDF import: the same robot and report from a worker thread as in-process", async () => {
    const xml = fixtureText("test-crab.urdf");
    expect(await runCoreTask("urdf", { xml, options: { name: "Crab" } })).toEqual(importUrdf(xml, { name: "Crab" }));
  });
});
