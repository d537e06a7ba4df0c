import { describe, expect, test } from "vitest";
import { checkDraft, removeLegAt, renameLeg, valueFromNumberText } from "~/features/robots/form-draft";
import { getAt, setAt } from "~/features/robots/paths";
import { loadDemoRobot } from "../../support/robots";

describe("the editor's working copy", () => {
  test("number text: numbers, a decimal comma, nothing, or the text itself", () => {
    expect(valueFromNumberText("62")).toBe(62);
    expect(valueFromNumberText(" -4.5 ")).toBe(-4.5);
    expect(valueFromNumberText("1.")).toBe(1);
    expect(valueFromNumberText("2,5")).toBe(2.5);
    expect(valueFromNumberText("1e3")).toBe(1000);
    expect(valueFromNumberText("")).toBeUndefined();
    expect(valueFromNumberText("abc")).toBe("abc");
    expect(valueFromNumberText("1.2.3")).toBe("1.2.3");
  });

  test("parseRobot's issues land at the field paths", () => {
    const robot = loadDemoRobot("pier-crawler") as unknown as Record<string, unknown>;
    let document = setAt(robot, ["legs", 0, "femur"], -5);
    document = setAt(document, ["legs", 1, "joints", "femur", "minDeg"], 90);
    document = setAt(document, ["standHeight"], "abc");
    document = setAt(document, ["body", "massKg"], undefined);
    const check = checkDraft(document);
    expect(check.robot).toBeNull();
    expect(check.byPath.get("legs[0].femur")).toEqual(["must be at least 1 (got -5)"]);
    expect(check.byPath.get("legs[1].joints.femur.minDeg")?.[0]).toMatch(/^must be below the maximum \(got 90 ≥ \d+\)$/);
    expect(check.byPath.get("standHeight")).toEqual(['must be a number (got "abc")']);
    expect(check.byPath.get("body.massKg")).toEqual(["is required"]);
    // Beside the field, what is wrong; the summary reads the whole message, which names the field.
    expect(check.issues.find((issue) => issue.path === "legs[0].femur")?.message).toBe("Leg LF, femur length must be at least 1 (got -5)");
  });

  test("renaming a leg carries its rest angles; removing drops them", () => {
    const robot = loadDemoRobot("pier-crawler") as unknown as Record<string, unknown>;
    const renamed = renameLeg(robot, 0, "FL");
    expect(getAt(renamed, ["legs", 0, "id"])).toBe("FL");
    expect(getAt(renamed, ["rest", "FL"])).toEqual(getAt(robot, ["rest", "LF"]));
    expect(getAt(renamed, ["rest", "LF"])).toBeUndefined();
    expect(checkDraft(renamed).issues).toEqual([]);
    const removed = removeLegAt(renamed, 0);
    expect((getAt(removed, ["legs"]) as unknown[]).length).toBe(5);
    expect(getAt(removed, ["rest", "FL"])).toBeUndefined();
  });
});
