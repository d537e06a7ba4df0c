// Who the probe is, and what ids it knows, learnt over HTTP from the app it
// probes: each demo person signs in through the local GitHub stand-in; the
// owner, the lead and firmware make API tokens (firmware also one it then
// revokes); a newcomer makes a second workspace with a robot, a gait, a
// version, a calibration profile and an invitation, whose ids are the "other
// workspace's" ones; the demo workspace's ids come from its API and pages.
// Sessions are ended on purpose (signed out, signed out everywhere) to be
// sent again, and an invitation no caller may accept is set aside.
import { demoPeople } from "../../db/demo/scenario";
import type { Role } from "../../db/schema";

export type Identity = {
  name: string;
  /** The role it acts with in the demo workspace; "outsider" for the second workspace's owner. */
  as: Role | "signed-out" | "outsider" | "hostile";
  cookie?: string;
  authorization?: string;
};

export type Ids = {
  workspace: string;
  robots: string[];
  revisions: { robotId: string; number: number }[];
  gaits: string[];
  versions: { gaitId: string; number: number; id: string }[];
  drafts: { gaitId: string; revision: number; robotId: string }[];
  profiles: { robotId: string; id: string; revision: number }[];
  users: string[];
  invitations: string[];
  invitationTokens: string[];
};

export type World = {
  origin: URL;
  /** The GitHub stand-in's origin, where /auth/github may send people. */
  githubOrigin: string;
  identities: Identity[];
  ids: Ids;
  foreign: Ids;
  /** Each robot's newest definition, by id (both workspaces). */
  definitions: Record<string, unknown>;
  /** Each gait's draft sequence, by gait id (both workspaces). */
  sequences: Record<string, unknown>;
  openApi: unknown;
  /** The session cookies other callers go on using: a target that ends the caller's session gets `throwaway` instead. */
  liveSessions: string[];
  /** A newcomer's session of its own to lose, for the targets that end the caller's session. */
  throwaway: string;
  /** Sessions ended since they were made (signed out, signed out everywhere): every request with one that needs more than "public" must be refused. */
  endedSessions: Identity[];
  /**
   * An invitation into the demo workspace to an address no caller has
   * verified: every caller's acceptance must be refused with 403. Left out of
   * `ids`, so no request resends or revokes it.
   */
  foreignInvitation: { token: string; id: string } | null;
  /** A token of firmware's no other case uses, for the limit two app processes share. */
  limitToken: string;
};

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g;

export const isLoopbackHost = (host: string) => host === "localhost" || host === "[::1]" || host === "::1" || /^127\.\d+\.\d+\.\d+$/.test(host);

class Jar {
  private cookies = new Map<string, string>();
  take(response: Response) {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(";");
      const at = pair.indexOf("=");
      const name = pair.slice(0, at).trim();
      const value = pair.slice(at + 1).trim();
      const expired = attributes.some((attribute) => /^\s*max-age=0\s*$/i.test(attribute) || /^\s*expires=thu, 01 jan 1970/i.test(attribute));
      if (expired || value === "") this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }
  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join("; ");
  }
  get(name: string) {
    return this.cookies.get(name);
  }
}

type Call = { method?: string; form?: Record<string, string>; json?: unknown; jar?: Jar; token?: string; follow?: false };

export class Setup {
  readonly origin: URL;
  githubOrigin = "";
  constructor(url: string) {
    this.origin = new URL(url);
  }

  /** One request as the app's own pages or a script would send it; Set-Cookie goes into the jar. */
  async call(path: string, { method = "GET", form, json, jar, token }: Call = {}): Promise<{ response: Response; text: string }> {
    const headers: Record<string, string> = {};
    const cookie = jar?.header();
    if (cookie) headers.Cookie = cookie;
    if (token) headers.Authorization = `Bearer ${token}`;
    let body: string | undefined;
    if (form) {
      body = new URLSearchParams(form).toString();
      headers["Content-Type"] = "application/x-www-form-urlencoded";
    } else if (json !== undefined) {
      body = JSON.stringify(json);
      headers["Content-Type"] = "application/json";
    }
    if (method !== "GET" && method !== "HEAD") headers.Origin = this.origin.origin;
    const response = await fetch(new URL(path, this.origin), { method, headers, body, redirect: "manual" });
    jar?.take(response);
    return { response, text: await response.text() };
  }

