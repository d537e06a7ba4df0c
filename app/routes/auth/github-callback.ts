// GET /auth/github/callback: GitHub sends the person back here with a code.
import { data, redirect } from "react-router";
import type { Route } from "./+types/github-callback";
import { gitHubAuthenticator } from "~/platform/auth.server";
import { readSession, safeReturnTo, startSession } from "~/platform/session.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  let user;
  try {
    user = await gitHubAuthenticator().authenticate("github", request);
  } catch (error) {
    if (error instanceof Response) throw error;
    const reason = error instanceof Error ? error.message : String(error);
    throw data({ message: `Sign-in with GitHub did not complete: ${reason} Try again from the sign-in page.` }, { status: 400 });
  }
  const visitor = await readSession(request);
  const returnTo = safeReturnTo(visitor.get("returnTo"));
  return redirect(returnTo, { headers: { "Set-Cookie": await startSession(visitor, user.id) } });
}
