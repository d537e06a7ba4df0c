import { describe, expect, it } from "vitest";
import { angleTable, buildAngleTable, TableExportError } from "~/export/index";
import { solveSequence } from "~/gait/index";
import { generateEntryMove } from "~/gait/moves";
import { demoGait, metaFor, readJsonTable } from "./helpers";

// DESIGN.md ("Gait sequence", "Core module contracts"): frames at i/fps s, N = round(cycleMs · fps / 1000);
// another rate re-solves the sequence at that rate and never interpolates angles.
describe("another rate re-solves (DESIGN.md: N = round(cycleMs · rate / 1000), no interpolation)", () => {
  const gait = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });

  for (const rateHz of [40, 30, 24, 60, 100]) {
    it(`${rateHz} Hz from a 50 fps walk: round(1200 · ${rateHz} / 1000) frames, each value a fresh solve at ${rateHz} Hz`, () => {
      const table = readJsonTable(buildAngleTable(gait.robot, gait.sequence, { format: "json", units: "deg", rateHz, meta: metaFor(gait) }));
      const expectedFrames = Math.round((1200 * rateHz) / 1000);
      expect(table.frames.length, `frames: expected ${expectedFrames}, got ${table.frames.length}`).toBe(expectedFrames);
      expect(table.meta.rateHz).toBe(rateHz);
      expect(table.meta.framePeriodMs, "frame period, whole µs").toBe(Math.round(1e6 / rateHz) / 1000);
      table.frames.forEach((frame, i) =>
        expect(frame.timeMs, `frame ${i}: expected ${Math.round((i * 1e6) / rateHz) / 1000} ms`).toBe(Math.round((i * 1e6) / rateHz) / 1000),
      );
      const fresh = solveSequence(gait.robot, gait.sequence, { fps: rateHz });
      const expected = readJsonTable(angleTable(gait.robot, fresh, { format: "json", units: "deg", meta: metaFor(gait, { loop: true }) }));
      expect(table.frames, "cells equal a fresh solve at the rate").toEqual(expected.frames);
    });
  }

  it("the resampled table is not a linear interpolation of the 50 fps table", () => {
    const base = readJsonTable(buildAngleTable(gait.robot, gait.sequence, { format: "json", units: "deg", meta: metaFor(gait) }));
    const resampled = readJsonTable(buildAngleTable(gait.robot, gait.sequence, { format: "json", units: "deg", rateHz: 30, meta: metaFor(gait) }));
    let largestGap = 0;
    resampled.frames.forEach((frame) => {
      // Frame i at 30 Hz sits at 50 · i / 30 of the 50 fps frames.
      const position = (frame.index * 50) / 30;
      const below = Math.floor(position);
      const fraction = position - below;
      const a = base.frames[below % base.frames.length].values;
      const b = base.frames[(below + 1) % base.frames.length].values;
      frame.values.forEach((value, c) => (largestGap = Math.max(largestGap, Math.abs(value - (a[c] + (b[c] - a[c]) * fraction)))));
    });
    expect(largestGap, `largest difference from interpolating the 50 fps table: ${largestGap}°`).toBeGreaterThan(0.1);
  });

  it("a one-shot move has round(cycleMs · rate / 1000) + 1 frames at the new rate", () => {
    const entry = generateEntryMove(gait.robot, gait.sequence);
    expect(entry.loop).toBe(false);
    const rateHz = 25;
    const table = readJsonTable(
      buildAngleTable(gait.robot, entry, { format: "json", units: "us", rateHz, meta: metaFor(gait, { gaitName: "Entry" }), overrideReason: "reviewed" }),
    );
    expect(table.frames.length).toBe(Math.round((entry.cycleMs * rateHz) / 1000) + 1);
    expect(table.meta.gait.loop, "meta.loop from the sequence").toBe(false);
  });

  it("angleTable refuses another rate than the result's own (it cannot re-solve what it was not given) and accepts its own", () => {
    const attempt = () => angleTable(gait.robot, gait.solved, { format: "csv", units: "deg", rateHz: 40, meta: metaFor(gait) });
    expect(attempt).toThrow(TableExportError);
    try {
      attempt();
    } catch (error) {
      expect((error as TableExportError).code).toBe("rate-mismatch");
      expect((error as Error).message).toContain("solved at 50 Hz, not 40 Hz");
    }
    expect(() => angleTable(gait.robot, gait.solved, { format: "csv", units: "deg", rateHz: 50, meta: metaFor(gait) })).not.toThrow();
  });
});
