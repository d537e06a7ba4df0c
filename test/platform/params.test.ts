import { describe, expect, test } from "vitest";
import { NUMBER_PATTERN, draftRevision, id, idParam, isId, revisionNumber, versionNumber, versionOrReleased } from "~/platform/params";

const accepts = (schema: { safeParse(value: unknown): { success: boolean } }, value: string) => schema.safeParse(value).success;

describe("revision and version numbers: whole numbers from 1 that fit PostgreSQL's integer", () => {
  test("1 to 999 999 999 are numbers", () => {
    expect(revisionNumber().parse("1")).toBe(1);
    expect(versionNumber().parse("999999999")).toBe(999_999_999);
  });
  test.each(["0", "01", "-1", "+1", " 1", "1.0", "1e3", "1000000000", ""])("%j is refused", (text) => {
    expect(accepts(revisionNumber(), text)).toBe(false);
  });
  test("the refusal says what the route asks for", () => {
    const parsed = revisionNumber((issue) => `baseRevision must be a revision number (got ${JSON.stringify(issue.input)})`).safeParse("x");
    expect(parsed.success ? null : parsed.error.issues[0].message).toBe('baseRevision must be a revision number (got "x")');
  });
  test("the OpenAPI pattern is the same rule", () => {
    expect(new RegExp(NUMBER_PATTERN).test("42")).toBe(true);
    expect(new RegExp(NUMBER_PATTERN).test("042")).toBe(false);
  });
  test("a version may also be `released`", () => {
    expect(versionOrReleased().parse("released")).toBe("released");
    expect(versionOrReleased().parse("3")).toBe(3);
    expect(accepts(versionOrReleased(), "latest")).toBe(false);
  });
});

describe("a draft revision starts at 0 (a gait whose draft was never saved)", () => {
  test("0 and the revision numbers are accepted, leading zeros are not", () => {
    expect(draftRevision().parse("0")).toBe(0);
    expect(draftRevision().parse("12")).toBe(12);
    expect(accepts(draftRevision(), "00")).toBe(false);
    expect(accepts(draftRevision(), "012")).toBe(false);
  });
});

describe("ids: 8-4-4-4-12 hex, as a uuid column holds them", () => {
  test("any hex id in that shape, in either case", () => {
    expect(isId("3f2504e0-4f89-41d3-9a0c-0305e82c3301")).toBe(true);
    expect(isId("3F2504E0-4F89-11D3-9A0C-0305E82C3301")).toBe(true);
    expect(isId("3f2504e0-4f89-41d3-9a0c")).toBe(false);
    expect(accepts(id(), "robot-1")).toBe(false);
  });
  test("an API parameter's refusal names the parameter and what came", () => {
    const parsed = idParam("gaitId").safeParse("abc");
    expect(parsed.success ? null : parsed.error.issues[0].message).toBe('gaitId must be a UUID (got "abc")');
  });
});
