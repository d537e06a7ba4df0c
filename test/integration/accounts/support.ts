// Signing in in-process as a browser does, through the local GitHub stand-in
// that npm test starts (GITHUB_OAUTH_URL names it): POST /auth/github, the
// stand-in's authorize form, then the callback.
import { act, load, outcome, PUBLIC_ORIGIN } from "../../support/routes";
import * as gitHubSignIn from "~/routes/auth/github";
import * as gitHubCallback from "~/routes/auth/github-callback";

/** The `name=value` pairs a response sets, less those it clears. */
export const cookiesSet = (headers: Headers): string[] =>
  headers
    .getSetCookie()
    .filter((line) => !/;\s*(max-age=0|expires=thu, 01 jan 1970)/i.test(line))
    .map((line) => line.split(";")[0])
    .filter((pair) => !pair.endsWith("="));

const sessionPair = (pairs: string[]) => pairs.find((pair) => pair.startsWith("gaitloom_session="));

export type GitHubPerson = { login: string; name?: string; email?: string; unverified?: boolean };

/**
 * Signs `person` in (a demo login, or a typed-in person with an e-mail);
 * `headers` go with each request to the app (a User-Agent). Gives the session
 * cookie from before sign-in (the visitor's, carrying the return address) and after.
 */
export async function signInThroughGitHub(person: GitHubPerson, headers: Record<string, string> = {}): Promise<{ visitorCookie: string; cookie: string }> {
  const start = await outcome(() =>
    act(
      gitHubSignIn,
      new Request(`${PUBLIC_ORIGIN}/auth/github`, {
        method: "POST",
        headers: { ...headers, "Content-Type": "application/x-www-form-urlencoded", Origin: PUBLIC_ORIGIN },
        body: new URLSearchParams({ returnTo: "/" }),
      }),
    ),
  );
  if (start.status !== 302 || !start.location) throw new Error(`POST /auth/github answered ${start.status}`);
  const started = cookiesSet(start.headers);
  const authorize = new URL(start.location);
  const fields: Record<string, string> = { login: person.login, name: person.name ?? person.login, email: person.email ?? "" };
  if (person.unverified) fields.unverified = "yes";
  for (const key of ["state", "redirect_uri", "client_id", "scope"]) fields[key] = authorize.searchParams.get(key) ?? "";
  const picked = await fetch(`${authorize.origin}${authorize.pathname}`, { method: "POST", body: new URLSearchParams(fields), redirect: "manual" });
  const callback = new URL(picked.headers.get("Location") ?? "", PUBLIC_ORIGIN);
  const back = await outcome(() =>
    load(gitHubCallback, new Request(`${PUBLIC_ORIGIN}${callback.pathname}${callback.search}`, { headers: { ...headers, Cookie: started.join("; ") } })),
  );
  const cookie = sessionPair(cookiesSet(back.headers));
  if (back.status !== 302 || !cookie) throw new Error(`The callback answered ${back.status} without a session: ${back.text.slice(0, 200)}`);
  return { visitorCookie: sessionPair(started) ?? "", cookie };
}
