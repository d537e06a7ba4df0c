// For a signed-in person: start a workspace, or accept an invitation sent to an address GitHub has verified for them.
import { Form, redirect, useActionData } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/welcome";
import { PageHeader } from "~/components/common/PageHeader";
import { membershipsOf, requireUser } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { acceptInvitation, invitationsForAddresses } from "~/features/accounts/invitations.server";
import { ROLE_LABELS, type RoutePermissions } from "~/platform/permissions";
import { id } from "~/platform/params";
import { commitSession, readSession } from "~/platform/session.server";
import { createWorkspace } from "~/features/accounts/workspaces.server";

export const permissions = { loader: "signed-in", action: { create: "signed-in", accept: "signed-in" } } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const [invitations, memberships] = await Promise.all([invitationsForAddresses(user.verifiedEmails), membershipsOf(user.id)]);
  return { name: user.name, addresses: user.verifiedEmails, invitations, hasWorkspace: memberships.length > 0 };
}

export const actionForm = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("create"), name: z.string() }),
  z.object({ intent: z.literal("accept"), invitationId: id() }),
]);

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  return formAction(async () => {
    const parsed = actionForm.safeParse(Object.fromEntries(await readForm(request)));
    if (!parsed.success) throw new ServiceError(400, "bad-request", "The form was incomplete; try again.");
    const workspaceId =
      parsed.data.intent === "create"
        ? (await createWorkspace(user, parsed.data.name)).id
        : (await acceptInvitation(user, { id: parsed.data.invitationId })).workspaceId;
    const session = await readSession(request);
    session.set("workspaceId", workspaceId);
    // The start page confirms a workspace joined.
    const next = parsed.data.intent === "accept" ? `/?joined=${workspaceId}` : "/";
    return redirect(next, { headers: { "Set-Cookie": await commitSession(session) } });
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Welcome · Gaitloom" }];

export default function Welcome({ loaderData }: Route.ComponentProps) {
  const result = useActionData<typeof action>();
  const error = result && "error" in result ? result.error : null;
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeader
        title={`Welcome, ${loaderData.name}`}
        lead={loaderData.hasWorkspace ? "Start another workspace or join one you were invited to." : "You are not in a workspace yet."}
      />
      {error ? (
        <p role="alert" className="mb-4 rounded-md bg-danger-soft px-4 py-2 text-danger">
          {error}
        </p>
      ) : null}
      <section className="rounded-lg border border-line bg-surface p-6">
        <h2 className="text-lg font-semibold">Invitations for your verified addresses</h2>
        {loaderData.addresses.length === 0 ? (
          <p className="mt-2 text-ink-muted">
            GitHub shows no verified e-mail address for your account. Verify an address on GitHub and sign in again to join a workspace you are invited to.
          </p>
        ) : (
          <p className="mt-1 text-ink-muted">{loaderData.addresses.join(", ")}</p>
        )}
        {loaderData.invitations.length === 0 ? (
          loaderData.addresses.length === 0 ? null : (
            <p className="mt-2 text-ink-muted">None waiting. Ask a workspace owner or lead to invite one of these addresses.</p>
          )
        ) : (
          <ul className="mt-3 space-y-2">
            {loaderData.invitations.map((invitation) => (
              <li key={invitation.id} className="flex items-center justify-between gap-4">
                <span>
                  <span className="font-medium">{invitation.workspaceName}</span> as {ROLE_LABELS[invitation.role].toLowerCase()}
                  {invitation.invitedBy ? <span className="text-ink-muted">, from {invitation.invitedBy}</span> : null}
                </span>
                <Form method="post">
                  <input type="hidden" name="intent" value="accept" />
                  <input type="hidden" name="invitationId" value={invitation.id} />
                  <button type="submit" className="rounded-md bg-accent px-3 py-1 text-on-accent hover:bg-accent-strong">
                    Join {invitation.workspaceName}
                  </button>
                </Form>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className="mt-6 rounded-lg border border-line bg-surface p-6">
        <h2 className="text-lg font-semibold">Start a workspace</h2>
        <p className="mt-1 text-ink-muted">You will be its owner and can invite your team.</p>
        <Form method="post" className="mt-4 flex items-end gap-3">
          <input type="hidden" name="intent" value="create" />
          <label className="flex-1">
            <span className="block text-sm font-medium">Workspace name</span>
            <input name="name" required minLength={2} maxLength={80} className="mt-1 w-full rounded-md border border-line bg-surface px-3 py-2" />
          </label>
          <button type="submit" className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
            Create workspace
          </button>
        </Form>
      </section>
    </div>
  );
}
