// The browser session: a row of the sessions table, whose random id the
// cookie carries signed (httpOnly, SameSite=Lax, Secure in production).
// Deleting the row ends the session for good, so signing out, here or
// everywhere, leaves no cookie that still works.
import { createHash, randomBytes } from "node:crypto";
import { eq, lt } from "drizzle-orm";
import { createCookie, createSession, createSessionStorage, type Cookie, type Session, type SessionStorage } from "react-router";
import { sessions } from "../../db/schema";
import { config } from "./config.server";
import { database } from "./db.server";

type SessionData = { userId: string; workspaceId: string };
type SessionFlash = { returnTo: string };

export type AppSession = Session<SessionData, SessionFlash>;
type SessionRow = typeof sessions.$inferSelect;

const DAY_MS = 86_400_000;
/** How long a signed-in session lasts, counted from sign-in: use does not extend it. */
export const SESSION_DAYS = 30;
// A visitor's session only carries the return address through GitHub's authorize page.
const VISITOR_SESSION_MS = DAY_MS;
// Last seen to within a few minutes is enough for the list of sessions, and spares a write per request.
const LAST_SEEN_EVERY_MS = 5 * 60_000;
// Expired rows are deleted when read, and all of them now and then when a session starts.
const PURGE_EVERY_MS = 60 * 60_000;
const USER_AGENT_LIMIT = 512;

let cookie: Cookie | undefined;
let storage: SessionStorage<SessionData, SessionFlash> | undefined;
let lastPurgeMs = 0;

function sessionCookie(): Cookie {
  const settings = config();
  cookie ??= createCookie("gaitloom_session", {
    httpOnly: true,
    sameSite: "lax",
    secure: settings.mode === "production",
    path: "/",
    maxAge: SESSION_DAYS * 24 * 60 * 60,
    secrets: [settings.sessionSecret],
  });
  return cookie;
}

export function sessionStorage(): SessionStorage<SessionData, SessionFlash> {
  storage ??= createSessionStorage<SessionData, SessionFlash>({
    cookie: sessionCookie(),
    async createData(data) {
      await purgeExpiredNowAndThen();
      // 32 random bytes: no one guesses a session, and the id alone is worthless without the signature.
      const id = randomBytes(32).toString("base64url");
      const userId = typeof data.userId === "string" ? data.userId : null;
      const expiresAt = new Date(Date.now() + (userId ? SESSION_DAYS * DAY_MS : VISITOR_SESSION_MS));
      await database().insert(sessions).values({ id, userId, data, expiresAt });
      return id;
    },
    async readData(id) {
      return typeof id === "string" ? (((await liveRow(id))?.data as SessionData | undefined) ?? null) : null;
    },
    // Never inserts: a session ended meanwhile (signed out in another tab) stays ended.
    async updateData(id, data) {
      if (typeof id !== "string" || !id) return;
      await database()
        .update(sessions)
        .set({ data, userId: typeof data.userId === "string" ? data.userId : null })
        .where(eq(sessions.id, id));
    },
    async deleteData(id) {
      if (typeof id === "string" && id) await database().delete(sessions).where(eq(sessions.id, id));
    },
  });
  return storage;
}

async function purgeExpiredNowAndThen(): Promise<void> {
  if (Date.now() - lastPurgeMs < PURGE_EVERY_MS) return;
  lastPurgeMs = Date.now();
  await database().delete(sessions).where(lt(sessions.expiresAt, new Date()));
}

/** The session's row while it lasts; an expired one is deleted and read as none. */
async function liveRow(id: string): Promise<SessionRow | null> {
  const db = database();
  const [row] = await db.select().from(sessions).where(eq(sessions.id, id));
  if (!row) return null;
  if (row.expiresAt.getTime() > Date.now()) return row;
  await db.delete(sessions).where(eq(sessions.id, id));
  return null;
}

