// /settings/tokens: personal API tokens for build scripts (owner, lead, firmware).
import { Form } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/tokens";
import { CopyButton } from "~/components/common/CopyButton";
import { FramedTable } from "~/components/common/FramedTable";
import { Notice } from "~/components/common/Notice";
import { RowAction } from "~/components/common/RowAction";
import { requireAccess } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { permissionOfEveryIntent } from "~/platform/intent-form.server";
import { config } from "~/platform/config.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { formatTime } from "~/platform/format";
import { id } from "~/platform/params";
import { createToken, listTokens, revokeToken, TOKEN_LIFETIMES_DAYS } from "~/features/accounts/tokens.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "tokens.manage", action: { create: "tokens.manage", revoke: "tokens.manage" } } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  return {
    tokens: await listTokens(member),
    workspace: member.workspace.name,
    apiUrl: `${config().publicUrl}/api/v1`,
    lifetimes: TOKEN_LIFETIMES_DAYS,
    now: Date.now(),
  };
}

export const actionForm = z.discriminatedUnion("intent", [
  z.object({
    intent: z.literal("create"),
    name: z.string(),
    // Days the token lasts, or "never"; absent (an older page, a script) reads as never.
    expires: z
      .union([
        z.literal("never"),
        z
          .string()
          .regex(/^[1-9][0-9]{0,3}$/, "expires must be a number of days or never")
          .transform(Number),
      ])
      .optional()
      .transform((value) => (value === undefined || value === "never" ? null : value)),
  }),
  z.object({ intent: z.literal("revoke"), tokenId: id("That is not a valid token id.") }),
]);

export async function action({ request }: Route.ActionArgs) {
  const member = await requireAccess(request, permissionOfEveryIntent(permissions.action));
  return formAction(async () => {
    const parsed = actionForm.safeParse(Object.fromEntries(await readForm(request)));
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      throw new ServiceError(400, "bad-request", issue?.message ?? "The form was incomplete.", issue ? { field: issue.path.join(".") } : undefined);
    }
    const command = parsed.data;
    if (command.intent === "create") {
      const { token, row } = await createToken(member, command.name, command.expires);
      return { created: { token, name: row.name, expiresAt: row.expiresAt } };
    }
    await revokeToken(member, command.tokenId);
    return { success: "Token revoked; scripts using it now get 401." };
  });
}

export const meta: Route.MetaFunction = () => [{ title: "API tokens · Gaitloom" }];

const when = (date: Date | string | null) => (date ? formatTime(date, { zone: false }) : "never");

const lifetime = (days: number) => (days === 365 ? "1 year" : `${days} days`);

export default function Tokens({ loaderData, actionData }: Route.ComponentProps) {
  const created = actionData && "created" in actionData ? actionData.created : null;
  return (
    <div className="max-w-4xl space-y-6">
      <p className="text-ink-muted">
        A token acts with your role in {loaderData.workspace} and nowhere else. Send it as{" "}
        <code className="font-mono">Authorization: Bearer &lt;token&gt;</code> to {loaderData.apiUrl}.
      </p>
      <Notice
        error={actionData && "error" in actionData ? actionData.error : null}
        success={actionData && "success" in actionData ? actionData.success : null}
      />
      {created ? (
        <section role="status" aria-label="New token" className="rounded-lg border border-accent bg-accent-soft p-4">
          <p className="font-medium">Token “{created.name}” created. Copy it now: it is shown only this once.</p>
          <div className="mt-2 flex items-start gap-2">
            <code data-testid="new-token" className="block flex-1 break-all rounded bg-surface px-3 py-2 font-mono text-sm">
              {created.token}
            </code>
            <CopyButton text={created.token} label="Copy token" className="shrink-0 py-2" />
          </div>
          <p className="mt-2 text-sm text-ink-muted">
            {created.expiresAt ? `It stops working at ${formatTime(created.expiresAt)}.` : "It works until you revoke it."}
          </p>
        </section>
      ) : null}
      <Form method="post" className="flex items-end gap-3 rounded-lg border border-line bg-surface p-6">
        <input type="hidden" name="intent" value="create" />
        <label className="flex-1">
          <span className="block text-sm font-medium">Token name</span>
          <input
            name="name"
            required
            maxLength={60}
            placeholder="e.g. firmware build server"
            className="mt-1 w-full rounded-md border border-line bg-surface px-3 py-2"
          />
        </label>
        <label>
          <span className="block text-sm font-medium">Expires</span>
          <select name="expires" defaultValue="90" className="mt-1 rounded-md border border-line bg-surface px-3 py-2">
            {loaderData.lifetimes.map((days) => (
              <option key={days} value={days}>
                after {lifetime(days)}
              </option>
            ))}
            <option value="never">never</option>
          </select>
        </label>
        <button type="submit" className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
          Create token
        </button>
      </Form>
      {loaderData.tokens.length === 0 ? (
        <p className="text-ink-muted">You have no tokens for this workspace yet.</p>
      ) : (
        <FramedTable
          label="Your API tokens"
          columns={[
            { label: "Name" },
            { label: "Starts with" },
            { label: "Created", align: "right" },
            { label: "Last used", align: "right" },
            { label: "Expires", align: "right" },
            { label: "State", hidden: true },
          ]}
        >
          {loaderData.tokens.map((token) => (
            <tr key={token.id} className="border-b border-line last:border-0">
              <td className="px-4 py-2 font-medium">{token.name}</td>
              <td className="px-4 py-2 font-mono">{token.prefix}…</td>
              <td className="px-4 py-2 text-right whitespace-nowrap tabular-nums">{when(token.createdAt)}</td>
              <td className="px-4 py-2 text-right whitespace-nowrap tabular-nums">{when(token.lastUsedAt)}</td>
              <td className="px-4 py-2 text-right whitespace-nowrap tabular-nums">
                {token.expiresAt === null ? (
                  "never"
                ) : new Date(token.expiresAt).getTime() <= loaderData.now ? (
                  <span className="text-danger">expired {when(token.expiresAt)}</span>
                ) : (
                  when(token.expiresAt)
                )}
              </td>
              <td className="px-4 py-2 text-right">
                {token.revokedAt ? (
                  <span className="text-ink-muted">revoked {when(token.revokedAt)}</span>
                ) : (
                  <RowAction intent="revoke" idName="tokenId" id={token.id} label={`Revoke ${token.name}`} danger>
                    Revoke
                  </RowAction>
                )}
              </td>
            </tr>
          ))}
        </FramedTable>
      )}
    </div>
  );
}
