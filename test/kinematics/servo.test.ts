import { describe, expect, it } from "vitest";
import { angleToPulse, JOINT_NAMES, pulseToAngle, solveLeg, type Joint } from "../../app/kinematics";
import { loadDemoRobots } from "../support/robots";

const joint = (servo: Partial<Joint["servo"]> = {}): Joint => ({
  minDeg: -90,
  maxDeg: 90,
  zeroOffsetDeg: 0,
  maxSpeedDegS: 300,
  servo: { channel: 0, reversed: false, centerUs: 1500, usPerDeg: 11.1, minUs: 500, maxUs: 2500, ...servo },
});

describe("servo pulse widths (common practice: 50 Hz frame, 1500 µs neutral, 1000–2000 µs nominal, about 500–2500 µs extended)", () => {
  it("1500 µs at servo angle 0 with no zero offset", () => {
    expect(angleToPulse(joint(), 0)).toEqual({ us: 1500, clamped: false });
    // And through the solver: a joint at its geometric zero with no offset is at 1500 µs.
    const [pier] = loadDemoRobots();
    const lm = pier.legs.find((leg) => leg.id === "LM")!;
    expect(lm.joints.coxa.zeroOffsetDeg).toBe(0);
    const straightOut = solveLeg(pier, "LM", [0, 62 + 110, -90]);
    expect(angleToPulse(lm.joints.coxa, straightOut.angles.coxa).us, "LM coxa pulse (µs) pointing along its mount yaw").toBeCloseTo(1500, 9);
  });

  it("about 11 µs per degree spans the nominal 1000–2000 µs over ±45° and the extended 500–2500 µs over ±90°", () => {
    expect(angleToPulse(joint(), -45).us, "pulse at −45° (µs)").toBeCloseTo(1000, -1);
    expect(angleToPulse(joint(), 45).us, "pulse at +45° (µs)").toBeCloseTo(2000, -1);
    expect(angleToPulse(joint(), -90).us, "pulse at −90° (µs)").toBeCloseTo(500, -1);
    expect(angleToPulse(joint(), 90).us, "pulse at +90° (µs)").toBeCloseTo(2500, -1);
    // The 50 Hz frame (20 000 µs) leaves room for the longest pulse many times over.
    expect(1e6 / 50).toBeGreaterThan(2500);
  });

  it("us = centerUs + usPerDeg·servoDeg, the sign flipped when reversed (DESIGN.md)", () => {
    expect(angleToPulse(joint({ centerUs: 1520 }), 10).us, "µs").toBeCloseTo(1631, 9);
    expect(angleToPulse(joint({ centerUs: 1520, reversed: true }), 10).us, "µs, reversed").toBeCloseTo(1409, 9);
  });

  it("clamps to minUs..maxUs and flags it", () => {
    expect(angleToPulse(joint(), 100)).toEqual({ us: 2500, clamped: true });
    expect(angleToPulse(joint({ reversed: true }), 100)).toEqual({ us: 500, clamped: true });
    expect(angleToPulse(joint({ minUs: 900, maxUs: 2100 }), -60)).toEqual({ us: 900, clamped: true });
    expect(angleToPulse(joint(), 90).clamped).toBe(false);
  });

  it("pulseToAngle is the inverse inside the range, reversed or not", () => {
    for (const reversed of [false, true]) {
      for (const servoDeg of [-80, -12.5, 0, 33.3, 85]) {
        const j = joint({ reversed, centerUs: 1480 });
        expect(pulseToAngle(j, angleToPulse(j, servoDeg).us), `servo degrees back (reversed ${reversed})`).toBeCloseTo(servoDeg, 12);
      }
    }
  });

  it("every demo joint's limits map inside its servo's pulse range", () => {
    const clamped: string[] = [];
    for (const robot of loadDemoRobots()) {
      for (const leg of robot.legs) {
        for (const name of JOINT_NAMES) {
          const j = leg.joints[name];
          for (const limitDeg of [j.minDeg, j.maxDeg]) {
            const pulse = angleToPulse(j, limitDeg);
            if (pulse.clamped) clamped.push(`${robot.name} ${leg.id} ${name} at ${limitDeg}°`);
          }
        }
      }
    }
    expect(clamped, "joint limits whose pulse would be clamped").toEqual([]);
  });
});
