// POST /auth/github: remember where to return, then off to GitHub's authorize page.
import type { Route } from "./+types/github";
import { gitHubAuthenticator } from "~/platform/auth.server";
import { commitSession, readSession, safeReturnTo } from "~/platform/session.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { action: "public" } satisfies RoutePermissions;

export async function action({ request }: Route.ActionArgs) {
  const form = await request.clone().formData();
  const session = await readSession(request);
  session.flash("returnTo", safeReturnTo(form.get("returnTo")));
  try {
    await gitHubAuthenticator().authenticate("github", request);
  } catch (outcome) {
    // The strategy answers with a redirect to the authorize page; it carries our session too.
    if (outcome instanceof Response) {
      outcome.headers.append("Set-Cookie", await commitSession(session));
      return outcome;
    }
    throw outcome;
  }
  throw new Error("GitHub sign-in did not redirect.");
}
