import { describe, expect, it } from "vitest";
import { angleTable, angleTableMetadata, buildAngleTable, TABLE_FORMATS, type TableExportError } from "~/export/index";
import { OVERRIDE, codeOf, demoGait, metaFor, readCsv, readJsonTable } from "./helpers";

// DESIGN.md / issue 8: a version with error-severity flags exports only with an override reason, written into the header.
describe("override reason for versions with error flags (DESIGN.md, issue 8)", () => {
  const faulty = demoGait("pier-crawler", { template: "wave", cycleMs: 1200, fps: 50, strideMm: 200, stepHeightMm: 60, name: "Long wave" });
  const clean = demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" });

  it("the faulty walk really has error flags (unreachable, joint-limit, joint-speed, pulse-range)", () => {
    expect(faulty.solved.summary.errors).toBeGreaterThan(0);
    expect(Object.keys(faulty.solved.summary.flagsByKind)).toEqual(expect.arrayContaining(["unreachable", "joint-speed", "pulse-range"]));
  });

  for (const format of TABLE_FORMATS) {
    it(`${format}: refused without a reason (code override-required, naming the error count), also for a blank reason`, () => {
      for (const overrideReason of [undefined, "", "   \n "]) {
        const run = () => angleTable(faulty.robot, faulty.solved, { format, units: "deg", meta: metaFor(faulty), overrideReason });
        expect(codeOf(run), `reason ${JSON.stringify(overrideReason)}`).toBe("override-required");
        expect(run).toThrow(new RegExp(`has ${faulty.solved.summary.errors} error flags`));
      }
    });
  }

  it("with a reason: the JSON meta, the C header comment and the CSV download's metadata carry it", () => {
    const options = { units: "deg" as const, meta: metaFor(faulty), overrideReason: `  ${OVERRIDE}  ` };
    const json = readJsonTable(angleTable(faulty.robot, faulty.solved, { ...options, format: "json" }));
    expect(json.meta.overrideReason).toBe(OVERRIDE);
    expect(json.meta.flags.errors).toBe(faulty.solved.summary.errors);
    expect(json.meta.flags.byKind).toEqual(faulty.solved.summary.flagsByKind);
    const c = angleTable(faulty.robot, faulty.solved, { ...options, format: "c" });
    expect(c.slice(0, c.indexOf("*/"))).toContain(` * Override:     ${OVERRIDE}\n`);
    expect(angleTableMetadata(faulty.robot, faulty.solved, options).overrideReason).toBe(OVERRIDE);
    // RFC 4180 has no comments: the CSV stays pure data, its metadata comes from angleTableMetadata.
    const csv = readCsv(angleTable(faulty.robot, faulty.solved, { ...options, format: "csv" }));
    expect(csv.length).toBe(faulty.solved.frames.length + 1);
  });

  it("a clean version needs no reason and records none; buildAngleTable asks for one when a new rate brings errors", () => {
    const json = readJsonTable(angleTable(clean.robot, clean.solved, { format: "json", units: "us", meta: metaFor(clean) }));
    expect(json.meta.overrideReason).toBeNull();
    expect(json.meta.flags).toEqual({ errors: 0, warnings: 0, byKind: {} });
    const c = angleTable(clean.robot, clean.solved, { format: "c", units: "us", meta: metaFor(clean) });
    expect(c).toContain(" * Override:     none\n");
    // Fewer frames a cycle: bigger steps between frames, so joints turn too fast.
    expect(codeOf(() => buildAngleTable(faulty.robot, faulty.sequence, { format: "json", units: "deg", rateHz: 10, meta: metaFor(faulty) }))).toBe(
      "override-required",
    );
  });

  it("metadata has no timestamp unless given, so the same inputs give the same bytes (reproducible release)", () => {
    const options = { format: "json" as const, units: "rad" as const, meta: metaFor(clean) };
    expect(angleTable(clean.robot, clean.solved, options)).toBe(angleTable(clean.robot, clean.solved, options));
    expect(readJsonTable(angleTable(clean.robot, clean.solved, options)).meta.exportedAt).toBeNull();
    const stamped = readJsonTable(
      angleTable(clean.robot, clean.solved, { ...options, meta: metaFor(clean, { exportedAt: "2025-03-01T10:00:00Z", solverVersion: "gait 1" }) }),
    );
    expect(stamped.meta.exportedAt).toBe("2025-03-01T10:00:00Z");
    expect(stamped.meta.solverVersion).toBe("gait 1");
    expect(stamped.meta.exporterVersion).toBe("2.0.0");
    expect(codeOf(() => angleTable(clean.robot, clean.solved, { ...options, meta: metaFor(clean, { exporterVersion: "0.9.0" }) }))).toBe("exporter-version");
  });

  it("options are validated with path and message", () => {
    const run = () => angleTable(clean.robot, clean.solved, { format: "json", units: "furlong" as never, meta: { ...metaFor(clean), robotName: "" } });
    expect(codeOf(run)).toBe("invalid-options");
    try {
      run();
    } catch (error) {
      const issues = (error as TableExportError).issues;
      expect(issues).toEqual(
        expect.arrayContaining([
          { path: "units", message: expect.stringContaining('must be one of "deg", "rad", "us"') },
          { path: "meta.robotName", message: "must not be empty" },
        ]),
      );
    }
    expect(codeOf(() => angleTable(clean.robot, clean.solved, { format: "xml" as never, units: "deg", meta: metaFor(clean) }))).toBe("invalid-options");
  });
});
