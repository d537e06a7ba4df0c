// Where a parsed JSON value holds U+0000 (which PostgreSQL's text and jsonb
// cannot store), found without recursion: a hostile body nests arrays or
// objects 100 000 deep, and a recursive walk overflowed the stack there and
// answered 500 (seen by the full probe run, npm run probe --count 12000).
import { describe, expect, test } from "vitest";
import { nulPathIn } from "~/platform/body.server";

function nestedArrays(depth: number, innermost: unknown): unknown {
  let value: unknown = innermost;
  for (let level = 0; level < depth; level += 1) value = [value];
  return value;
}

function nestedObjects(depth: number, innermost: unknown): unknown {
  let value: unknown = innermost;
  for (let level = 0; level < depth; level += 1) value = { a: value };
  return value;
}

describe("nulPathIn", () => {
  test("names the path of a NUL in a string or a key, and the first one in document order", () => {
    expect(nulPathIn({ legs: [{ id: "LF" }, { id: "R\u0000F" }] })).toBe("legs[1].id");
    expect(nulPathIn({ "a\u0000": 1 })).toBe("a\u0000");
    expect(nulPathIn("x\u0000")).toBe("(the whole value)");
    expect(nulPathIn({ a: ["\u0000"], b: "\u0000" })).toBe("a[0]");
    expect(nulPathIn({ a: [1, null, true, { b: "fine" }] })).toBeNull();
  });

  test("walks 100 000 nested arrays and objects without overflowing the stack", () => {
    expect(nulPathIn(nestedArrays(100_000, 1))).toBeNull();
    expect(nulPathIn(nestedObjects(100_000, "ok"))).toBeNull();
    const deepNul = nulPathIn(nestedArrays(100_000, "\u0000"));
    expect(deepNul?.startsWith("[0][0]")).toBe(true);
    expect(deepNul?.length).toBe(3 * 100_000);
  });
});