  async json<T>(path: string, token: string): Promise<T> {
    const { response, text } = await this.call(path, { token });
    if (!response.ok) throw new Error(`GET ${path} answered ${response.status}: ${text.slice(0, 200)}`);
    return JSON.parse(text) as T;
  }

  /** Signs in through POST /auth/github and the local GitHub stand-in (which must be on loopback), as the app's sign-in page does. */
  async signIn(login: string, newcomer?: { name: string; email: string }): Promise<Jar> {
    const jar = new Jar();
    const start = await this.call("/auth/github", { method: "POST", form: { returnTo: "/" }, jar });
    const authorize = new URL(start.response.headers.get("Location") ?? "", this.origin);
    if (start.response.status !== 302 || !/\/login\/oauth\/authorize$/.test(authorize.pathname)) {
      throw new Error(`POST /auth/github answered ${start.response.status} ${authorize}, not a redirect to GitHub's authorize page`);
    }
    if (!isLoopbackHost(authorize.hostname)) {
      throw new Error(`The app signs in at ${authorize.origin}, not a local GitHub stand-in; the probe signs in only on loopback.`);
    }
    this.githubOrigin = authorize.origin;
    const fields: Record<string, string> = { login, ...(newcomer ?? {}) };
    for (const key of ["state", "redirect_uri", "client_id", "scope"]) fields[key] = authorize.searchParams.get(key) ?? "";
    const picked = await fetch(authorize.origin + authorize.pathname, {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams(fields).toString(),
      redirect: "manual",
    });
    const callback = new URL(picked.headers.get("Location") ?? "");
    // The app names itself by PUBLIC_URL, which may be another loopback name for the address probed.
    const sameApp = callback.origin === this.origin.origin || (isLoopbackHost(callback.hostname) && callback.port === this.origin.port);
    if (!sameApp) throw new Error(`The GitHub stand-in sent ${login} to ${callback.origin}, not back to the app`);
    const back = await this.call(callback.pathname + callback.search, { jar });
    if (back.response.status !== 302 || !jar.get("gaitloom_session")) {
      throw new Error(`Signing in as ${login} did not complete: the callback answered ${back.response.status} ${back.text.slice(0, 200)}`);
    }
    return jar;
  }

  async createToken(jar: Jar, name: string): Promise<string> {
    const { response, text } = await this.call("/settings/tokens", { method: "POST", form: { intent: "create", name }, jar });
    const token = text.match(/gl_[A-Za-z0-9_-]{43}/)?.[0];
    if (!token) throw new Error(`Creating an API token answered ${response.status} without a token`);
    return token;
  }

  /** The location a form post redirected to, or an error naming what it answered. */
  async redirected(path: string, form: Record<string, string>, jar: Jar): Promise<string> {
    const { response, text } = await this.call(path, { method: "POST", form, jar });
    const location = response.headers.get("Location");
    if (response.status !== 302 || !location) throw new Error(`POST ${path} (${form.intent}) answered ${response.status}: ${text.slice(0, 300)}`);
    return location;
  }
}

const emptyIds = (workspace: string): Ids => ({
  workspace,
  robots: [],
  revisions: [],
  gaits: [],
  versions: [],
  drafts: [],
  profiles: [],
  users: [],
  invitations: [],
  invitationTokens: [],
});

type RobotList = { robots: { id: string }[] };
type RobotDetail = { revisions: { number: number }[]; latest: { definition: unknown } };
type Versions = { gait: { robotId: string }; versions: { id: string; number: number }[] };
type Draft = { revision: number; sequence: unknown };
type Profiles = { profiles: { id: string; revision: number }[] };

