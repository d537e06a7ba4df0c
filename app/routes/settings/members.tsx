// /settings/members: who is in the workspace, their roles, and invitations.
import { Form, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/members";
import { FramedTable } from "~/components/common/FramedTable";
import { MailState } from "~/components/common/MailState";
import { Notice } from "~/components/common/Notice";
import { RowAction } from "~/components/common/RowAction";
import { useFreshWhile } from "~/components/common/useFreshWhile";
import { requireAccess } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { requireIntentAccess } from "~/platform/intent-form.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { formatDate } from "~/platform/format";
import { id } from "~/platform/params";
import { invite, listInvitations, resendInvitation, revokeInvitation } from "~/features/accounts/invitations.server";
import { changeRole, listMembers, parseRole, removeMember } from "~/features/accounts/members.server";
import { ROLES, ROLE_LABELS, can, invitableRoles, type RoutePermissions } from "~/platform/permissions";

export const permissions = {
  loader: "members.read",
  action: {
    "change-role": "members.changeRole",
    remove: "members.remove",
    invite: "invitations.manage",
    resend: "invitations.manage",
    revoke: "invitations.manage",
  },
} satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  const canInvite = can(member.role, "invitations.manage");
  return {
    you: member.user.id,
    members: await listMembers(member.workspace.id),
    invitations: canInvite ? await listInvitations(member.workspace.id) : [],
    canChangeRoles: can(member.role, "members.changeRole"),
    canRemove: can(member.role, "members.remove"),
    invitable: invitableRoles(member.role),
  };
}

const uuid = id("That is not a valid id.");
export const actionForm = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("change-role"), userId: uuid, role: z.string() }),
  z.object({ intent: z.literal("remove"), userId: uuid }),
  z.object({ intent: z.literal("invite"), email: z.string(), role: z.string() }),
  z.object({ intent: z.literal("resend"), invitationId: uuid }),
  z.object({ intent: z.literal("revoke"), invitationId: uuid }),
]);

