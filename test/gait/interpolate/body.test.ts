import { Euler, Matrix4, Vector3 } from "three";
import { describe, expect, it } from "vitest";
import { bodyOffsetAt, generateGait, solveSequence } from "~/gait/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { cssCubicBezier } from "../helpers";

// DESIGN.md, Gait sequence: body pose offsets are eased between keys and ride on
// the travel, T_world←body = Trans(x, y, bodyHeight) · Rz(heading) · T_offset.
// Composed here with three.js Matrix4 (Euler order 'ZYX' for R = Rz·Ry·Rx).
describe("body track composition (DESIGN.md; composed with three.js)", () => {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const strideMm = 40;
  const turnDegPerCycle = 30;
  const bodyHeightMm = 85;
  const keys = [
    { t: 0, pose: { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 } },
    { t: 0.5, pose: { x: 8, y: -5, z: -12, roll: 4, pitch: -6, yaw: 5 } },
  ];
  const sequence = generateGait(robot, { template: "tripod", strideMm, turnDegPerCycle, bodyHeightMm, cycleMs: 1000, fps: 20, bodyKeys: keys });
  const frames = solveSequence(robot, sequence, { checks: [] }).frames;
  const ease = cssCubicBezier(0.25, 0.1, 0.25, 1);
  const radians = Math.PI / 180;

  function expectedBody(t: number): Matrix4 {
    // Travel: constant body-frame velocity and turn rate, integrated numerically (midpoint rule) as an outside check of the arc.
    let x = 0;
    let y = 0;
    const steps = 20000;
    for (let i = 0; i < steps; i += 1) {
      const heading = turnDegPerCycle * radians * t * ((i + 0.5) / steps);
      x += ((strideMm * t) / steps) * Math.cos(heading);
      y += ((strideMm * t) / steps) * Math.sin(heading);
    }
    // Offset eased with CSS ease from key 0 to key 1, back from key 1 to key 0 + 1 (a loop).
    const [from, to, s] = t < 0.5 ? [keys[0].pose, keys[1].pose, t / 0.5] : [keys[1].pose, keys[0].pose, (t - 0.5) / 0.5];
    const e = ease(s);
    const lerp = (name: keyof typeof from): number => from[name] + (to[name] - from[name]) * e;
    const offset = new Matrix4()
      .makeTranslation(lerp("x"), lerp("y"), lerp("z"))
      .multiply(new Matrix4().makeRotationFromEuler(new Euler(lerp("roll") * radians, lerp("pitch") * radians, lerp("yaw") * radians, "ZYX")));
    return new Matrix4()
      .makeTranslation(x, y, bodyHeightMm)
      .multiply(new Matrix4().makeRotationZ(turnDegPerCycle * radians * t))
      .multiply(offset);
  }

  it("reports the body's world pose of Trans(x, y, h) · Rz(heading) · T_offset at every frame", () => {
    frames.forEach((frame) => {
      const t = frame.index / frames.length;
      const expected = expectedBody(t);
      const position = new Vector3().setFromMatrixPosition(expected);
      const euler = new Euler().setFromRotationMatrix(expected, "ZYX");
      const got = frame.body;
      const message = `frame ${frame.index}: expected x ${position.x.toFixed(4)} y ${position.y.toFixed(4)} z ${position.z.toFixed(4)} mm, got ${got.x.toFixed(4)} ${got.y.toFixed(4)} ${got.z.toFixed(4)}`;
      expect(Math.abs(got.x - position.x), message).toBeLessThan(1e-4);
      expect(Math.abs(got.y - position.y), message).toBeLessThan(1e-4);
      expect(Math.abs(got.z - position.z), message).toBeLessThan(1e-9);
      expect(got.roll, `frame ${frame.index} roll (°)`).toBeCloseTo(euler.x / radians, 9);
      expect(got.pitch, `frame ${frame.index} pitch (°)`).toBeCloseTo(euler.y / radians, 9);
      expect(got.yaw, `frame ${frame.index} yaw (°)`).toBeCloseTo(euler.z / radians, 9);
    });
  });

  it("bodyOffsetAt gives the offset the solve used at each frame: the eased keys, heading and travel left out", () => {
    frames.forEach((frame) => {
      const t = frame.index / frames.length;
      const [from, to, s] = t < 0.5 ? [keys[0].pose, keys[1].pose, t / 0.5] : [keys[1].pose, keys[0].pose, (t - 0.5) / 0.5];
      const e = ease(s);
      const offset = bodyOffsetAt(sequence, t);
      for (const name of ["x", "y", "z", "roll", "pitch", "yaw"] as const) {
        expect(offset[name], `frame ${frame.index} ${name}`).toBeCloseTo(from[name] + (to[name] - from[name]) * e, 9);
      }
      expect(offset.z, `frame ${frame.index} z (mm)`).toBeCloseTo(frame.body.z - bodyHeightMm, 9);
    });
  });

  it("loops seamlessly: the last frame's body runs on into the first", () => {
    const last = frames[frames.length - 1].body;
    const next = expectedBody(1);
    const position = new Vector3().setFromMatrixPosition(next);
    const stepMm = Math.hypot(position.x - last.x, position.y - last.y, position.z - last.z);
    expect(stepMm, "body step from the last frame to frame N (mm), expected about one frame of travel (2 mm)").toBeLessThan(3);
  });
});
