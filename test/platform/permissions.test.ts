import { describe, expect, test } from "vitest";
import { PERMISSIONS, ROLES, can, invitableRoles, refusal, type Action, type Role } from "~/platform/permissions";
import { approvalRules } from "~/features/versions/review.server";
import { safeReturnTo } from "~/platform/session.server";

// DESIGN.md's role table (section "Roles", with its "Also" line), written out
// by hand: every action of PERMISSIONS for every role, each row with the words
// it comes from. It is the oracle for PERMISSIONS, so nothing here is read from
// the code. A new action needs a row, and its row needs words from DESIGN.md.
// Everyone above a viewer reads what a viewer reads: an animator edits what it
// sees, a lead has "everything an animator can", an owner "everything".
const COLUMNS = ["owner", "lead", "animator", "firmware", "viewer"] as const;

// prettier-ignore
const DESIGN_ROLES: Record<string, readonly [owner: boolean, lead: boolean, animator: boolean, firmware: boolean, viewer: boolean]> = {
  //                          owner  lead   animator firmware viewer
  // "viewer | read everything in the app, nothing else"; "firmware | read everything": the workspace
  "workspace.read":         [true,  true,  true,    true,    true],
  // "viewer | read everything in the app, nothing else"; "firmware | read everything": robots
  "robots.read":            [true,  true,  true,    true,    true],
  // "viewer | read everything in the app, nothing else"; "firmware | read everything": gaits and versions
  "gaits.read":             [true,  true,  true,    true,    true],
  // "viewer | read everything in the app, nothing else"; "firmware | read everything": reviews
  "reviews.read":           [true,  true,  true,    true,    true],
  // "viewer | read everything in the app, nothing else"; "firmware | read everything": the members
  "members.read":           [true,  true,  true,    true,    true],
  // "viewer | read everything in the app, nothing else": the audit log too (the owner's row gives managing, not reading)
  "audit.read":             [true,  true,  true,    true,    true],
  // "owner | everything, including members, roles and workspace settings": the settings
  "workspace.manage":       [true,  false, false,   false,   false],
  // "owner | everything, including members, roles and workspace settings": roles
  "members.changeRole":     [true,  false, false,   false,   false],
  // "owner | everything, including members, roles and workspace settings": members
  "members.remove":         [true,  false, false,   false,   false],
  // "lead | … invite (not owners)" (whom a lead may invite: invitableRoles, below)
  "invitations.manage":     [true,  true,  false,   false,   false],
  // "owner | everything, including members …": the local inbox holds every invitation's link, which is as good as membership
  "mail.readLocal":         [true,  false, false,   false,   false],
  // "Owner, lead and firmware may hold API tokens, which act with the holder's role"
  "tokens.manage":          [true,  true,  false,   true,    false],
  // "animator | edit robots and gaits"; "lead | everything an animator can"
  "robots.edit":            [true,  true,  true,    false,   false],
  // "firmware | … edit servo mapping and calibration of robots", and "animator | edit robots" includes them
  "robots.calibrate":       [true,  true,  true,    true,    false],
  // Deleting for good is beyond "edit robots and gaits" (animator) and so beyond "everything an animator can" (lead);
  // "Owner/admin — manages the workspace, robots, members and roles"; "owner | everything". Archiving is an edit (robots.edit, gaits.edit).
  "robots.delete":          [true,  false, false,   false,   false],
  "gaits.delete":           [true,  false, false,   false,   false],
  // "animator | edit robots and gaits"
  "gaits.edit":             [true,  true,  true,    false,   false],
  // "animator | … commit versions"
  "versions.commit":        [true,  true,  true,    false,   false],
  // "animator | … request review"
  "versions.requestReview": [true,  true,  true,    false,   false],
  // "lead | … approve, send back" (and "No one approves their own version": approvalRules, below)
  "versions.decide":        [true,  true,  false,   false,   false],
  // "lead | … release"
  "versions.release":       [true,  true,  false,   false,   false],
  // "tables may be downloaded by owner, lead, animator and firmware"
  "tables.download":        [true,  true,  true,    true,    false],
  // "the solver API used by every member"
  "solver.use":             [true,  true,  true,    true,    true],
  // "tuning jobs run by owner, lead and animator"
  "tuning.run":             [true,  true,  true,    false,   false],
  // "streaming to a robot on the bench by owner, lead and firmware"
  "bench.stream":           [true,  true,  false,   true,    false],
};

describe("the permission table is DESIGN.md's role table", () => {
  test("the oracle's columns are the roles there are", () => {
    expect([...COLUMNS].sort()).toEqual([...ROLES].sort());
  });

  test("every action of PERMISSIONS has a row, and every row an action", () => {
    expect(Object.keys(PERMISSIONS).sort()).toEqual(Object.keys(DESIGN_ROLES).sort());
  });

  test("each role may do exactly what DESIGN.md gives it", () => {
    const disagreements = Object.entries(DESIGN_ROLES).flatMap(([action, row]) =>
      COLUMNS.flatMap((role, column) =>
        can(role, action as Action) === row[column] ? [] : [`${role} ${row[column] ? "may" : "may not"} ${action} by DESIGN.md, PERMISSIONS says otherwise`],
      ),
    );
    expect(disagreements).toEqual([]);
  });

  test("nobody signed out may do anything", () => {
    expect((Object.keys(PERMISSIONS) as Action[]).filter((action) => can(null, action))).toEqual([]);
  });

  test("no one approves their own version; an owner may, with a reason (DESIGN.md: 'an owner may override, with a reason in the audit log')", () => {
    const own = (role: Role) => approvalRules({ authorId: "me", errors: 0 }, { userId: "me", role });
    expect(own("lead")).toMatchObject({ allowed: false, refusal: "No one approves their own version: ask another lead or an owner." });
    expect(own("owner")).toEqual({ allowed: true, needsReason: ["own-version"] });
    expect(approvalRules({ authorId: "someone else", errors: 0 }, { userId: "me", role: "lead" })).toEqual({ allowed: true, needsReason: [] });
  });

  test("a lead may invite every role but owner ('invite (not owners)'); who cannot invite invites no one", () => {
    expect(invitableRoles("owner")).toEqual(["owner", "lead", "animator", "firmware", "viewer"]);
    expect(invitableRoles("lead")).toEqual(["lead", "animator", "firmware", "viewer"]);
    expect(invitableRoles("animator")).toEqual([]);
  });

  test("refusals read as a sentence", () => {
    expect(refusal("viewer", "robots.edit")).toBe("The viewer role cannot edit robots.");
    expect(refusal("firmware", "tuning.run")).toBe("The firmware role cannot run tuning jobs.");
    expect(refusal("animator", "bench.stream")).toBe("The animator role cannot stream to a robot on the bench.");
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
