// POST /auth/github: remember where to return, then off to GitHub's authorize page.
import type { Route } from "./+types/github";
import { gitHubAuthenticator } from "~/platform/auth.server";
import { readForm } from "~/platform/body.server";
import { pageGuard } from "~/platform/errors.server";
import { commitSession, readSession, safeReturnTo } from "~/platform/session.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { action: "public" } satisfies RoutePermissions;

export async function action({ request }: Route.ActionArgs) {
  const form = await pageGuard(() => readForm(request));
  const session = await readSession(request);
  session.flash("returnTo", safeReturnTo(form.get("returnTo")));
  try {
    // The strategy needs the address and the cookies only; the body, read above, cannot be copied again.
    await gitHubAuthenticator().authenticate("github", new Request(request.url, { headers: request.headers }));
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
