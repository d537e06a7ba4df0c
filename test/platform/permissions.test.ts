import { describe, expect, test } from "vitest";
import { PERMISSIONS, ROLES, can, invitableRoles, refusal } from "~/platform/permissions";
import { safeReturnTo } from "~/platform/session.server";

describe("the permission table (roles as DESIGN.md lists them)", () => {
  test("owners may do everything", () => {
    for (const action of Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]) expect(can("owner", action)).toBe(true);
  });
  test("viewers only read", () => {
    const allowed = (Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]).filter((action) => can("viewer", action));
    expect(allowed.every((action) => action.endsWith(".read") || action === "solver.use")).toBe(true);
  });
  test("firmware edits calibration but not geometry, and may hold tokens", () => {
    expect([can("firmware", "robots.calibrate"), can("firmware", "robots.edit"), can("firmware", "tokens.manage")]).toEqual([true, false, true]);
  });
  test("only owners and leads approve; animators cannot hold tokens", () => {
    expect(ROLES.filter((role) => can(role, "versions.decide"))).toEqual(["owner", "lead"]);
    expect(can("animator", "tokens.manage")).toBe(false);
  });
  test("a lead may invite every role but owner", () => {
    expect(invitableRoles("lead")).toEqual(["lead", "animator", "firmware", "viewer"]);
    expect(invitableRoles("animator")).toEqual([]);
  });
  test("nobody signed out can do anything", () => {
    expect(can(null, "robots.read")).toBe(false);
  });
  test("refusals read as a sentence", () => {
    expect(refusal("viewer", "robots.edit")).toBe("The viewer role cannot edit robots.");
  });
});

describe("where sign-in may return to", () => {
  test.each([
    ["/robots?x=1", "/robots?x=1"],
    ["//evil.example/", "/"],
    ["https://evil.example/", "/"],
    ["/\\evil.example", "/"],
    [null, "/"],
  ])("%s → %s", (input, expected) => expect(safeReturnTo(input)).toBe(expected));
});