/** Notes when the session was last used, and in which browser, at most once every few minutes (and when the browser is not yet known). */
async function noteUse(row: SessionRow, request: Request): Promise<void> {
  const userAgent = request.headers.get("User-Agent")?.slice(0, USER_AGENT_LIMIT) || null;
  const stale = Date.now() - row.lastSeenAt.getTime() >= LAST_SEEN_EVERY_MS;
  if (!stale && !(userAgent && !row.userAgent)) return;
  await database()
    .update(sessions)
    .set({ lastSeenAt: new Date(), ...(userAgent ? { userAgent } : {}) })
    .where(eq(sessions.id, row.id));
}

// Loaders of one request (the shell's and the page's) read the session once.
const readings = new WeakMap<Request, Promise<AppSession>>();

/**
 * The request's session. A cookie naming no live session (signed out, ended
 * everywhere, expired, tampered with, or of the older kind that held the
 * session itself) gives a new, empty one, which is stored, under a new id,
 * only when committed.
 */
export function readSession(request: Request): Promise<AppSession> {
  let reading = readings.get(request);
  if (!reading) readings.set(request, (reading = loadSession(request)));
  return reading;
}

async function loadSession(request: Request): Promise<AppSession> {
  const id: unknown = await sessionCookie().parse(request.headers.get("Cookie"));
  const row = typeof id === "string" && id ? await liveRow(id) : null;
  if (!row) return createSession<SessionData, SessionFlash>();
  await noteUse(row, request);
  // The row's data is what commitSession stored: this session's own keys.
  return createSession<SessionData, SessionFlash>(row.data as SessionData, row.id);
}

export function commitSession(session: AppSession): Promise<string> {
  return sessionStorage().commitSession(session);
}

/** Ends the session (its row is deleted) and clears the cookie. */
export function destroySession(session: AppSession): Promise<string> {
  return sessionStorage().destroySession(session);
}

/**
 * Signs `userId` in: a new session under a new id, the one before it (a
 * visitor's, carrying the return address) deleted, so an id known before
 * sign-in never becomes a signed-in one. Gives the Set-Cookie header.
 */
export async function startSession(previous: AppSession, userId: string): Promise<string> {
  if (previous.id) await sessionStorage().destroySession(previous);
  const session = createSession<SessionData, SessionFlash>();
  session.set("userId", userId);
  return commitSession(session);
}

/** How a session is named in pages and forms: a hash of its id, which stays secret. */
export const publicSessionId = (id: string): string => createHash("sha256").update(id).digest("hex");

// Longer than this, the address would crowd the session cookie (about 4 KB in all).
export const RETURN_TO_LIMIT = 2048;
// eslint-disable-next-line no-control-regex -- control characters are what it finds
const CONTROL_OR_BACKSLASH = /[\u0000-\u001f\u007f\\]/;

/**
 * Where to send someone after sign-in or a workspace switch: a path on this
 * site, or "/". The address is parsed against our own origin as a browser
 * parses a Location (the WHATWG URL Standard drops tabs and newlines and reads
 * a backslash as a slash, so "/\t/evil.example" is "//evil.example" to it);
 * any control character or backslash, another origin, or anything but a path
 * falls back to "/", as does a parsed path that begins "//". The answer is the parsed path, query and fragment,
 * percent-encoded, so it is always a valid header value.
 */
export function safeReturnTo(value: unknown): string {
  if (typeof value !== "string" || value.length > RETURN_TO_LIMIT || !value.startsWith("/") || CONTROL_OR_BACKSLASH.test(value)) return "/";
  const origin = new URL(config().publicUrl).origin;
  let url: URL;
  try {
    url = new URL(value, origin);
  } catch {
    return "/";
  }
  // Dot segments can collapse to a path that starts "//" (/./..//evil.example), which a Location reads as another host.
  if (url.origin !== origin || url.pathname.startsWith("//")) return "/";
  return `${url.pathname}${url.search}${url.hash}`;
}
