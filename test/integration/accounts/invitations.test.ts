import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { invitations, memberships, users } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { mailStackForFile, waitForMail } from "../../support/mail";
import { uniqueName } from "../../support/names";
import { demoIds, memberAs, refusal, type DemoIds } from "../../support/routes";
import type { Member, User } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { acceptInvitation, invitationForToken, invite, resendInvitation, revokeInvitation } from "~/features/accounts/invitations.server";

// The invitations' mail goes out through this file's own SMTP fake and job runner.
const mail = mailStackForFile();

let ids: DemoIds;
let owner: Member;
let lead: Member;

/** Someone who has signed in with GitHub, which verified their address. */
async function newPerson(login: string): Promise<User> {
  const email = `${login}@example.test`;
  const [user] = await database()
    .insert(users)
    .values({ login, name: login, email, verifiedEmails: [email] })
    .returning();
  return user;
}

/** The link token of the newest invitation mail to `email`, once `count` of them have arrived. */
async function linkTokenFor(email: string, count = 1): Promise<string> {
  const messages = await waitForMail(mail.fake().inboxUrl, email, { count });
  const token = messages.length >= count ? messages[0].text.match(/\/invitations\/(\S+)/)?.[1] : undefined;
  if (!token) throw new Error(`no invitation mail for ${email}`);
  return token;
}

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  owner = await memberAs("owner", ids);
  lead = await memberAs("lead", ids);
});

describe("invitations", () => {
  test("the e-mailed link adds the membership once; the link is single-use", async () => {
    const person = await newPerson(uniqueName("inv"));
    await invite(lead, person.email, "animator");
    const token = await linkTokenFor(person.email);
    expect((await invitationForToken(token)).role).toBe("animator");
    const accepted = await acceptInvitation(person, { token });
    expect(accepted).toEqual({ workspaceId: ids.workspaceId, role: "animator" });
    const again = await refusal(() => acceptInvitation(person, { token }));
    expect(again.status).toBe(410);
    const rows = await database().select().from(memberships).where(eq(memberships.userId, person.id));
    expect(rows).toHaveLength(1);
  });

  test("a lead cannot invite an owner (403); an owner can", async () => {
    const refused = await refusal(() => invite(lead, "boss@example.test", "owner"));
    expect(refused.status).toBe(403);
    expect(refused.field).toBe("role");
    await expect(invite(owner, "boss@example.test", "owner")).resolves.toMatchObject({ role: "owner" });
  });

  test("a bad address and a duplicate pending invitation are refused with the field named", async () => {
    const bad = await refusal(() => invite(owner, "not-an-address", "viewer"));
    expect([bad.status, bad.field]).toEqual([422, "email"]);
    await invite(owner, "twice@example.test", "viewer");
    const duplicate = await refusal(() => invite(owner, "twice@example.test", "viewer"));
    expect(duplicate.status).toBe(409);
  });

  test("resending retires the old link; revoking retires every link", async () => {
    const person = await newPerson(uniqueName("resend"));
    const row = await invite(owner, person.email, "viewer");
    const first = await linkTokenFor(person.email);
    await resendInvitation(owner, row.id);
    const second = await linkTokenFor(person.email, 2);
    expect(second).not.toBe(first);
    expect((await refusal(() => invitationForToken(first))).status).toBe(404);
    await revokeInvitation(owner, row.id);
    expect((await refusal(() => acceptInvitation(person, { token: second }))).status).toBe(410);
  });

  test("an expired invitation is refused with a message saying so", async () => {
    const person = await newPerson(uniqueName("late"));
    const row = await invite(owner, person.email, "viewer");
    const token = await linkTokenFor(person.email);
    await database()
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, row.id));
    const expired = await refusal(() => acceptInvitation(person, { token }));
    expect(expired.status).toBe(410);
    expect(expired.message).toContain("expired");
  });

  test("two tabs accepting at once add one membership", async () => {
    const person = await newPerson(uniqueName("twice"));
    await invite(owner, person.email, "viewer");
    const token = await linkTokenFor(person.email);
    const results = await Promise.allSettled([acceptInvitation(person, { token }), acceptInvitation(person, { token })]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(await database().select().from(memberships).where(eq(memberships.userId, person.id))).toHaveLength(1);
  });
});
