import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { metricDeltas, peakJointSpeed, type MetricSummary } from "~/features/compare";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";

const base: MetricSummary = {
  cycleMs: 1200,
  strideMm: 40,
  bodySpeedMmS: 33.3,
  worstMarginMm: 60,
  peakSpeedDegS: { LF: { coxa: 40, femur: 90, tibia: 70 }, RF: { coxa: 45, femur: 80, tibia: 120 } },
  speedHeadroom: 2.5,
  errors: 0,
  warnings: 2,
  flagsByKind: { "low-margin": 2 },
};

const byId = (rows: ReturnType<typeof metricDeltas>) => Object.fromEntries(rows.map((row) => [row.id, row]));

describe("metricDeltas", () => {
  it("gives each metric's value on both sides and the change B − A", () => {
    const rows = byId(metricDeltas(base, { ...base, cycleMs: 1000, strideMm: 55, bodySpeedMmS: 55, worstMarginMm: 52.5 }));
    expect(rows.cycleMs).toMatchObject({ a: 1200, b: 1000, delta: -200, better: null });
    expect(rows.strideMm).toMatchObject({ a: 40, b: 55, delta: 15, better: null });
    expect(rows.bodySpeedMmS.delta).toBeCloseTo(21.7, 6);
    expect(rows.worstMarginMm).toMatchObject({ delta: -7.5, better: "a" });
  });

  it("takes the peak joint speed over every leg and joint, and says where it is", () => {
    expect(peakJointSpeed(base.peakSpeedDegS)).toEqual({ degS: 120, legId: "RF", joint: "tibia" });
    const rows = byId(metricDeltas(base, { ...base, peakSpeedDegS: { LF: { coxa: 40, femur: 150, tibia: 70 } } }));
    expect(rows.peakJointSpeedDegS).toMatchObject({ a: 120, b: 150, delta: 30, better: "a", whereA: "RF tibia", whereB: "LF femur" });
    expect(rows["peakSpeedDegS.femur"]).toMatchObject({ a: 90, b: 150, whereB: "LF" });
    expect(rows["peakSpeedDegS.tibia"]).toMatchObject({ a: 120, b: 70, better: "b" });
  });

  it("lists the flag kinds either side has, fewer being better, and leaves out kinds neither has", () => {
    const rows = byId(metricDeltas(base, { ...base, errors: 3, warnings: 0, flagsByKind: { "joint-speed": 3 } }));
    expect(rows["flags.low-margin"]).toMatchObject({ a: 2, b: 0, delta: -2, better: "b" });
    expect(rows["flags.joint-speed"]).toMatchObject({ a: 0, b: 3, better: "a" });
    expect(rows.errors).toMatchObject({ a: 0, b: 3, better: "a" });
    expect(rows["flags.foot-slip"]).toBeUndefined();
  });

  it("has no delta where a side has no value (fewer than three feet down: no margin)", () => {
    const rows = byId(metricDeltas(base, { ...base, worstMarginMm: null }));
    expect(rows.worstMarginMm).toMatchObject({ a: 60, b: null, delta: null, better: null });
  });

  it("calls equal values neither better", () => {
    expect(metricDeltas(base, base).every((row) => row.better === null && (row.delta === null || row.delta === 0))).toBe(true);
  });

  it("agrees with the solver's summaries of two demo trots (the faster one has the faster joints)", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.four);
    const slow = generateGait(robot, { template: "trot", cycleMs: 800, strideMm: 40, stepHeightMm: 25 });
    const fast = generateGait(robot, { template: "trot", cycleMs: 700, strideMm: 45, stepHeightMm: 28 });
    const a = { ...solveSequence(robot, slow).summary, cycleMs: slow.cycleMs };
    const b = { ...solveSequence(robot, fast).summary, cycleMs: fast.cycleMs };
    const rows = byId(metricDeltas(a, b));
    expect(rows.cycleMs.delta).toBe(-100);
    expect(rows.strideMm.delta).toBeCloseTo(5, 9);
    expect(rows.bodySpeedMmS.delta).toBeCloseTo(45 / 0.7 - 40 / 0.8, 6);
    expect(rows.peakJointSpeedDegS.delta!).toBeGreaterThan(0);
    expect(rows["flags.support-count"]).toBeDefined();
  });
});
