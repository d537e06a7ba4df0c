import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, memberships } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { demoIds, memberAs, refusal, type DemoIds } from "../../support/routes";
import type { Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { changeRole, removeMember } from "~/features/accounts/members.server";

let ids: DemoIds;
let owner: Member;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  owner = await memberAs("owner", ids);
});

describe("members and roles", () => {
  test("the only owner can be neither demoted nor removed (409, nothing changed)", async () => {
    const demote = await refusal(() => changeRole(owner, ids.userIds.owner, "lead"));
    expect(demote.status).toBe(409);
    expect(demote.message).toContain("only owner");
    const remove = await refusal(() => removeMember(owner, ids.userIds.owner));
    expect(remove.status).toBe(409);
    const [row] = await database().select().from(memberships).where(eq(memberships.userId, ids.userIds.owner));
    expect(row.role).toBe("owner");
  });

  test("with a second owner, the first may step down; the change is in the audit log", async () => {
    await changeRole(owner, ids.userIds.lead, "owner");
    await changeRole(owner, ids.userIds.owner, "lead");
    const [row] = await database().select().from(memberships).where(eq(memberships.userId, ids.userIds.owner));
    expect(row.role).toBe("lead");
    const entries = await database().select().from(auditLog).where(eq(auditLog.action, "member.role-changed"));
    expect(entries.map((entry) => entry.details)).toEqual(
      expect.arrayContaining([
        { member: "Mara Lindqvist", from: "lead", to: "owner" },
        { member: "Ines Okafor", from: "owner", to: "lead" },
      ]),
    );
  });

  test("two owners demoting each other at once leave one owner", async () => {
    // The lead is an owner now (previous test); the original owner is back to owner first.
    const newOwner = { ...owner, user: { ...owner.user, id: ids.userIds.lead } };
    await changeRole(newOwner, ids.userIds.owner, "owner");
    const results = await Promise.allSettled([changeRole(owner, ids.userIds.lead, "viewer"), changeRole(newOwner, ids.userIds.owner, "viewer")]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const owners = await database().select().from(memberships).where(eq(memberships.role, "owner"));
    expect(owners.filter((m) => m.workspaceId === ids.workspaceId)).toHaveLength(1);
  });

  test("removing someone who is not a member is a 404", async () => {
    const missing = await refusal(() => removeMember(owner, "00000000-0000-4000-8000-000000000000"));
    expect(missing.status).toBe(404);
  });
});
