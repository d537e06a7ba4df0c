import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";

// com-outside (error) and low-margin (warning below the user's threshold), on
// the four-legged crawl, whose margin (McGhee and Frank 1968) dips below zero
// at the diagonal-support moments when the body does not sway.
describe("com-outside and low-margin on the four-legged crawl", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.four);
  const sequence = generateGait(robot, { template: "wave", strideMm: 40, cycleMs: 2400, fps: 50 });

  for (const threshold of [10, 30]) {
    it(`threshold ${threshold} mm: com-outside where the margin is negative, low-margin where it is in [0, ${threshold})`, () => {
      const solved = solveSequence(robot, sequence, { marginThresholdMm: threshold });
      const margins = solved.frames.map((frame) => frame.marginMm);
      const outside = margins.flatMap((margin, frame) => (margin !== null && margin < 0 ? [frame] : []));
      const low = margins.flatMap((margin, frame) => (margin !== null && margin >= 0 && margin < threshold ? [frame] : []));
      expect(outside.length).toBeGreaterThan(0);
      const flags = (kind: string) => solved.flags.filter((flag) => flag.kind === kind);
      expect(flags("com-outside").map((flag) => flag.frame)).toEqual(outside);
      expect(flags("low-margin").map((flag) => flag.frame)).toEqual(low);
      expect(new Set(flags("com-outside").map((flag) => flag.severity))).toEqual(new Set(["error"]));
      expect(new Set(flags("low-margin").map((flag) => flag.severity))).toEqual(new Set(low.length ? ["warning"] : []));
      const first = flags("com-outside")[0];
      expect(first.message).toBe(`CoM ${(-first.value).toFixed(1)} mm outside the support polygon at frame ${first.frame}`);
      if (low.length) {
        const warning = flags("low-margin")[0];
        expect(warning.message).toBe(`stability margin ${warning.value.toFixed(1)} mm at frame ${warning.frame}, below ${threshold.toFixed(1)} mm`);
      }
      expect(solved.summary.worstMarginMm).toBe(Math.min(...margins.filter((m): m is number => m !== null)));
      expect(solved.frames[solved.summary.worstMarginFrame!].marginMm).toBe(solved.summary.worstMarginMm);
    });
  }

  it("runs only the checks asked for", () => {
    const solved = solveSequence(robot, sequence, { checks: ["low-margin"] });
    expect(new Set(solved.flags.map((flag) => flag.kind))).toEqual(new Set(["low-margin"]));
  });
});