/** The ids a workspace's API and pages show to `token` and `jar`. */
async function discover(setup: Setup, token: string, jar: Jar, workspace: string, world: Pick<World, "definitions" | "sequences">): Promise<Ids> {
  const ids = emptyIds(workspace);
  for (const { id } of (await setup.json<RobotList>("/api/v1/robots", token)).robots) {
    ids.robots.push(id);
    const detail = await setup.json<RobotDetail>(`/api/v1/robots/${id}`, token);
    world.definitions[id] = detail.latest.definition;
    for (const { number } of detail.revisions) ids.revisions.push({ robotId: id, number });
    for (const profile of (await setup.json<Profiles>(`/api/v1/robots/${id}/calibration-profiles`, token)).profiles) {
      ids.profiles.push({ robotId: id, id: profile.id, revision: profile.revision });
    }
  }
  const gaitsPage = await setup.call("/gaits", { jar });
  ids.gaits = [...new Set([...gaitsPage.text.matchAll(/\/gaits\/([0-9a-f-]{36})/g)].map((match) => match[1]))];
  for (const gaitId of ids.gaits) {
    const { gait, versions } = await setup.json<Versions>(`/api/v1/gaits/${gaitId}/versions`, token);
    for (const version of versions) ids.versions.push({ gaitId, number: version.number, id: version.id });
    const draft = await setup.json<Draft>(`/api/v1/gaits/${gaitId}/draft`, token);
    ids.drafts.push({ gaitId, revision: draft.revision, robotId: gait.robotId });
    world.sequences[gaitId] = draft.sequence;
  }
  const members = await setup.call("/settings/members", { jar });
  ids.users = [...new Set([...members.text.matchAll(/name="userId" value="([0-9a-f-]{36})"/g)].map((match) => match[1]))];
  ids.invitations = [...new Set([...members.text.matchAll(/name="invitationId" value="([0-9a-f-]{36})"/g)].map((match) => match[1]))];
  return ids;
}

const person = (role: Role) => demoPeople.find((candidate) => candidate.role === role)!;

