import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { cycleFraction, swingingLegs } from "../helpers";

// S.-M. Song and K. J. Waldron, Machines That Walk (MIT Press, 1989): the wave
// gait for six legs has duty factor 5/6 with one leg in swing at a time. Their
// touch-down phases, relative to the front-left leg, are F(i·β) for the left leg
// of row i (0 = front) and F(i·β + 1/2) for the right one; for β = 5/6:
const SONG_WALDRON_WAVE6_TOUCH_DOWN = { LF: 0, LM: 5 / 6, LR: 2 / 3, RF: 1 / 2, RM: 1 / 3, RR: 1 / 6 };

describe("six-legged wave template (Song and Waldron, Machines That Walk, 1989)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const sequence = generateGait(robot, { template: "wave", cycleMs: 2400, fps: 50, strideMm: 40 });
  const beta = sequence.generator.dutyFactor!;

  it("has duty factor 5/6", () => {
    expect(beta).toBeCloseTo(5 / 6, 12);
  });

  it("matches the book's touch-down phases once converted from our lift-off phases (touch-down = F(lift-off + 1 − β))", () => {
    const touchDown = (legId: string): number => cycleFraction(sequence.generator.phase![legId] + 1 - beta);
    for (const [legId, expected] of Object.entries(SONG_WALDRON_WAVE6_TOUCH_DOWN)) {
      const got = cycleFraction(touchDown(legId) - touchDown("LF"));
      expect(got, `${legId}: touch-down phase relative to LF, expected ${expected.toFixed(4)}, got ${got.toFixed(4)}`).toBeCloseTo(expected, 9);
    }
  });

  it("has exactly one leg in swing at every frame, each leg for 1/6 of the cycle", () => {
    const swinging = swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames);
    const framesUp: Record<string, number> = {};
    swinging.forEach((legs, frame) => {
      expect(legs.length, `frame ${frame}: expected 1 leg in swing, got ${legs.length} (${legs.join(" ")})`).toBe(1);
      framesUp[legs[0]] = (framesUp[legs[0]] ?? 0) + 1;
    });
    for (const legId of Object.keys(sequence.legs)) expect(framesUp[legId], `${legId}: frames in swing`).toBe(120 / 6);
  });
});

describe("wave template for four and eight legs (one leg up at a time, duty factor 1 − 1/legs)", () => {
  for (const [file, legs, beta] of [
    [DEMO_ROBOTS.four, 4, 3 / 4],
    [DEMO_ROBOTS.eight, 8, 7 / 8],
  ] as const) {
    it(`${legs} legs: duty factor ${beta}, exactly one leg in swing at every frame`, () => {
      const robot = loadDemoRobot(file);
      const sequence = generateGait(robot, { template: "wave", cycleMs: legs * 400, fps: 50, strideMm: 30 });
      expect(sequence.generator.dutyFactor).toBeCloseTo(beta, 12);
      swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames).forEach((up, frame) =>
        expect(up.length, `frame ${frame}: expected 1 leg in swing, got ${up.join(" ")}`).toBe(1),
      );
    });
  }
});
