import { describe, expect, it } from "vitest";
import { generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { cycleFraction, swingingLegs } from "../helpers";

// S.-M. Song and K. J. Waldron, Machines That Walk (MIT Press, 1989): the tripod
// gait has duty factor 1/2 and two alternating sets of three legs, the front and
// rear leg of one side with the middle leg of the other. The book measures a
// leg's phase at touch-down, relative to the front-left leg; ours is the
// lift-off time, so the test converts: touch-down = F(lift-off + 1 − β).
const SONG_WALDRON_TRIPOD_TOUCH_DOWN = { LF: 0, RM: 0, LR: 0, RF: 1 / 2, LM: 1 / 2, RR: 1 / 2 };
const SET_A = ["LF", "LR", "RM"];
const SET_B = ["LM", "RF", "RR"];

describe("tripod template (Song and Waldron, Machines That Walk, 1989)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const sequence = generateGait(robot, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40 });

  it("has duty factor 1/2", () => {
    expect(sequence.generator.dutyFactor).toBe(0.5);
  });

  it("writes per leg a lift-off key (swing) at its phase and a touch-down key (stance) half a cycle later", () => {
    for (const [legId, track] of Object.entries(sequence.legs)) {
      const liftOff = track.keys.find((key) => key.contact === "swing");
      const touchDown = track.keys.find((key) => key.contact === "stance");
      expect(track.keys, `${legId}: expected 2 keys`).toHaveLength(2);
      expect(liftOff?.t, `${legId}: lift-off key at the phase`).toBe(sequence.generator.phase?.[legId]);
      expect(cycleFraction(touchDown!.t - liftOff!.t), `${legId}: swing lasts 1 − β`).toBeCloseTo(0.5, 12);
    }
  });

  it("matches the book's touch-down phases once converted from our lift-off phases", () => {
    const beta = sequence.generator.dutyFactor!;
    const touchDown = (legId: string): number => cycleFraction(sequence.generator.phase![legId] + 1 - beta);
    for (const [legId, expected] of Object.entries(SONG_WALDRON_TRIPOD_TOUCH_DOWN)) {
      const got = cycleFraction(touchDown(legId) - touchDown("LF"));
      expect(got, `${legId}: touch-down phase relative to LF, expected ${expected}, got ${got}`).toBeCloseTo(expected, 12);
    }
  });

  it("swings exactly one set of three at every frame, the sets alternating every half cycle", () => {
    const swinging = swingingLegs(solveSequence(robot, sequence, { checks: [] }).frames);
    swinging.forEach((legs, frame) => {
      const expected = frame < 30 ? SET_A : SET_B;
      expect(legs, `frame ${frame}: expected ${expected.join(" ")} in swing, got ${legs.join(" ")}`).toEqual(expected);
    });
  });
});
