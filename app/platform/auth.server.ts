// Sign-in with GitHub through remix-auth. The verify step reads the person's
// profile and e-mail addresses, then finds or creates their user row.
import { eq } from "drizzle-orm";
import { Authenticator } from "remix-auth";
import { users } from "../../db/schema";
import { recordAudit } from "./audit.server";
import { config } from "./config.server";
import { database } from "./db.server";
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

export async function upsertGitHubUser({ profile, email, verifiedEmails }: GitHubPerson): Promise<User> {
  const db = database();
  const values = { githubId: profile.id, login: profile.login, name: profile.name || profile.login, email, verifiedEmails, avatarUrl: profile.avatar_url };
  // A seeded or invited person may exist by login before their first sign-in.
  const [byGitHub] = await db.select().from(users).where(eq(users.githubId, profile.id));
  const [byLogin] = byGitHub ? [byGitHub] : await db.select().from(users).where(eq(users.login, profile.login));
  const [user] = byLogin ? await db.update(users).set(values).where(eq(users.id, byLogin.id)).returning() : await db.insert(users).values(values).returning();
  await recordAudit({ workspaceId: null, actorId: user.id, action: "user.signed-in", targetType: "user", targetId: user.id });
  return user;
}
