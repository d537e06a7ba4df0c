import { describe, expect, test } from "vitest";
import { FLAG_KINDS } from "~/gait";
import { CHECKS } from "~/gait/checks/index";
import { FLAG_LABELS, FLAG_TAGS } from "~/features/gaits/flag-labels";

describe("every kind of flag has one name and one timeline tag", () => {
  test("each check's kind is named", () => {
    for (const check of CHECKS) {
      expect(FLAG_LABELS[check.kind], check.kind).toBeTruthy();
      expect(FLAG_TAGS[check.kind], check.kind).toBeTruthy();
    }
  });
  test("no two kinds share a name or a tag", () => {
    expect(new Set(FLAG_KINDS.map((kind) => FLAG_LABELS[kind])).size).toBe(FLAG_KINDS.length);
    expect(new Set(FLAG_KINDS.map((kind) => FLAG_TAGS[kind])).size).toBe(FLAG_KINDS.length);
  });
});
