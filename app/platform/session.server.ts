// The browser session: a signed, httpOnly, SameSite=Lax cookie (secure in production).
import { createCookieSessionStorage, type Session } from "react-router";
import { config } from "./config.server";

type SessionData = { userId: string; workspaceId: string };
type SessionFlash = { returnTo: string };

let storage: ReturnType<typeof createCookieSessionStorage<SessionData, SessionFlash>> | undefined;

export function sessionStorage() {
  const settings = config();
  storage ??= createCookieSessionStorage<SessionData, SessionFlash>({
    cookie: {
      name: "gaitloom_session",
      httpOnly: true,
      sameSite: "lax",
      secure: settings.mode === "production",
      path: "/",
      maxAge: 60 * 60 * 24 * 30,
      secrets: [settings.sessionSecret],
    },
  });
  return storage;
}

export type AppSession = Session<SessionData, SessionFlash>;

export function readSession(request: Request): Promise<AppSession> {
  return sessionStorage().getSession(request.headers.get("Cookie"));
}

export function commitSession(session: AppSession): Promise<string> {
  return sessionStorage().commitSession(session);
}

export function destroySession(session: AppSession): Promise<string> {
  return sessionStorage().destroySession(session);
}

// Longer than this, the address would crowd the session cookie (about 4 KB in all).
const RETURN_TO_LIMIT = 2048;
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
