import { describe, expect, test } from "vitest";
import { changedFields, describeChange, isCalibrationPath, nonCalibrationChanges, summarizeChanges } from "~/features/robots/changes";
import { loadDemoRobot } from "../../support/robots";

describe("which fields firmware may change", () => {
  test("zero offsets and everything under servo are calibration; limits, lengths and mounts are not", () => {
    expect(isCalibrationPath(["legs", 0, "joints", "femur", "zeroOffsetDeg"])).toBe(true);
    expect(isCalibrationPath(["legs", 3, "joints", "tibia", "servo", "reversed"])).toBe(true);
    expect(isCalibrationPath(["legs", 3, "joints", "tibia", "servo"])).toBe(true);
    expect(isCalibrationPath(["legs", 0, "joints", "femur", "minDeg"])).toBe(false);
    expect(isCalibrationPath(["legs", 0, "joints", "femur", "maxSpeedDegS"])).toBe(false);
    expect(isCalibrationPath(["legs", 0, "femur"])).toBe(false);
    expect(isCalibrationPath(["name"])).toBe(false);
  });

  test("a calibration-only edit has no non-calibration changes", () => {
    const before = loadDemoRobot("pier-crawler");
    const after = structuredClone(before);
    after.legs[2].joints.coxa.zeroOffsetDeg = 3.5;
    after.legs[4].joints.tibia.servo = { ...after.legs[4].joints.tibia.servo, reversed: !after.legs[4].joints.tibia.servo.reversed, centerUs: 1512 };
    expect(nonCalibrationChanges(before, after)).toEqual([]);
    expect(changedFields(before, after).map((change) => change.path)).toEqual([
      "legs[2].joints.coxa.zeroOffsetDeg",
      "legs[4].joints.tibia.servo.reversed",
      "legs[4].joints.tibia.servo.centerUs",
    ]);
  });

  test("a length, a limit, a new field or a removed leg is named with its old and new value", () => {
    const before = loadDemoRobot("pier-crawler");
    const after = structuredClone(before);
    after.legs[0].femur = 70;
    after.legs[1].joints.femur.maxDeg = 80;
    after.legs[0].joints.coxa.zeroOffsetDeg = 2;
    const changes = nonCalibrationChanges(before, after);
    expect(changes.map(describeChange)).toEqual([
      `legs[0].femur (${before.legs[0].femur} → 70)`,
      `legs[1].joints.femur.maxDeg (${before.legs[1].joints.femur.maxDeg} → 80)`,
    ]);

    const fewer = { ...before, legs: before.legs.slice(0, 5) };
    expect(nonCalibrationChanges(before, fewer).map(describeChange)).toEqual(["legs (6 items → 5 items)"]);
    const described = { ...before, description: undefined, standHeight: before.standHeight };
    expect(nonCalibrationChanges(before, described).map((change) => change.path)).toEqual(before.description ? ["description"] : []);
  });

  test("0 and −0 are the same setting", () => {
    expect(changedFields({ a: 0 }, { a: -0 })).toEqual([]);
  });

  test("a summary names up to three changes", () => {
    const changes = [1, 2, 3, 4].map((n) => ({ path: `legs[${n}].femur`, before: 60, after: 61 }));
    expect(summarizeChanges(changes)).toBe("Changed legs[1].femur (60 → 61), legs[2].femur (60 → 61), legs[3].femur (60 → 61) and 1 more");
    expect(summarizeChanges([])).toBe("No changes");
  });
});
