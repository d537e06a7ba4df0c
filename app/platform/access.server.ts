// Who is asking, in which workspace, with which role — and may they? Every
// loader, action and API route goes through requireAccess or requireApiAccess.
import { createHash } from "node:crypto";
import { and, asc, eq, isNull, sql } from "drizzle-orm";
import { data, redirect } from "react-router";
import { apiTokens, memberships, users, workspaces, type Role } from "../../db/schema";
import { apiError } from "./errors.server";
import { formatTime } from "./format";
import type { Database } from "../../db/client";
import { database } from "./db.server";
import { type Action, can, refusal } from "./permissions";
import { checkFailedTokenAttempts, countFailedTokenAttempt, countRequest, type Verdict } from "./rate-limit.server";
import { readSession, RETURN_TO_LIMIT } from "./session.server";

export type User = typeof users.$inferSelect;
export type Workspace = typeof workspaces.$inferSelect;
export type Member = { user: User; workspace: Workspace; role: Role };
export type ApiMember = Member & { tokenId: string | null };

export async function currentUser(request: Request): Promise<User | null> {
  const session = await readSession(request);
  const userId = session.get("userId");
  if (!userId) return null;
  const [user] = await database().select().from(users).where(eq(users.id, userId));
  return user ?? null;
}

export async function membershipsOf(userId: string): Promise<{ workspace: Workspace; role: Role }[]> {
  return database()
    .select({ workspace: workspaces, role: memberships.role })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt));
}

/** The signed-in person's chosen workspace, or their first one; null when signed out or in none. */
export async function currentMember(request: Request): Promise<Member | null> {
  const user = await currentUser(request);
  if (!user) return null;
  const session = await readSession(request);
  const all = await membershipsOf(user.id);
  const chosen = all.find((m) => m.workspace.id === session.get("workspaceId")) ?? all[0];
  return chosen ? { user, ...chosen } : null;
}

const isRead = (request: Request) => request.method === "GET" || request.method === "HEAD";

export async function requireUser(request: Request): Promise<User> {
  const user = await currentUser(request);
  if (user) return user;
  if (isRead(request)) {
    const url = new URL(request.url);
    // Sign-in keeps 2 KB of return address at most: a longer one goes back to the path alone, or home.
    const address = [url.pathname + url.search, url.pathname].find((candidate) => candidate.length <= RETURN_TO_LIMIT) ?? "/";
    throw redirect(`/sign-in?returnTo=${encodeURIComponent(address)}`);
  }
  throw data({ message: "Sign in first." }, { status: 401 });
}

/**
 * Pages and form actions: redirects to sign-in or onboarding, 403 with a
 * message when the role cannot. Given several actions (a form whose intent is
 * unknown: app/platform/intent-form.server.ts), the role must hold one of them.
 */
export async function requireAccess(request: Request, action: Action | readonly Action[]): Promise<Member> {
  const user = await requireUser(request);
  const member = await currentMember(request);
  if (!member) {
    if (isRead(request)) throw redirect("/welcome");
    throw data({ message: "You are not a member of any workspace yet." }, { status: 403 });
  }
  const actions = typeof action === "string" ? [action] : action;
  if (!actions.some((one) => can(member.role, one))) throw data({ message: refusal(member.role, actions[0]) }, { status: 403 });
  return { ...member, user };
}

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

/** /api/v1 routes: a bearer token (no cookie, no Origin needed) or the browser session; JSON errors. */
export async function requireApiAccess(request: Request, action: Action): Promise<ApiMember> {
  const header = request.headers.get("Authorization");
  if (header) {
    const token = header.match(/^Bearer\s+(\S+)$/i)?.[1];
    if (!token) throw apiError(401, "unauthorized", "The Authorization header must read `Bearer <token>`.");
    refuseOver(await checkFailedTokenAttempts(), "Too many unknown or revoked tokens from this address");
    const member = await memberForToken(token);
    if (!member) {
      await countFailedTokenAttempt();
      throw apiError(401, "unauthorized", "This API token is unknown or revoked.");
    }
    if ("expired" in member) {
      throw apiError(
        401,
        "unauthorized",
        `This API token (${member.expired.name}) expired at ${formatTime(member.expired.at)}; create a new one in Settings → API tokens.`,
      );
    }
    refuseOver(await countRequest("token", member.tokenId!), "Too many requests with this token");
    if (!can(member.role, action)) throw apiError(403, "forbidden", refusal(member.role, action));
    return member;
  }
  const member = await currentMember(request);
  if (!member) {
    const user = await currentUser(request);
    if (!user) throw apiError(401, "unauthorized", "Sign in, or send `Authorization: Bearer <token>`.");
    throw apiError(403, "forbidden", "You are not a member of any workspace yet.");
  }
  refuseOver(await countRequest("session", member.user.id), "Too many API requests from your account");
  if (!can(member.role, action)) throw apiError(403, "forbidden", refusal(member.role, action));
  return { ...member, tokenId: null };
}

function refuseOver(verdict: Verdict, sentence: string): void {
  if (verdict.ok) return;
  throw apiError(429, "rate_limited", `${sentence}; try again in ${verdict.retryAfterS} s.`, undefined, { "Retry-After": String(verdict.retryAfterS) });
}

// Every API call looks its token up: built once per pool as a prepared statement.
const tokenLookups = new WeakMap<Database, ReturnType<typeof prepareTokenLookup>>();

function prepareTokenLookup(db: Database) {
  return (
    db
      .select({ token: apiTokens, user: users, workspace: workspaces, role: memberships.role })
      .from(apiTokens)
      .innerJoin(users, eq(users.id, apiTokens.userId))
      .innerJoin(workspaces, eq(workspaces.id, apiTokens.workspaceId))
      // The token acts with the holder's current role; a removed member's tokens stop working.
      .innerJoin(memberships, and(eq(memberships.userId, apiTokens.userId), eq(memberships.workspaceId, apiTokens.workspaceId)))
      .where(and(eq(apiTokens.tokenHash, sql.placeholder("tokenHash")), isNull(apiTokens.revokedAt)))
      .prepare("member_for_token")
  );
}

/** The member a token acts as; the token's name and end when it has expired; null when it is unknown, revoked or its holder may no longer hold one. */
async function memberForToken(token: string): Promise<ApiMember | { expired: { name: string; at: Date } } | null> {
  const db = database();
  let lookup = tokenLookups.get(db);
  if (!lookup) tokenLookups.set(db, (lookup = prepareTokenLookup(db)));
  const [row] = await lookup.execute({ tokenHash: hashToken(token) });
  if (!row || !can(row.role, "tokens.manage")) return null;
  if (row.token.expiresAt && row.token.expiresAt.getTime() <= Date.now()) return { expired: { name: row.token.name, at: row.token.expiresAt } };
  // Last-used time to the minute is enough, and saves a write per request.
  const now = new Date();
  if (!row.token.lastUsedAt || now.getTime() - row.token.lastUsedAt.getTime() > 60_000) {
    await db.update(apiTokens).set({ lastUsedAt: now }).where(eq(apiTokens.id, row.token.id));
  }
  return { user: row.user, workspace: row.workspace, role: row.role, tokenId: row.token.id };
}
