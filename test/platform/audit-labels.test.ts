import { describe, expect, test } from "vitest";
import { AUDIT_ACTIONS, AUDIT_KINDS, auditSentence, describeAudit, type AuditSubject } from "~/platform/audit-labels";

const subject = (over: Partial<AuditSubject>): AuditSubject => ({
  action: "robot.save",
  actor: "Dana Reyes",
  target: { type: "robot", id: "6b1d0a52-0000-4000-8000-000000000001", name: null, href: null },
  details: {},
  ...over,
});

describe("audit entries read as sentences", () => {
  test("a role change names whose role, from and to", () => {
    const parts = describeAudit(
      subject({ action: "member.role-changed", target: { type: "user", id: "u1", name: "Lee Park", href: null }, details: { from: "animator", to: "lead" } }),
    );
    expect(auditSentence(parts)).toBe("Dana Reyes changed Lee Park’s role from animator to lead");
  });

  test("a robot save names the robot (a link while it exists) and its revision", () => {
    const parts = describeAudit(
      subject({ target: { type: "robot", id: "r1", name: "Strider-6", href: "/robots/r1" }, details: { revision: 4, changedFields: 3 } }),
    );
    expect(auditSentence(parts)).toBe("Dana Reyes saved robot Strider-6 revision 4 (3 fields changed)");
    expect(parts).toContainEqual({ name: "Strider-6", href: "/robots/r1" });
  });

  test("an object with no name anywhere is said to be gone, with the start of its id", () => {
    expect(auditSentence(describeAudit(subject({ details: { revision: 2 } })))).toBe("Dana Reyes saved robot robot 6b1d0a52… (no longer there) revision 2");
  });

  test("what the app did by itself, and an action this list does not know", () => {
    expect(auditSentence(describeAudit(subject({ action: "mail.failed", actor: null, details: { to: "a@b.test", topic: "invitation", attempts: 5 } })))).toBe(
      "A mail to a@b.test (invitation) could not be sent after 5 tries",
    );
    expect(auditSentence(describeAudit(subject({ action: "robot.polished", target: { type: "robot", id: "r1", name: "Strider-6", href: null } })))).toBe(
      "Dana Reyes robot.polished on Strider-6",
    );
  });

  test("every action belongs to a kind the filter offers (or to mail)", () => {
    const kinds = new Set<string>([...Object.keys(AUDIT_KINDS), "mail"]);
    expect(Object.entries(AUDIT_ACTIONS).filter(([, { kind }]) => !kinds.has(kind))).toEqual([]);
  });
});
