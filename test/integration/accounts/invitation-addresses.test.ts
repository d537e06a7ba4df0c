// Who may accept an invitation: only an account whose verified GitHub
// addresses (GitHub's /user/emails at the last sign-in) hold the invited one,
// case aside, whether by the e-mailed link or from the welcome page; anyone
// else is refused with 403 saying what to do. And who may read the local
// inbox, where every invitation's link lands: the workspace's owner.
import { randomBytes } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { invitations, memberships, users, type Role } from "../../../db/schema";
import { demoPeople } from "../../../db/demo/scenario";
import { seedDemo } from "../../../db/seed";
import { uniqueName } from "../../support/names";
import {
  act,
  demoIds,
  load,
  loaderData,
  outcome,
  refusal,
  requestsAs,
  requestsWith,
  sessionCookieFor,
  type DemoIds,
  type FormRefusal,
  type MakeRequest,
} from "../../support/routes";
import { signInThroughGitHub } from "./support";
import { hashToken, type User } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { acceptInvitation } from "~/features/accounts/invitations.server";
import * as acceptPage from "~/routes/invitations/accept";
import * as localMail from "~/routes/local/mail";
import * as welcome from "~/routes/welcome";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

/** Someone who has signed in before: `email` is what GitHub gave as primary, `verified` every address it had verified. */
async function person(label: string, { email, verified }: { email?: string; verified: string[] }): Promise<User> {
  const login = uniqueName(label);
  const [user] = await database()
    .insert(users)
    .values({ login, name: login, email: email ?? `${login}@example.test`, verifiedEmails: verified })
    .returning();
  return user;
}

/** A pending invitation into the demo workspace, as `invite` stores one (the address lower-cased): its link's token and its id. */
async function invitation(email: string, role: Role = "viewer"): Promise<{ token: string; id: string }> {
  const token = randomBytes(24).toString("base64url");
  const [row] = await database()
    .insert(invitations)
    .values({ workspaceId: ids.workspaceId, email: email.toLowerCase(), role, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + 86_400_000) })
    .returning();
  return { token, id: row.id };
}

const roleIn = async (user: User): Promise<Role | null> =>
  (
    await database()
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.userId, user.id), eq(memberships.workspaceId, ids.workspaceId)))
  )[0]?.role ?? null;

const as = async (user: User): Promise<MakeRequest> => requestsWith(await sessionCookieFor(user.id));

describe("accepting by the e-mailed link", () => {
  test("another account is refused with 403 naming the invited address, partly masked, and what to do; the link still works for the invited person", async () => {
    const invited = `${uniqueName("dara")}@breakwater-lab.test`;
    const link = await invitation(invited, "owner");
    const stranger = await person("stranger", { verified: [`${uniqueName("stranger")}@elsewhere.test`] });
    const answer = await outcome<FormRefusal>(async () =>
      act(acceptPage, await (await as(stranger))("POST", `/invitations/${link.token}`), { token: link.token }),
    );
    expect(answer.status).toBe(403);
    expect(answer.body.error).toContain("@breakwater-lab.test");
    expect(answer.body.error).not.toContain(invited);
    expect(answer.body.error).toMatch(/verify that address on GitHub and sign in again/i);
    expect(answer.body.error).toMatch(/ask for an invitation to an address you have verified/i);
    expect(await roleIn(stranger)).toBeNull();

    const dara = await person("dara", { verified: [invited] });
    expect(await acceptInvitation(dara, { token: link.token })).toEqual({ workspaceId: ids.workspaceId, role: "owner" });
  });

  test("the invited address among the account's verified ones is accepted in any case, also when it is not the primary one", async () => {
    const invited = `${uniqueName("mixed")}@example.test`;
    const link = await invitation(invited);
    const user = await person("mixed", { email: `${uniqueName("primary")}@elsewhere.test`, verified: ["first@elsewhere.test", invited.toUpperCase()] });
    expect(await acceptInvitation(user, { token: link.token })).toEqual({ workspaceId: ids.workspaceId, role: "viewer" });
    expect(await roleIn(user)).toBe("viewer");
  });

  test("the invited address as the account's primary e-mail, but not verified on GitHub, is refused with 403", async () => {
    const invited = `${uniqueName("unverified")}@example.test`;
    const link = await invitation(invited, "lead");
    const user = await person("unverified", { email: invited, verified: [] });
    const refused = await refusal(() => acceptInvitation(user, { token: link.token }));
    expect(refused.status).toBe(403);
    expect(refused.message).toMatch(/verify that address on GitHub/i);
    expect(await roleIn(user)).toBeNull();
  });

  test("the invitation page tells another account, before it tries, why it cannot join, and shows the address only partly", async () => {
    const invited = `${uniqueName("page")}@example.test`;
    const link = await invitation(invited);
    type Page = { invitation: { email: string }; refusal: string | null };
    const open = async (user: User) =>
      (await outcome<Page>(async () => load(acceptPage, await (await as(user))("GET", `/invitations/${link.token}`), { token: link.token }))).body;
    const stranger = await open(await person("page-stranger", { verified: [] }));
    expect(stranger.invitation.email).not.toBe(invited);
    expect(stranger.refusal).toMatch(/verify that address on GitHub and sign in again/i);
    const invitee = await open(await person("page", { verified: [invited] }));
    expect([invitee.invitation.email, invitee.refusal]).toEqual([invited, null]);
  });
});

