import { describe, expect, test } from "vitest";
import { describeJsonError, jsonErrorOffset, lineAndColumn } from "~/features/robots/json-errors";

const errorOf = (text: string) => {
  try {
    JSON.parse(text);
  } catch (error) {
    return error;
  }
  throw new Error("expected invalid JSON");
};

describe("where JSON goes wrong (RFC 8259 grammar)", () => {
  test.each([
    ['{"a": 1}', null],
    ['[1, 2.5e3, -0, "x\\n\\u00e9", true, false, null, {}]', null],
    ['{\n  "format": "x",\n  "name": oops\n}', 29],
    ["{ legs: ", 2],
    ['{"a": 1,}', 8],
    ['{"a": 01}', 7],
    ["[1, 2", 5],
    ['{"a": "line\nbreak"}', 11],
    ['{"a": 1} x', 9],
    ["", 0],
  ])("%j → %s", (text, expected) => {
    expect(jsonErrorOffset(text)).toBe(expected);
    if (expected === null) expect(() => JSON.parse(text)).not.toThrow();
    else expect(() => JSON.parse(text)).toThrow();
  });

  test("the message gains a line and column", () => {
    const text = '{\n  "format": "x",\n  "name": oops\n}';
    expect(lineAndColumn(text, 29)).toEqual({ line: 3, column: 11 });
    expect(describeJsonError(errorOf(text), text)).toBe('unexpected "o" at line 3, column 11');
    expect(describeJsonError(errorOf('{"a": [1, 2'), '{"a": [1, 2')).toBe("the text ends too early at line 1, column 12");
  });
});
