// Swing progress against the browser's own cubic-bezier: W3C CSS Easing
// Functions Level 1 as Chromium implements it, read through Web Animations
// (getComputedTiming().progress of an effect with that easing).
import { readFileSync } from "node:fs";
import { generateGait, solveSequence, type Ease, type Sequence } from "../app/gait/index";
import { parseRobot, type Robot } from "../app/kinematics/index";
import { expect, test } from "./support/test";

const robot = (() => {
  const parsed = parseRobot(JSON.parse(readFileSync(new URL("../db/demo/robots/pier-crawler.json", import.meta.url), "utf8")));
  if (!parsed.ok) throw new Error("demo robot invalid");
  return parsed.robot as Robot;
})();

/** For every frame inside LF's first swing: the plain time fraction s and how far along the step the foot is. */
function swingProgress(sequence: Sequence): { s: number; progress: number }[] {
  const solved = solveSequence(robot, sequence);
  const keys = sequence.legs.LF.keys;
  const lift = keys.find((key) => key.contact === "swing")!;
  const land = keys.find((key) => key.contact === "stance" && key.t > lift.t)!;
  const n = solved.frames.length;
  // Straight walking, no turn or body keys: the world foot is the body position plus the body-frame foot.
  const world = (i: number) => {
    const frame = solved.frames[i];
    return [frame.body.x + frame.legs.LF.foot[0], frame.body.y + frame.legs.LF.foot[1]];
  };
  const start = world(Math.round(lift.t * n));
  const end = world(Math.round(land.t * n) % n);
  const length = Math.hypot(end[0] - start[0], end[1] - start[1]);
  const samples: { s: number; progress: number }[] = [];
  for (let i = Math.ceil(lift.t * n) + 1; i < Math.floor(land.t * n); i++) {
    const [x, y] = world(i);
    samples.push({ s: (i / n - lift.t) / (land.t - lift.t), progress: Math.hypot(x - start[0], y - start[1]) / length });
  }
  return samples;
}

const curves: { name: string; ease: Ease }[] = [
  { name: "ease = cubic-bezier(0.25, 0.1, 0.25, 1)", ease: [0.25, 0.1, 0.25, 1] },
  { name: "a quick lift: cubic-bezier(0.1, 0.7, 0.3, 1)", ease: [0.1, 0.7, 0.3, 1] },
  { name: "a slow start: cubic-bezier(0.6, 0, 0.4, 1)", ease: [0.6, 0, 0.4, 1] },
];

for (const { name, ease } of curves) {
  test(`swing progress with ${name} matches Chromium's cubic-bezier to 1e-3`, async ({ page }) => {
    const sequence = generateGait(robot, { template: "tripod", cycleMs: 2000, fps: 200, strideMm: 40, swingEase: ease });
    const samples = swingProgress(sequence);
    expect(samples.length).toBeGreaterThan(50);
    await page.goto("/");
    const browser = await page.evaluate(
      ({ ease, fractions }) => {
        const element = document.createElement("div");
        document.body.append(element);
        const animation = element.animate([{ opacity: 0 }, { opacity: 1 }], {
          duration: 1000,
          fill: "both",
          easing: `cubic-bezier(${ease.join(", ")})`,
        });
        animation.pause();
        return fractions.map((s) => {
          animation.currentTime = s * 1000;
          return animation.effect!.getComputedTiming().progress as number;
        });
      },
      { ease, fractions: samples.map((sample) => sample.s) },
    );
    let worst = 0;
    samples.forEach((sample, i) => (worst = Math.max(worst, Math.abs(sample.progress - browser[i]))));
    expect(worst, `largest gap between our swing progress and Chromium's over ${samples.length} frames`).toBeLessThan(1e-3);
  });
}
