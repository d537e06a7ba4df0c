// Which Gaitloom account a GitHub sign-in lands in. GitHub's numeric id is the
// person; a login is only a name that GitHub lets go and gives to someone
// else. A row found by login is claimed only when no GitHub account is linked
// to it yet (a seeded or invited person before their first sign-in).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { memberships, users } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { upsertGitHubUser } from "~/platform/auth.server";
import { database } from "~/platform/db.server";

const person = (id: number, login: string, email: string) => ({
  profile: { id, login, name: login, email, avatar_url: null },
  email,
  verifiedEmails: [email],
});

beforeAll(async () => {
  await seedDemo(database());
});

describe("a GitHub sign-in finds its account by GitHub id, and by login only while no GitHub account is linked", () => {
  test("someone who now holds a linked person's old login gets an account of their own, not theirs", async () => {
    const db = database();
    const [theo] = await db.select().from(users).where(eq(users.login, "theo-brandt"));
    expect(theo.githubId).not.toBeNull();
    const newcomer = await upsertGitHubUser(person(987_001, "theo-brandt", "someone@elsewhere.test"));
    expect(newcomer.id).not.toBe(theo.id);
    expect(await db.select().from(memberships).where(eq(memberships.userId, newcomer.id))).toEqual([]);
    const [theoAfter] = await db.select().from(users).where(eq(users.id, theo.id));
    expect(theoAfter.githubId).toBe(theo.githubId);
    expect(theoAfter.email).toBe(theo.email);
    // Theo signs in again under his new login: his own account, with his memberships.
    const back = await upsertGitHubUser(person(theo.githubId!, "theo-b", theo.email));
    expect(back.id).toBe(theo.id);
    expect(back.login).toBe("theo-b");
    expect((await db.select().from(memberships).where(eq(memberships.userId, theo.id))).length).toBeGreaterThan(0);
  });

  test("a person seeded by login before their first sign-in is claimed by it", async () => {
    const db = database();
    const [seeded] = await db.insert(users).values({ login: "first-timer", name: "First Timer", email: "first@breakwater-lab.test" }).returning();
    const signedIn = await upsertGitHubUser(person(987_002, "first-timer", "first@breakwater-lab.test"));
    expect(signedIn.id).toBe(seeded.id);
    expect(signedIn.githubId).toBe(987_002);
  });
});
