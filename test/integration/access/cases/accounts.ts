// Access cases for the shell, sign-in, workspaces, members, invitations, tokens and audit.
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { apiTokens, invitations, memberships, users } from "../../../../db/schema";
import { act, load, sessionCookieFor, type Caller, type DemoIds } from "../../../support/routes";
import { uniqueName } from "../../../support/names";
import type { RouteCase } from "../support";
import { hashToken } from "~/platform/access.server";
import { publicSessionId, sessionStorage } from "~/platform/session.server";
import * as root from "~/root";
import * as healthz from "~/routes/healthz";
import * as shell from "~/routes/shell";
import * as home from "~/routes/home";
import * as signIn from "~/routes/auth/sign-in";
import * as github from "~/routes/auth/github";
import * as githubCallback from "~/routes/auth/github-callback";
import * as signOut from "~/routes/auth/sign-out";
import * as workspaceSwitch from "~/routes/workspace-switch";
import * as welcome from "~/routes/welcome";
import * as acceptInvitation from "~/routes/invitations/accept";
import * as accountSessions from "~/routes/account/sessions";
import * as settingsLayout from "~/routes/settings/layout";
import * as workspaceSettings from "~/routes/settings/workspace";
import * as members from "~/routes/settings/members";
import * as tokens from "~/routes/settings/tokens";
import * as audit from "~/routes/settings/audit";
import * as localMail from "~/routes/local/mail";
import * as gaitList from "~/routes/gaits/list";
import * as reviews from "~/routes/reviews";
import * as notFound from "~/routes/not-found";
import * as apiWorkspace from "~/routes/api.v1/workspace";

async function throwawayMember(db: Parameters<NonNullable<RouteCase["prepare"]>>[0], workspaceId: string) {
  const login = uniqueName("throwaway");
  const [user] = await db
    .insert(users)
    .values({ login, name: login, email: `${login}@example.test` })
    .returning();
  await db.insert(memberships).values({ workspaceId, userId: user.id, role: "viewer" });
  return { userId: user.id };
}

async function pendingInvitation(
  db: Parameters<NonNullable<RouteCase["prepare"]>>[0],
  workspaceId: string,
  role: "viewer" | "owner" = "viewer",
  email = `${uniqueName("invitee")}@example.test`,
) {
  const token = randomBytes(12).toString("base64url");
  const [row] = await db
    .insert(invitations)
    .values({ workspaceId, email: email.toLowerCase(), role, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + 86_400_000) })
    .returning();
  return { token, invitationId: row.id };
}

/**
 * An invitation to the caller's own (verified) address, into the demo
 * workspace they are already in: accepting marks it and adds no membership.
 */
async function invitationToCaller(db: Parameters<NonNullable<RouteCase["prepare"]>>[0], ids: DemoIds, caller: Caller) {
  const [user] = await db
    .select({ email: users.email })
    .from(users)
    .where(eq(users.id, ids.userIds[caller === "signed-out" ? "viewer" : caller]));
  return pendingInvitation(db, ids.workspaceId, "viewer", user.email);
}

