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

/** Only paths on this site, so a crafted link cannot send someone elsewhere after sign-in. */
export function safeReturnTo(value: unknown): string {
  return typeof value === "string" && value.startsWith("/") && !value.startsWith("//") && !value.startsWith("/\\") ? value : "/";
}
