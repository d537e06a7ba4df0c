import { describe, expect, it } from "vitest";
import { generateGait, solveSequence, type SolvedFrame } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot, type DemoRobotFile } from "../support/robots";
import { cycleFraction } from "./helpers";

// M. Hildebrand, "Symmetrical gaits of horses", Science 150 (1965): a gait
// diagram has one row per foot with a bar while the foot is on the ground; a
// symmetrical gait is given by the duty factor (bar length, % of the stride)
// and the lag of each forefoot's footfall behind the hindfoot's on the same
// side (% of the stride), the left and right feet half a stride apart. The
// lateral-sequence walk (our four-legged wave, the crawl) has a lag of 25%, the
// trot 50% (diagonal feet together).

type Bar = { startFrame: number; frames: number };

/** Stance bars of one leg over a looping cycle, read off the solved frames. */
function stanceBars(frames: readonly SolvedFrame[], legId: string): Bar[] {
  const down = frames.map((frame) => frame.legs[legId].contact === "stance");
  const count = down.length;
  const bars: Bar[] = [];
  for (let i = 0; i < count; i += 1) {
    if (!down[i] || down[(i - 1 + count) % count]) continue;
    let length = 0;
    while (length < count && down[(i + length) % count]) length += 1;
    bars.push({ startFrame: i, frames: length });
  }
  return bars;
}

function diagram(file: DemoRobotFile, template: "wave" | "trot", cycleMs: number) {
  const robot = loadDemoRobot(file);
  const frames = solveSequence(robot, generateGait(robot, { template, cycleMs, fps: 50, strideMm: 30 }), { checks: [] }).frames;
  const bars = Object.fromEntries(["LF", "LR", "RF", "RR"].map((legId) => [legId, stanceBars(frames, legId)]));
  return { bars, count: frames.length };
}

describe("gait diagrams (Hildebrand 1965, Symmetrical gaits of horses)", () => {
  for (const [template, cycleMs, dutyPercent, lagPercent] of [
    ["wave", 2000, 75, 25],
    ["trot", 1000, 50, 50],
  ] as const) {
    it(`${template}: one stance bar a foot, ${dutyPercent}% of the stride; forefoot lands ${lagPercent}% after the hindfoot of its side; sides half a stride apart`, () => {
      const { bars, count } = diagram(DEMO_ROBOTS.four, template, cycleMs);
      for (const [legId, legBars] of Object.entries(bars)) {
        expect(legBars.length, `${legId}: bars per cycle`).toBe(1);
        expect((100 * legBars[0].frames) / count, `${legId}: duty factor in %`).toBeCloseTo(dutyPercent, 9);
      }
      const footfall = (legId: string): number => bars[legId][0].startFrame / count;
      for (const [fore, hind] of [
        ["LF", "LR"],
        ["RF", "RR"],
      ]) {
        const lag = 100 * cycleFraction(footfall(fore) - footfall(hind));
        expect(lag, `${fore} after ${hind}: lag in % of the stride, expected ${lagPercent}, got ${lag}`).toBeCloseTo(lagPercent, 9);
      }
      expect(100 * cycleFraction(footfall("RR") - footfall("LR")), "right hind after left hind, %").toBeCloseTo(50, 9);
    });
  }
});
