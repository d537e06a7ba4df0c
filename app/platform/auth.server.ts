// Sign-in with GitHub through remix-auth. The verify step reads the person's
// profile and e-mail addresses, then finds or creates their user row.
import { eq } from "drizzle-orm";
import { Authenticator } from "remix-auth";
import { users } from "../../db/schema";
import { recordAudit } from "./audit.server";
import { config } from "./config.server";
import { database, type Tx } from "./db.server";
import { ConfigurableGitHubStrategy } from "./github-strategy.server";
import type { User } from "./access.server";

type GitHubProfile = { id: number; login: string; name: string | null; email: string | null; avatar_url: string | null };
type GitHubEmail = { email: string; primary: boolean; verified: boolean };

let authenticator: Authenticator<User> | undefined;

export function gitHubAuthenticator(): Authenticator<User> {
  if (authenticator) return authenticator;
  const settings = config();
  authenticator = new Authenticator<User>();
  authenticator.use(
    new ConfigurableGitHubStrategy<User>(
      {
        clientId: settings.github.clientId,
        clientSecret: settings.github.clientSecret,
        redirectURI: `${settings.publicUrl}/auth/github/callback`,
        oauthUrl: settings.github.oauthUrl,
        scopes: ["read:user", "user:email"],
        cookie: { name: "gaitloom_oauth", sameSite: "Lax", httpOnly: true, path: "/", ...(settings.mode === "production" ? { secure: true } : {}) },
      },
      async ({ tokens }) => upsertGitHubUser(await fetchGitHubPerson(tokens.accessToken())),
    ),
    "github",
  );
  return authenticator;
}

type GitHubPerson = { profile: GitHubProfile; email: string; verifiedEmails: string[] };

async function fetchGitHubPerson(accessToken: string): Promise<GitHubPerson> {
  const api = config().github.apiUrl;
  const headers = { Authorization: `Bearer ${accessToken}`, Accept: "application/vnd.github+json", "User-Agent": "Gaitloom" };
  const profileResponse = await fetch(`${api}/user`, { headers });
  if (!profileResponse.ok) throw new Error(`GitHub answered ${profileResponse.status} for the profile.`);
  const profile = (await profileResponse.json()) as GitHubProfile;
  const emailsResponse = await fetch(`${api}/user/emails`, { headers });
  const listed: unknown = emailsResponse.ok ? await emailsResponse.json() : [];
  const emails = Array.isArray(listed) ? (listed as GitHubEmail[]) : [];
  const email = emails.find((e) => e.primary && e.verified)?.email ?? profile.email;
  if (!email) throw new Error("GitHub gave no verified e-mail address for this account.");
  // Only what GitHub vouches for may accept an invitation (the profile's address need not be verified).
  const verifiedEmails = [...new Set(emails.filter((e) => e.verified === true && typeof e.email === "string").map((e) => e.email.toLowerCase()))];
  return { profile, email, verifiedEmails };
}

/**
 * GitHub gives a login up and then to someone else; the earlier holder's row
 * keeps its account under the old login marked with its GitHub id until they
 * sign in again under their current one.
 */
async function releaseLogin(tx: Tx, login: string, keeperId: string | null): Promise<void> {
  const [holder] = await tx.select().from(users).where(eq(users.login, login)).for("update");
  if (!holder || holder.id === keeperId) return;
  await tx
    .update(users)
    .set({ login: `${login}~${holder.githubId ?? holder.id}` })
    .where(eq(users.id, holder.id));
}

export async function upsertGitHubUser({ profile, email, verifiedEmails }: GitHubPerson): Promise<User> {
  const db = database();
  const values = { githubId: profile.id, login: profile.login, name: profile.name || profile.login, email, verifiedEmails, avatarUrl: profile.avatar_url };
  const user = await db.transaction(async (tx) => {
    const [byGitHub] = await tx.select().from(users).where(eq(users.githubId, profile.id)).for("update");
    if (byGitHub) {
      await releaseLogin(tx, profile.login, byGitHub.id);
      return (await tx.update(users).set(values).where(eq(users.id, byGitHub.id)).returning())[0];
    }
    // A seeded or invited person may exist by login before their first sign-in; a
    // row linked to another GitHub account is that person's, whatever login they hold now.
    const [byLogin] = await tx.select().from(users).where(eq(users.login, profile.login)).for("update");
    if (byLogin && byLogin.githubId === null) return (await tx.update(users).set(values).where(eq(users.id, byLogin.id)).returning())[0];
    await releaseLogin(tx, profile.login, null);
    return (await tx.insert(users).values(values).returning())[0];
  });
  await recordAudit({ workspaceId: null, actorId: user.id, action: "user.signed-in", targetType: "user", targetId: user.id });
  return user;
}