export const cases: RouteCase[] = [
  { name: "GET (root)", route: "root.tsx", kind: "loader", run: (req) => req("GET", "/").then((r) => load(root, r)) },
  { name: "GET /healthz", route: "routes/healthz.ts", kind: "loader", run: () => healthz.loader() },
  { name: "GET (shell)", route: "routes/shell.tsx", kind: "loader", run: (req) => req("GET", "/").then((r) => load(shell, r)) },
  { name: "GET /", route: "routes/home.tsx", kind: "loader", run: (req) => req("GET", "/").then((r) => load(home, r)) },
  {
    name: "GET /sign-in",
    route: "routes/auth/sign-in.tsx",
    kind: "loader",
    run: (req) => req("GET", "/sign-in").then((r) => load(signIn, r)),
  },
  {
    name: "POST /auth/github",
    route: "routes/auth/github.ts",
    kind: "action",
    run: (req) => req("POST", "/auth/github", { form: { returnTo: "/robots" } }).then((r) => act(github, r)),
  },
  {
    name: "GET /auth/github/callback (no state: back to the authorize page)",
    route: "routes/auth/github-callback.ts",
    kind: "loader",
    run: (req) => req("GET", "/auth/github/callback").then((r) => load(githubCallback, r)),
  },
  {
    name: "POST /sign-out",
    route: "routes/auth/sign-out.ts",
    kind: "action",
    run: (req) => req("POST", "/sign-out").then((r) => act(signOut, r)),
  },
  {
    name: "POST /workspace (switch)",
    route: "routes/workspace-switch.ts",
    kind: "action",
    run: (req, ids) => req("POST", "/workspace", { form: { workspaceId: ids.workspaceId, returnTo: "/robots" } }).then((r) => act(workspaceSwitch, r)),
  },
  { name: "GET /welcome", route: "routes/welcome.tsx", kind: "loader", run: (req) => req("GET", "/welcome").then((r) => load(welcome, r)) },
  {
    name: "POST /welcome (create a workspace)",
    route: "routes/welcome.tsx",
    kind: "action",
    intent: "create",
    run: (req) => req("POST", "/welcome", { form: { intent: "create", name: uniqueName("Lab") } }).then((r) => act(welcome, r)),
  },
  {
    name: "POST /welcome (accept an invitation sent to one's e-mail)",
    route: "routes/welcome.tsx",
    kind: "action",
    intent: "accept",
    prepare: invitationToCaller,
    run: (req, _ids, { invitationId }) => req("POST", "/welcome", { form: { intent: "accept", invitationId } }).then((r) => act(welcome, r)),
  },
  {
    name: "GET /invitations/:token",
    route: "routes/invitations/accept.tsx",
    kind: "loader",
    prepare: (db, ids) => pendingInvitation(db, ids.workspaceId),
    run: (req, _ids, { token }) => req("GET", `/invitations/${token}`).then((r) => load(acceptInvitation, r, { token })),
  },
  {
    name: "POST /invitations/:token (accept)",
    route: "routes/invitations/accept.tsx",
    kind: "action",
    prepare: invitationToCaller,
    run: (req, _ids, { token }) => req("POST", `/invitations/${token}`).then((r) => act(acceptInvitation, r, { token })),
  },
  {
    name: "GET /account/sessions",
    route: "routes/account/sessions.tsx",
    kind: "loader",
    run: (req) => req("GET", "/account/sessions").then((r) => load(accountSessions, r)),
  },
  {
    name: "POST /account/sessions (end another of one's sessions)",
    route: "routes/account/sessions.tsx",
    kind: "action",
    intent: "end",
    prepare: async (_db, ids, caller) => {
      const other = await sessionCookieFor(ids.userIds[caller === "signed-out" ? "viewer" : caller]);
      const id = (await sessionStorage().getSession(other)).id;
      return { sessionId: publicSessionId(id) };
    },
    run: (req, _ids, { sessionId }) => req("POST", "/account/sessions", { form: { intent: "end", sessionId } }).then((r) => act(accountSessions, r)),
  },
  {
    name: "POST /account/sessions (sign out everywhere)",
    route: "routes/account/sessions.tsx",
    kind: "action",
    intent: "end-all",
    run: (req) => req("POST", "/account/sessions", { form: { intent: "end-all" } }).then((r) => act(accountSessions, r)),
  },
  {
    name: "GET /settings (layout)",
    route: "routes/settings/layout.tsx",
    kind: "loader",
    run: (req) => req("GET", "/settings").then((r) => load(settingsLayout, r)),
  },
  {
    name: "GET /settings",
    route: "routes/settings/workspace.tsx",
    kind: "loader",
    run: (req) => req("GET", "/settings").then((r) => load(workspaceSettings, r)),
  },
  {
    name: "POST /settings (rename)",
    route: "routes/settings/workspace.tsx",
    kind: "action",
    run: (req) => req("POST", "/settings", { form: { name: "Breakwater Robotics Lab" } }).then((r) => act(workspaceSettings, r)),
  },
  {
    name: "GET /settings/members",
    route: "routes/settings/members.tsx",
    kind: "loader",
    run: (req) => req("GET", "/settings/members").then((r) => load(members, r)),
  },
  {
    name: "POST /settings/members (change a role)",
    route: "routes/settings/members.tsx",
    kind: "action",
    intent: "change-role",
    prepare: (db, ids) => throwawayMember(db, ids.workspaceId),
    run: (req, _ids, { userId }) =>
      req("POST", "/settings/members", { form: { intent: "change-role", userId, role: "animator" } }).then((r) => act(members, r)),
  },
  {
    name: "POST /settings/members (remove)",
    route: "routes/settings/members.tsx",
    kind: "action",
    intent: "remove",
    prepare: (db, ids) => throwawayMember(db, ids.workspaceId),
    run: (req, _ids, { userId }) => req("POST", "/settings/members", { form: { intent: "remove", userId } }).then((r) => act(members, r)),
  },
  {
    name: "POST /settings/members (invite a viewer)",
    route: "routes/settings/members.tsx",
    kind: "action",
    intent: "invite",
    run: (req) =>
      req("POST", "/settings/members", { form: { intent: "invite", email: `${uniqueName("new")}@example.test`, role: "viewer" } }).then((r) => act(members, r)),
  },
  {
    name: "POST /settings/members (resend)",
    route: "routes/settings/members.tsx",
    kind: "action",
    intent: "resend",
    prepare: (db, ids) => pendingInvitation(db, ids.workspaceId),
    run: (req, _ids, { invitationId }) => req("POST", "/settings/members", { form: { intent: "resend", invitationId } }).then((r) => act(members, r)),
  },
  {
    name: "POST /settings/members (revoke)",
    route: "routes/settings/members.tsx",
    kind: "action",
    intent: "revoke",
    prepare: (db, ids) => pendingInvitation(db, ids.workspaceId),
    run: (req, _ids, { invitationId }) => req("POST", "/settings/members", { form: { intent: "revoke", invitationId } }).then((r) => act(members, r)),
  },
  {
    name: "GET /settings/tokens",
    route: "routes/settings/tokens.tsx",
    kind: "loader",
    run: (req) => req("GET", "/settings/tokens").then((r) => load(tokens, r)),
  },
  {
    name: "POST /settings/tokens (create)",
    route: "routes/settings/tokens.tsx",
    kind: "action",
    intent: "create",
    run: (req) => req("POST", "/settings/tokens", { form: { intent: "create", name: uniqueName("build") } }).then((r) => act(tokens, r)),
  },
  {
    name: "POST /settings/tokens (revoke one's own)",
    route: "routes/settings/tokens.tsx",
    kind: "action",
    intent: "revoke",
    prepare: async (db, ids, caller) => {
      const userId = caller === "signed-out" ? ids.userIds.owner : ids.userIds[caller];
      const [row] = await db
        .insert(apiTokens)
        .values({ workspaceId: ids.workspaceId, userId, name: uniqueName("old"), tokenHash: hashToken(uniqueName("t")), prefix: "gl_xxxxxx" })
        .returning();
      return { tokenId: row.id };
    },
    run: (req, _ids, { tokenId }) => req("POST", "/settings/tokens", { form: { intent: "revoke", tokenId } }).then((r) => act(tokens, r)),
  },
  {
    name: "GET /settings/audit",
    route: "routes/settings/audit.tsx",
    kind: "loader",
    run: (req) => req("GET", "/settings/audit").then((r) => load(audit, r)),
  },
  {
    name: "GET /local/mail",
    route: "routes/local/mail.tsx",
    kind: "loader",
    run: (req) => req("GET", "/local/mail").then((r) => load(localMail, r)),
  },
  {
    name: "GET /gaits",
    route: "routes/gaits/list.tsx",
    kind: "loader",
    run: (req) => req("GET", "/gaits").then((r) => load(gaitList, r)),
  },
  {
    name: "GET /reviews",
    route: "routes/reviews.tsx",
    kind: "loader",
    run: (req) => req("GET", "/reviews").then((r) => load(reviews, r)),
  },
  {
    name: "GET /no/such/page",
    route: "routes/not-found.tsx",
    kind: "loader",
    allowedStatus: 404,
    run: () => Promise.resolve(notFound.loader()),
  },
  {
    name: "GET /api/v1/workspace",
    route: "routes/api.v1/workspace.ts",
    kind: "loader",
    run: (req) => req("GET", "/api/v1/workspace").then((r) => load(apiWorkspace, r)),
  },
];
