import { describe, expect, it } from "vitest";
import { CSS_EASE, generateGait, solveSequence } from "~/gait/index";
import { swingLift } from "~/gait/interpolate/swing";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { cssCubicBezier, distance, worldFoot } from "../helpers";

// DESIGN.md, Gait sequence: a swing goes from the lift-off point to the
// touch-down point; horizontal progress is the eased time fraction (CSS
// cubic-bezier, W3C CSS Easing Level 1), the height apexMm·(1 − cos 2πs)/2 of the
// plain fraction s, so the foot leaves and meets the ground without a jump.
describe("swing path (DESIGN.md; easing per W3C CSS Easing Functions Level 1)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const stepHeightMm = 30;
  const strideMm = 60;
  // 1200 ms at 50 fps: LF lifts at frame 0 and touches down at frame 30 (tripod).
  const sequence = generateGait(robot, { template: "tripod", strideMm, stepHeightMm, cycleMs: 1200, fps: 50 });
  const frames = solveSequence(robot, sequence, { checks: [] }).frames;
  const ease = cssCubicBezier(...CSS_EASE);

  it("height profile: apex·(1 − cos 2πs)/2, 0 at both ends, the apex half-way, zero slope at the ends", () => {
    expect(swingLift(30, 0)).toBe(0);
    expect(swingLift(30, 1)).toBeCloseTo(0, 12);
    expect(swingLift(30, 0.5)).toBeCloseTo(30, 12);
    const slope = (swingLift(30, 1e-6) - swingLift(30, 0)) / 1e-6;
    expect(Math.abs(slope), `vertical speed at lift-off (mm per cycle fraction), expected ≈ 0`).toBeLessThan(1e-3);
  });

  it("LF's world foot follows the eased straight line and the lift profile in every swing frame", () => {
    const liftOff = worldFoot(frames[0], "LF");
    // The touch-down point is where the stance foot then stays.
    const touchDown = worldFoot(frames[30], "LF");
    expect(touchDown[0] - liftOff[0], "world step length = stride, mm").toBeCloseTo(strideMm, 9);
    for (let frame = 0; frame < 30; frame += 1) {
      const s = frame / 30;
      const progress = ease(s);
      const expected = [
        liftOff[0] + (touchDown[0] - liftOff[0]) * progress,
        liftOff[1] + (touchDown[1] - liftOff[1]) * progress,
        (stepHeightMm * (1 - Math.cos(2 * Math.PI * s))) / 2,
      ];
      const got = worldFoot(frames[frame], "LF");
      expect(frames[frame].legs.LF.contact).toBe("swing");
      expect(distance(got, expected), `frame ${frame}: expected ${expected.map((v) => v.toFixed(4))}, got ${got.map((v) => v.toFixed(4))} (mm)`).toBeLessThan(
        1e-6,
      );
    }
  });

  it("leaves and meets the ground without a jump: the world foot moves at most a swing frame's step across lift-off and touch-down", () => {
    const steps = frames.map((frame, index) => distance(worldFoot(frame, "LF"), worldFoot(frames[(index + 1) % frames.length], "LF")));
    // Largest step anywhere in the swing, to compare the ends against.
    const largest = Math.max(...steps.slice(0, 30));
    expect(steps[29], "step into touch-down (frame 29 → 30), mm").toBeLessThan(largest);
    expect(steps[0], "step out of lift-off (frame 0 → 1), mm").toBeLessThan(largest);
    // In the world, the stance foot before lift-off and the lift-off point coincide (loop: frame 59 → 60 = 0 moved on one cycle).
    const frame59 = worldFoot(frames[59], "LF");
    const frame0NextCycle = [worldFoot(frames[0], "LF")[0] + strideMm, worldFoot(frames[0], "LF")[1], worldFoot(frames[0], "LF")[2]];
    expect(distance(frame59, frame0NextCycle), "stance end → next lift-off, mm").toBeLessThan(1e-9);
  });
});
