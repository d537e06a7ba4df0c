// An invitation link opened while signed out goes through the sign-in page,
// which names the invitation (workspace, role, who sent it, the address only
// partly) or says why the link no longer works; joining lands on the start
// page with a confirmation of the workspace and role.
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { invitations, users, type Role } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { uniqueName } from "../../support/names";
import { act, demoIds, loaderData, outcome, requestsWith, sessionCookieFor, type DemoIds } from "../../support/routes";
import { hashToken, type User } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import * as home from "~/routes/home";
import * as acceptPage from "~/routes/invitations/accept";
import * as signIn from "~/routes/auth/sign-in";
import * as welcome from "~/routes/welcome";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function person(label: string, verified: string): Promise<User> {
  const login = uniqueName(label);
  const [user] = await database()
    .insert(users)
    .values({ login, name: login, email: verified, verifiedEmails: [verified] })
    .returning();
  return user;
}

/** A pending invitation into the demo workspace from its owner; `ended` marks it used or revoked. */
async function invitation(email: string, role: Role, ended?: "accepted" | "revoked"): Promise<{ token: string; id: string }> {
  const token = randomBytes(24).toString("base64url");
  const [row] = await database()
    .insert(invitations)
    .values({
      workspaceId: ids.workspaceId,
      email,
      role,
      tokenHash: hashToken(token),
      invitedById: ids.userIds.owner,
      expiresAt: new Date(Date.now() + 86_400_000),
      ...(ended === "accepted" ? { acceptedAt: new Date() } : ended === "revoked" ? { revokedAt: new Date() } : {}),
    })
    .returning();
  return { token, id: row.id };
}

const signedOut = requestsWith(null);
const signInPage = async (returnTo: string) => loaderData(signIn, await signedOut("GET", `/sign-in?returnTo=${encodeURIComponent(returnTo)}`));

describe("the sign-in page on the way to an invitation", () => {
  test("names the workspace, the role and who invited, and shows the invited address only partly", async () => {
    const email = `${uniqueName("newcomer")}@harbour.test`;
    const { token } = await invitation(email, "animator");
    const page = await signInPage(`/invitations/${token}`);
    expect(page.returnTo).toBe(`/invitations/${token}`);
    expect(page.invitation).toEqual({
      state: "open",
      workspaceName: "Breakwater Robotics Lab",
      role: "animator",
      invitedBy: "Ines Okafor",
      email: `${email[0]}***@harbour.test`,
    });
  });

  test("says why a used, revoked or unknown link no longer works, before any sign-in", async () => {
    const used = await invitation(`${uniqueName("used")}@harbour.test`, "viewer", "accepted");
    const revoked = await invitation(`${uniqueName("revoked")}@harbour.test`, "viewer", "revoked");
    expect((await signInPage(`/invitations/${used.token}`)).invitation).toEqual({ state: "ended", reason: "This invitation link was already used." });
    expect((await signInPage(`/invitations/${revoked.token}`)).invitation).toMatchObject({ state: "ended", reason: expect.stringMatching(/revoked/) });
    expect((await signInPage("/invitations/not-a-link")).invitation).toMatchObject({ state: "ended", reason: expect.stringMatching(/not valid/) });
  });

  test("says nothing of invitations on the way to any other page", async () => {
    expect((await signInPage("/robots")).invitation).toBeNull();
    expect((await signInPage("/invitations/a/b")).invitation).toBeNull();
  });
});

describe("joining confirms the workspace and role", () => {
  test("by the link: the start page says which workspace was joined and as what", async () => {
    const email = `${uniqueName("joiner")}@harbour.test`;
    const { token } = await invitation(email, "animator");
    const user = await person("joiner", email);
    const cookie = await sessionCookieFor(user.id);
    const joined = await outcome(async () => act(acceptPage, await requestsWith(cookie)("POST", `/invitations/${token}`), { token }));
    expect(joined.status).toBe(302);
    expect(joined.location).toBe(`/?joined=${ids.workspaceId}`);
    const after = joined.headers.getSetCookie().map((line) => line.split(";")[0]);
    const start = await loaderData(home, await requestsWith(after.join("; ") || cookie)("GET", joined.location!));
    expect(start.joined).toEqual({ workspaceName: "Breakwater Robotics Lab", role: "animator" });
  });

  test("from the welcome page, the same", async () => {
    const email = `${uniqueName("welcomed")}@harbour.test`;
    const { id } = await invitation(email, "viewer");
    const user = await person("welcomed", email);
    const cookie = await sessionCookieFor(user.id);
    const joined = await outcome(async () => act(welcome, await requestsWith(cookie)("POST", "/welcome", { form: { intent: "accept", invitationId: id } })));
    expect(joined.location).toBe(`/?joined=${ids.workspaceId}`);
  });

  test("the start page says nothing for a workspace the person is not in, or a made-up value", async () => {
    const email = `${uniqueName("other")}@harbour.test`;
    const user = await person("other", email);
    const cookie = await sessionCookieFor(user.id);
    expect((await loaderData(home, await requestsWith(cookie)("GET", `/?joined=${ids.workspaceId}`))).joined).toBeNull();
    expect((await loaderData(home, await requestsWith(cookie)("GET", "/?joined=nonsense"))).joined).toBeNull();
  });
});

test("the invitation row is untouched by the sign-in page", async () => {
  const { token, id } = await invitation(`${uniqueName("untouched")}@harbour.test`, "viewer");
  await signInPage(`/invitations/${token}`);
  const [row] = await database().select().from(invitations).where(eq(invitations.id, id));
  expect([row.acceptedAt, row.revokedAt]).toEqual([null, null]);
});