export async function action({ request }: Route.ActionArgs) {
  return formAction(async () => {
    const parsed = actionForm.safeParse(Object.fromEntries(await readForm(request)));
    const member = await requireIntentAccess(request, permissions.action, parsed.success ? parsed.data.intent : null);
    if (!parsed.success) throw new ServiceError(400, "bad-request", `The form was incomplete: ${parsed.error.issues[0]?.message ?? "unknown field"}`);
    const command = parsed.data;
    switch (command.intent) {
      case "change-role":
        await changeRole(member, command.userId, parseRole(command.role));
        return { success: `Role changed to ${ROLE_LABELS[parseRole(command.role)].toLowerCase()}.` };
      case "remove":
        await removeMember(member, command.userId);
        return { success: "Member removed." };
      case "invite": {
        const invitation = await invite(member, command.email, parseRole(command.role));
        return { success: `Invitation for ${invitation.email} created; its e-mail is queued.` };
      }
      case "resend":
        await resendInvitation(member, command.invitationId);
        return { success: "Invitation made again with a new link, its e-mail queued; the old link no longer works." };
      case "revoke":
        await revokeInvitation(member, command.invitationId);
        return { success: "Invitation revoked." };
    }
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Members · Gaitloom" }];

const button = "rounded-md border border-line px-3 py-1 text-sm hover:bg-sunken";

export default function Members({ loaderData, actionData }: Route.ComponentProps) {
  // The job runner sends the mail after the answer: follow it until it is out.
  const { members, invitations, canChangeRoles, canRemove, invitable, you } = useFreshWhile(loaderData, (data) =>
    data.invitations.some((invitation) => invitation.mail?.state === "queued"),
  );
  const busy = useNavigation().state === "submitting";
  return (
    <div className="space-y-8">
      <Notice
        error={actionData && "error" in actionData ? actionData.error : null}
        success={actionData && "success" in actionData ? actionData.success : null}
      />
      <table className="w-full border-collapse rounded-lg bg-surface text-left">
        <caption className="sr-only">Members of this workspace</caption>
        <thead className="border-b border-line text-sm text-ink-muted">
          <tr>
            <th className="px-4 py-2 font-medium">Name</th>
            <th className="px-4 py-2 font-medium">E-mail</th>
            <th className="px-4 py-2 font-medium">Role</th>
            <th className="px-4 py-2 text-right font-medium">Joined</th>
            {canRemove ? (
              <th className="px-4 py-2 font-medium">
                <span className="sr-only">Remove</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {members.map((row) => (
            <tr key={row.userId} className="border-b border-line last:border-0">
              <td className="px-4 py-2">
                <span className="font-medium">{row.name}</span> <span className="text-ink-muted">@{row.login}</span>
                {row.userId === you ? <span className="ml-2 text-xs text-ink-muted">(you)</span> : null}
              </td>
              <td className="px-4 py-2">{row.email}</td>
              <td className="px-4 py-2">
                {canChangeRoles ? (
                  <Form method="post" className="flex items-center gap-2">
                    <input type="hidden" name="intent" value="change-role" />
                    <input type="hidden" name="userId" value={row.userId} />
                    <select
                      name="role"
                      defaultValue={row.role}
                      aria-label={`Role of ${row.name}`}
                      className="rounded-md border border-line bg-surface px-2 py-1"
                    >
                      {ROLES.map((role) => (
                        <option key={role} value={role}>
                          {ROLE_LABELS[role]}
                        </option>
                      ))}
                    </select>
                    <button type="submit" className={button} disabled={busy} aria-label={`Save the role of ${row.name}`}>
                      Save
                    </button>
                  </Form>
                ) : (
                  ROLE_LABELS[row.role]
                )}
              </td>
              <td className="px-4 py-2 text-right">{formatDate(row.joinedAt)}</td>
              {canRemove ? (
                <td className="px-4 py-2 text-right">
                  <Form
                    method="post"
                    onSubmit={(event) => {
                      if (!confirm(`Remove ${row.name} from this workspace?`)) event.preventDefault();
                    }}
                  >
                    <input type="hidden" name="intent" value="remove" />
                    <input type="hidden" name="userId" value={row.userId} />
                    <button type="submit" className={`${button} text-danger`} aria-label={`Remove ${row.name}`}>
                      Remove
                    </button>
                  </Form>
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>

      {invitable.length > 0 ? (
        <section aria-labelledby="invite-heading" className="rounded-lg border border-line bg-surface p-6">
          <h2 id="invite-heading" className="text-lg font-semibold">
            Invite someone
          </h2>
          <p className="mt-1 text-sm text-ink-muted">They get an e-mail with a link that works once and expires in a week.</p>
          <Form method="post" className="mt-4 flex flex-wrap items-end gap-3">
            <input type="hidden" name="intent" value="invite" />
            <label className="min-w-64 flex-1">
              <span className="block text-sm font-medium">E-mail</span>
              <input type="email" name="email" required className="mt-1 w-full rounded-md border border-line bg-surface px-3 py-2" />
            </label>
            <label>
              <span className="block text-sm font-medium">Role</span>
              <select name="role" defaultValue="viewer" className="mt-1 rounded-md border border-line bg-surface px-3 py-2">
                {invitable.map((role) => (
                  <option key={role} value={role}>
                    {ROLE_LABELS[role]}
                  </option>
                ))}
              </select>
            </label>
            <button type="submit" disabled={busy} className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
              Send invitation
            </button>
          </Form>

          {invitations.length > 0 ? (
            <div className="mt-6">
              <h3 className="mb-2 text-sm font-medium">Pending invitations</h3>
              <FramedTable
                label="Pending invitations"
                columns={[
                  { label: "E-mail" },
                  { label: "Role" },
                  { label: "Invited by" },
                  { label: "Mail" },
                  { label: "Expires", align: "right" },
                  { label: "Actions", hidden: true },
                ]}
              >
                {invitations.map((invitation) => (
                  <tr key={invitation.id} className="border-b border-line last:border-0">
                    <td className="py-2">{invitation.email}</td>
                    <td className="py-2">{ROLE_LABELS[invitation.role]}</td>
                    <td className="py-2">{invitation.invitedBy ?? "—"}</td>
                    <td className="py-2">{invitation.mail ? <MailState state={invitation.mail.state} error={invitation.mail.lastError} /> : "—"}</td>
                    <td className="py-2 text-right">
                      {new Date(invitation.expiresAt) < new Date() ? <span className="text-warning">expired</span> : formatDate(invitation.expiresAt)}
                    </td>
                    <td className="flex justify-end gap-2 py-2">
                      {(["resend", "revoke"] as const).map((intent) => (
                        <RowAction
                          key={intent}
                          intent={intent}
                          idName="invitationId"
                          id={invitation.id}
                          label={`${intent === "resend" ? "Resend" : "Revoke"} the invitation for ${invitation.email}`}
                        >
                          {intent === "resend" ? "Resend" : "Revoke"}
                        </RowAction>
                      ))}
                    </td>
                  </tr>
                ))}
              </FramedTable>
            </div>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