/** Signs everyone in, makes the tokens and the second workspace, and learns the ids. */
export async function prepareWorld(url: string, tag: string): Promise<World> {
  const setup = new Setup(url);
  const identities: Identity[] = [{ name: "signed out", as: "signed-out" }];
  const jars = {} as Record<Role, Jar>;
  for (const role of ["owner", "lead", "animator", "firmware", "viewer"] as const) {
    jars[role] = await setup.signIn(person(role).login);
    identities.push({ name: `${role} (session)`, as: role, cookie: jars[role].header() });
  }
  const tokens = {} as Record<"owner" | "lead" | "firmware", string>;
  for (const role of ["owner", "lead", "firmware"] as const) {
    tokens[role] = await setup.createToken(jars[role], `probe ${tag} ${role}`);
    identities.push({ name: `${role} (token)`, as: role, authorization: `Bearer ${tokens[role]}` });
  }

  // The second workspace: a newcomer who makes one, with something in it.
  const login = `probe-outsider-${tag}`;
  const outsider = await setup.signIn(login, { name: `Probe outsider ${tag}`, email: `${login}@outsiders.example` });
  const workspaceProbe = await setup.call("/api/v1/workspace", { jar: outsider });
  if (workspaceProbe.response.status !== 200) await setup.redirected("/welcome", { intent: "create", name: `Probe outsiders ${tag}` }, outsider);
  const outsiderToken = await setup.createToken(outsider, `probe ${tag}`);
  const foreignWorkspace = (await setup.json<{ workspace: { id: string } }>("/api/v1/workspace", outsiderToken)).workspace.id;
  const robotPath = await setup.redirected("/robots?index", { intent: "create", name: `Probe robot ${tag}`, source: "starter-6" }, outsider);
  const foreignRobot = robotPath.match(UUID)![0];
  const gaitPath = await setup.redirected(
    "/gaits/new",
    {
      intent: "create",
      robotId: foreignRobot,
      name: `Probe gait ${tag}`,
      template: "tripod",
      cycleMs: "1200",
      fps: "50",
      strideMm: "40",
      stepHeightMm: "25",
      directionDeg: "0",
      turnDegPerCycle: "0",
    },
    outsider,
  );
  const foreignGait = gaitPath.match(UUID)![0];
  await setup.call(`/gaits/${foreignGait}`, { method: "POST", form: { intent: "commit", message: "Probe version" }, jar: outsider });
  await setup.redirected(`/export/calibration/${foreignRobot}`, { intent: "create", name: `probe ${tag}` }, outsider);
  await setup.call("/settings/members", {
    method: "POST",
    form: { intent: "invite", email: `invitee-${tag}@outsiders.example`, role: "viewer" },
    jar: outsider,
  });
  const found = { definitions: {}, sequences: {} };
  const foreign = await discover(setup, outsiderToken, outsider, foreignWorkspace, found);
  identities.push({ name: "outsider (session)", as: "outsider", cookie: outsider.header() });
  identities.push({ name: "outsider (token)", as: "outsider", authorization: `Bearer ${outsiderToken}` });

  // The demo workspace: an invitation of its own (its link read from the local inbox when the app shows one),
  // one set aside that no caller may accept, and a calibration profile.
  const invitee = `probe-invitee-${tag}@example.test`;
  await setup.call("/settings/members", {
    method: "POST",
    form: { intent: "invite", email: invitee, role: "viewer" },
    jar: jars.owner,
  });
  const setAside = `probe-set-aside-${tag}@example.test`;
  await setup.call("/settings/members", { method: "POST", form: { intent: "invite", email: setAside, role: "owner" }, jar: jars.owner });
  const demoWorkspace = (await setup.json<{ workspace: { id: string } }>("/api/v1/workspace", tokens.owner)).workspace.id;
  const [firstRobot] = (await setup.json<RobotList>("/api/v1/robots", tokens.owner)).robots;
  if (firstRobot) await setup.redirected(`/export/calibration/${firstRobot.id}`, { intent: "create", name: `probe ${tag}` }, jars.owner);
  const home = await discover(setup, tokens.owner, jars.owner, demoWorkspace, found);
  // The job runner mails the invitations after the answer: wait a little for them (not at all without a local inbox).
  let inbox = await setup.call("/local/mail", { jar: jars.owner });
  for (let tries = 0; inbox.response.ok && !(inbox.text.includes(invitee) && inbox.text.includes(setAside)) && tries < 50; tries++) {
    await new Promise((resolve) => setTimeout(resolve, 200));
    inbox = await setup.call("/local/mail", { jar: jars.owner });
  }
  const escaped = setAside.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const setAsideToken = inbox.text.match(new RegExp(`${escaped}[\\s\\S]*?/invitations/([A-Za-z0-9_-]{16,})`))?.[1];
  const members = await setup.call("/settings/members", { jar: jars.owner });
  const setAsideId = members.text.match(new RegExp(`${escaped}</td>[\\s\\S]*?name="invitationId" value="([0-9a-f-]{36})"`))?.[1];
  const foreignInvitation = setAsideToken && setAsideId ? { token: setAsideToken, id: setAsideId } : null;
  home.invitations = home.invitations.filter((id) => id !== setAsideId);
  home.invitationTokens = [...new Set([...inbox.text.matchAll(/\/invitations\/([A-Za-z0-9_-]{16,})/g)].map((match) => match[1]))]
    .filter((token) => token !== setAsideToken)
    .slice(0, 5);

  // Sessions ended on purpose: the lead's second session, signed out; a newcomer's two, ended everywhere from one.
  const signedOut = await setup.signIn(person("lead").login);
  const signedOutCookie = signedOut.header();
  await setup.call("/sign-out", { method: "POST", jar: signedOut });
  const everywhere = { login: `probe-everywhere-${tag}`, name: `Probe everywhere ${tag}`, email: `probe-everywhere-${tag}@example.test` };
  const [kept, ending] = [await setup.signIn(everywhere.login, everywhere), await setup.signIn(everywhere.login, everywhere)];
  const endedEverywhereCookie = kept.header();
  const endAll = await setup.call("/account/sessions", { method: "POST", form: { intent: "end-all" }, jar: ending });
  if (endAll.response.status !== 302) throw new Error(`Signing out everywhere answered ${endAll.response.status}: ${endAll.text.slice(0, 200)}`);
  const endedSessions: Identity[] = [
    { name: "session signed out since", as: "hostile", cookie: signedOutCookie },
    { name: "session ended everywhere since", as: "hostile", cookie: endedEverywhereCookie },
  ];
  const throwawayLogin = `probe-throwaway-${tag}`;
  const throwaway = (await setup.signIn(throwawayLogin, { name: `Probe throwaway ${tag}`, email: `${throwawayLogin}@example.test` })).header();

  // Hostile credentials: a revoked token, tokens and cookies never issued or tampered with, a signed-out cookie.
  const revoked = await setup.createToken(jars.firmware, `probe ${tag} revoked`);
  const tokensPage = await setup.call("/settings/tokens", { jar: jars.firmware });
  const revokedId = tokensPage.text.match(/name="tokenId" value="([0-9a-f-]{36})"/)?.[1];
  if (revokedId) await setup.call("/settings/tokens", { method: "POST", form: { intent: "revoke", tokenId: revokedId }, jar: jars.firmware });
  const session = jars.owner.get("gaitloom_session") ?? "";
  const tampered = session.slice(0, -3) + (session.endsWith("AAA") ? "BBB" : "AAA");
  identities.push(
    { name: "revoked token", as: "hostile", authorization: `Bearer ${revoked}` },
    { name: "unknown token", as: "hostile", authorization: `Bearer gl_${"A".repeat(43)}` },
    { name: "token without Bearer", as: "hostile", authorization: tokens.lead },
    { name: "Basic credentials", as: "hostile", authorization: `Basic ${Buffer.from("mara:secret").toString("base64")}` },
    { name: "two bearer tokens", as: "hostile", authorization: `Bearer ${tokens.lead} ${tokens.owner}` },
    { name: "tampered cookie", as: "hostile", cookie: `gaitloom_session=${tampered}` },
    { name: "unsigned cookie", as: "hostile", cookie: `gaitloom_session=${Buffer.from(JSON.stringify({ userId: home.users[0] })).toString("base64")}` },
    { name: "signed-out cookie", as: "hostile", cookie: "gaitloom_session=" },
    { name: "garbage cookie", as: "hostile", cookie: "gaitloom_session=%E0%A4%A; theme=\u00ff; =; a" },
    { name: "cookie and token", as: "hostile", cookie: jars.viewer.header(), authorization: `Bearer ${tokens.owner}` },
    ...endedSessions,
  );
  const forged = await forgedSessions(home, foreignWorkspace);
  identities.push(...forged);

  const limitToken = await setup.createToken(jars.firmware, `probe ${tag} shared limit`);
  const openApi = await setup.json<unknown>("/api/v1/openapi.json", tokens.owner);
  const liveSessions = [...Object.values(jars), outsider].map((jar) => jar.get("gaitloom_session") ?? "").filter(Boolean);
  return {
    origin: setup.origin,
    githubOrigin: setup.githubOrigin,
    identities,
    ids: home,
    foreign,
    ...found,
    openApi,
    liveSessions,
    throwaway,
    endedSessions,
    foreignInvitation,
    limitToken,
  };
}

/**
 * Cookies signed with the app's own secret (known when the probe started the
 * app), so they pass the signature and must fail on what they hold: an id of
 * no session, and values that are no session id at all (what the cookie held
 * before sessions were kept in the database: the user and workspace
 * themselves, of a user deleted since and of a workspace left since).
 */
async function forgedSessions(ids: Ids, foreignWorkspace: string): Promise<Identity[]> {
  const secret = process.env.GAITLOOM_PROBE_SESSION_SECRET;
  if (!secret) return [];
  const { createCookie } = await import("react-router");
  const cookie = createCookie("gaitloom_session", { secrets: [secret], path: "/", httpOnly: true, sameSite: "lax" });
  const sign = async (name: string, value: unknown): Promise<Identity> => ({
    name,
    as: "hostile",
    cookie: (await cookie.serialize(value)).split(";")[0],
  });
  return Promise.all([
    sign("signed id of no session", "x".repeat(43)),
    sign("signed session data of a deleted user", { userId: "00000000-0000-4000-8000-000000000000" }),
    sign("signed session data in a workspace left since", { userId: ids.users[0], workspaceId: foreignWorkspace }),
  ]);
}
