import { Form, redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/workspace";
import { Notice } from "~/components/common/Notice";
import { requireAccess } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { renameWorkspace, summarizeWorkspace } from "~/features/accounts/workspaces.server";

export const permissions = { loader: "workspace.read", action: "workspace.manage" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  return { workspace: await summarizeWorkspace(workspace), canManage: can(role, "workspace.manage") };
}

const input = z.object({ name: z.string() });

export async function action({ request }: Route.ActionArgs) {
  const member = await requireAccess(request, permissions.action);
  return formAction(async () => {
    const parsed = input.safeParse(Object.fromEntries(await readForm(request)));
    if (!parsed.success) throw new ServiceError(400, "bad-request", "Give the workspace a name.");
    await renameWorkspace(member.user, member.workspace, parsed.data.name);
    return redirect("/settings");
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Workspace settings · Gaitloom" }];

export default function WorkspaceSettings({ loaderData, actionData }: Route.ComponentProps) {
  const { workspace, canManage } = loaderData;
  return (
    <div className="max-w-xl">
      <Notice error={actionData && "error" in actionData ? actionData.error : null} />
      <dl className="grid grid-cols-[10rem_1fr] gap-y-2 rounded-lg bg-surface p-6">
        <dt className="text-ink-muted">Address name</dt>
        <dd className="font-mono">{workspace.slug}</dd>
        <dt className="text-ink-muted">Robots</dt>
        <dd className="numeric">{workspace.robotCount}</dd>
        <dt className="text-ink-muted">Gaits</dt>
        <dd className="numeric">{workspace.gaitCount}</dd>
      </dl>
      {canManage ? (
        <Form method="post" className="mt-6 flex items-end gap-3">
          <label className="flex-1">
            <span className="block text-sm font-medium">Workspace name</span>
            <input name="name" defaultValue={workspace.name} required className="mt-1 w-full rounded-md border border-line bg-surface px-3 py-2" />
          </label>
          <button type="submit" className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
            Rename
          </button>
        </Form>
      ) : (
        <p className="mt-4 text-ink-muted">Workspace name: {workspace.name}</p>
      )}
    </div>
  );
}
