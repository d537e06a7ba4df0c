// Issue 16, item 6: a gait's settings have people's names — one source for the
// editor's fields and the comparison's list of changed settings.
import { expect, test } from "vitest";
import { describeSettingChange, SETTING_LABELS, settingLabel } from "~/features/gaits/setting-labels";

test("every generator and timing setting has a name and its unit", () => {
  expect(settingLabel("generator.strideMm")).toBe("Stride length (mm)");
  expect(settingLabel("cycleMs")).toBe("Cycle time (ms)");
  expect(settingLabel("fps")).toBe("Frame rate (frames/s)");
  expect(settingLabel("generator.dutyFactor")).toBe("Duty factor");
  expect(settingLabel("generator.phase.LF")).toBe("Lift-off time of LF (fraction of the cycle)");
  for (const path of [
    "loop",
    "generator.template",
    "generator.directionDeg",
    "generator.turnDegPerCycle",
    "generator.stepHeightMm",
    "generator.bodyHeightMm",
  ]) {
    expect(SETTING_LABELS[path as keyof typeof SETTING_LABELS], path).toBeDefined();
    expect(settingLabel(path)).not.toMatch(/generator|Mm|Deg/);
  }
});

test("a changed setting reads with its name and plain values", () => {
  expect(describeSettingChange({ path: "generator.strideMm", before: 40, after: 55 })).toBe("Stride length (mm): 40 → 55");
  expect(describeSettingChange({ path: "loop", before: true, after: false })).toBe("Loops: yes → no");
  expect(describeSettingChange({ path: "generator.template", before: "tripod", after: "wave" })).toBe("Template: tripod → wave");
  expect(describeSettingChange({ path: "generator.bodyHeightMm", before: undefined, after: 90 })).toBe("Body height (mm): the robot's → 90");
  expect(describeSettingChange({ path: "generator.somethingNew", before: 1, after: 2 })).toBe("generator.somethingNew: 1 → 2");
});
