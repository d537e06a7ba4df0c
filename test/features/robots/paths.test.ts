import { describe, expect, test } from "vitest";
import { formatPath } from "~/kinematics";
import { fieldId, formFieldIdFor, getAt, parsePathText, setAt } from "~/features/robots/paths";

describe("field paths", () => {
  test("parsePathText reads back what formatPath writes", () => {
    for (const path of [["legs", 2, "joints", "femur", "minDeg"], ["rest", "LF", "coxa"], ["body", "com", 1], ["rest", "1x", "coxa"], []]) {
      expect(parsePathText(formatPath(path))).toEqual(path);
    }
  });

  test("issues on form fields link to their input; others to nothing", () => {
    expect(formFieldIdFor("legs[2].joints.femur.minDeg")).toBe(fieldId(["legs", 2, "joints", "femur", "minDeg"]));
    expect(formFieldIdFor("legs[0].joints.coxa.servo.channel")).toBe("field-legs-0-joints-coxa-servo-channel");
    expect(formFieldIdFor("rest.LF.coxa")).toBe("field-rest-LF-coxa");
    expect(formFieldIdFor("legs")).toBeNull();
    expect(formFieldIdFor("")).toBeNull();
  });

  test("setAt copies only along the path and removes a key given undefined", () => {
    const document = { a: { b: [1, 2, 3] }, c: { d: 1 } };
    const next = setAt(document, ["a", "b", 1], 9);
    expect(next).toEqual({ a: { b: [1, 9, 3] }, c: { d: 1 } });
    expect(next.c).toBe(document.c);
    expect(document.a.b[1]).toBe(2);
    expect(setAt(document, ["c", "d"], undefined)).toEqual({ a: { b: [1, 2, 3] }, c: {} });
    expect(getAt(next, ["a", "b", 1])).toBe(9);
    expect(getAt(next, ["x", "y"])).toBeUndefined();
  });
});
