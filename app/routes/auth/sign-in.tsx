import { Form, redirect } from "react-router";
import type { Route } from "./+types/sign-in";
import { currentUser } from "~/platform/access.server";
import { attempt } from "~/platform/errors.server";
import { safeReturnTo } from "~/platform/session.server";
import { invitationForToken, maskAddress } from "~/features/accounts/invitations.server";
import { ROLE_LABELS, type Role, type RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

/** What the sign-in page says about an invitation link it leads back to. */
export type InvitationOnTheWay =
  { state: "open"; workspaceName: string; role: Role; invitedBy: string | null; email: string } | { state: "ended"; reason: string };

// The path of an invitation link (app/routes.ts: invitations/:token).
const INVITATION_PATH = /^\/invitations\/([^/?#]+)$/;

export async function loader({ request }: Route.LoaderArgs) {
  const returnTo = safeReturnTo(new URL(request.url).searchParams.get("returnTo"));
  if (await currentUser(request)) throw redirect(returnTo);
  return { returnTo, invitation: await invitationOnTheWay(returnTo) };
}

// Holding the link is what lets the page say what it is for; the address is
// shown only partly, as on the invitation page to someone it may not belong to.
async function invitationOnTheWay(returnTo: string): Promise<InvitationOnTheWay | null> {
  const token = INVITATION_PATH.exec(new URL(returnTo, "http://127.0.0.1").pathname)?.[1];
  if (!token) return null;
  const found = await attempt(() => invitationForToken(decodeURIComponent(token)));
  if (!found.ok) return { state: "ended", reason: found.refusal.message };
  const { workspaceName, role, invitedBy, email } = found.value;
  return { state: "open", workspaceName, role, invitedBy, email: maskAddress(email) };
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData?.invitation?.state === "open" ? `Sign in to join ${loaderData.invitation.workspaceName} · Gaitloom` : "Sign in · Gaitloom" },
];

export default function SignIn({ loaderData }: Route.ComponentProps) {
  const { invitation, returnTo } = loaderData;
  const open = invitation?.state === "open" ? invitation : null;
  return (
    <div className="mx-auto max-w-md py-12">
      <h1 className="text-2xl font-semibold tracking-tight">{open ? `Sign in to join ${open.workspaceName}` : "Sign in to Gaitloom"}</h1>
      {open ? (
        <section aria-label="Your invitation" className="mt-4 rounded-lg border border-accent bg-accent-soft px-4 py-3">
          <p>
            {open.invitedBy ?? "Someone"} invited <strong>{open.email}</strong> to work in <strong>{open.workspaceName}</strong> as{" "}
            <strong>{ROLE_LABELS[open.role].toLowerCase()}</strong>.
          </p>
          <p className="mt-2 text-sm">Sign in with the GitHub account that has this address verified; you come back to the invitation to accept it.</p>
        </section>
      ) : null}
      {invitation?.state === "ended" ? (
        <section aria-label="Your invitation" className="mt-4 rounded-lg border border-warning bg-warning-soft px-4 py-3">
          <p className="font-medium">
            <span aria-hidden>⚠ </span>The invitation link no longer works.
          </p>
          <p className="mt-1 text-sm">{invitation.reason}</p>
          <p className="mt-1 text-sm">You can still sign in; invitations waiting for your verified addresses are listed after that.</p>
        </section>
      ) : null}
      <p className="mt-4 text-ink-muted">Your GitHub account is your Gaitloom sign-in; your workspace decides what you can do.</p>
      <Form method="post" action="/auth/github" className="mt-6">
        <input type="hidden" name="returnTo" value={invitation?.state === "ended" ? "/welcome" : returnTo} />
        <button type="submit" className="w-full rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
          Sign in with GitHub
        </button>
      </Form>
    </div>
  );
}
