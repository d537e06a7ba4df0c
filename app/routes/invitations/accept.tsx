// /invitations/:token — the link from the invitation e-mail.
import { Form, redirect } from "react-router";
import type { Route } from "./+types/accept";
import { requireUser } from "~/platform/access.server";
import { formAction, pageGuard } from "~/platform/errors.server";
import { acceptInvitation, addressRefusal, invitationForToken, maskAddress } from "~/features/accounts/invitations.server";
import { ROLE_LABELS, type RoutePermissions } from "~/platform/permissions";
import { commitSession, readSession } from "~/platform/session.server";

export const permissions = { loader: "signed-in", action: "signed-in" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return pageGuard(async () => {
    const { email, role, workspaceName, invitedBy } = await invitationForToken(params.token);
    // Said before a try, and the address shown in full only to someone who has it.
    const refusal = addressRefusal(user, email);
    return {
      invitation: { email: refusal ? maskAddress(email) : email, role, workspaceName, invitedBy },
      refusal,
      you: { name: user.name, login: user.login },
    };
  });
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  return formAction(async () => {
    const { workspaceId } = await acceptInvitation(user, { token: params.token });
    const session = await readSession(request);
    session.set("workspaceId", workspaceId);
    // The start page confirms what was joined.
    return redirect(`/?joined=${workspaceId}`, { headers: { "Set-Cookie": await commitSession(session) } });
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Invitation · Gaitloom" }];

export default function AcceptInvitation({ loaderData, actionData }: Route.ComponentProps) {
  const { invitation, refusal, you } = loaderData;
  return (
    <div className="mx-auto max-w-lg py-8">
      <h1 className="text-2xl font-semibold tracking-tight">Join {invitation.workspaceName}</h1>
      <p className="mt-2 text-ink-muted">
        {invitation.invitedBy ?? "Someone"} invited {invitation.email} to work in {invitation.workspaceName} as{" "}
        <strong>{ROLE_LABELS[invitation.role].toLowerCase()}</strong>. You are signed in with GitHub as {you.name} (@{you.login}).
      </p>
      {refusal ? (
        <div className="mt-4 rounded-md bg-danger-soft px-4 py-3 text-danger">
          <p>{refusal}</p>
          <Form method="post" action="/sign-out" className="mt-3">
            <button type="submit" className="rounded-md border border-line bg-surface px-3 py-1 text-ink hover:bg-sunken">
              Sign out
            </button>
          </Form>
        </div>
      ) : null}
      {actionData && "error" in actionData ? (
        <p role="alert" className="mt-4 rounded-md bg-danger-soft px-4 py-2 text-danger">
          {actionData.error}
        </p>
      ) : null}
      {refusal ? null : (
        <Form method="post" className="mt-6">
          <button type="submit" className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
            Join as {ROLE_LABELS[invitation.role].toLowerCase()}
          </button>
        </Form>
      )}
    </div>
  );
}