describe("accepting from the welcome page", () => {
  test("it offers the invitations to the account's verified addresses, not to an unverified primary one", async () => {
    const primary = `${uniqueName("primary")}@example.test`;
    const verified = `${uniqueName("verified")}@example.test`;
    const toPrimary = await invitation(primary);
    const toVerified = await invitation(verified);
    const user = await person("welcome", { email: primary, verified: [verified] });
    const page = await loaderData(welcome, await (await as(user))("GET", "/welcome"));
    const offered = page.invitations.map((entry) => entry.id);
    expect(offered).toContain(toVerified.id);
    expect(offered).not.toContain(toPrimary.id);
  });

  test("accepting by id an invitation to an unverified address is refused with 403; to a verified one it joins", async () => {
    const primary = `${uniqueName("primary")}@example.test`;
    const verified = `${uniqueName("verified")}@example.test`;
    const toPrimary = await invitation(primary, "owner");
    const toVerified = await invitation(verified, "animator");
    const user = await person("by-id", { email: primary, verified: [verified] });
    const request = await as(user);
    const refused = await outcome<FormRefusal>(async () =>
      act(welcome, await request("POST", "/welcome", { form: { intent: "accept", invitationId: toPrimary.id } })),
    );
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/verify that address on GitHub/i);
    expect(await roleIn(user)).toBeNull();
    const joined = await outcome(async () => act(welcome, await request("POST", "/welcome", { form: { intent: "accept", invitationId: toVerified.id } })));
    expect(joined.status).toBe(302);
    expect(await roleIn(user)).toBe("animator");
  });
});

describe("the local inbox, where every invitation's link lands", () => {
  test("signed out, it sends you to sign in", async () => {
    const answer = await outcome(async () => load(localMail, await (await requestsAs("signed-out", ids))("GET", "/local/mail")));
    expect(answer.status).toBe(302);
    expect(answer.location).toMatch(/^\/sign-in\?returnTo=%2Flocal%2Fmail/);
  });

  test.each(["lead", "animator", "firmware", "viewer"] as const)("a %s is refused with 403", async (role) => {
    const answer = await outcome(async () => load(localMail, await (await requestsAs(role, ids))("GET", "/local/mail")));
    expect(answer.status).toBe(403);
  });

  test("the workspace's owner reads it", async () => {
    const page = await loaderData(localMail, await (await requestsAs("owner", ids))("GET", "/local/mail"));
    expect(Array.isArray(page.messages)).toBe(true);
  });
});

describe("signing in keeps the addresses GitHub has verified", () => {
  test("a verified address is kept lower-cased; an unverified one is not kept", async () => {
    const login = uniqueName("newcomer");
    await signInThroughGitHub({ login, email: `${login}@Example.TEST` });
    const unverifiedLogin = uniqueName("unverified");
    await signInThroughGitHub({ login: unverifiedLogin, email: `${unverifiedLogin}@example.test`, unverified: true });
    const rows = await database()
      .select({ login: users.login, email: users.email, verifiedEmails: users.verifiedEmails })
      .from(users)
      .where(inArray(users.login, [login, unverifiedLogin]));
    const byLogin = Object.fromEntries(rows.map((row) => [row.login, row]));
    expect(byLogin[login].verifiedEmails).toEqual([`${login}@example.test`]);
    expect(byLogin[unverifiedLogin].verifiedEmails).toEqual([]);
  });

  test("the demo people have their addresses verified, so local mode's invitations work", async () => {
    const rows = await database()
      .select({ login: users.login, verifiedEmails: users.verifiedEmails })
      .from(users)
      .where(
        inArray(
          users.login,
          demoPeople.map((entry) => entry.login),
        ),
      );
    expect(Object.fromEntries(rows.map((row) => [row.login, row.verifiedEmails]))).toEqual(
      Object.fromEntries(demoPeople.map((entry) => [entry.login, [entry.email.toLowerCase()]])),
    );
  });
});
