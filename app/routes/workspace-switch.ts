// POST /workspace: work in another of one's workspaces.
import { data, redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/workspace-switch";
import { membershipsOf, requireUser } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { pageGuard } from "~/platform/errors.server";
import { commitSession, readSession, safeReturnTo } from "~/platform/session.server";
import { id } from "~/platform/params";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { action: "signed-in" } satisfies RoutePermissions;

const input = z.object({ workspaceId: id(), returnTo: z.string().optional() });

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const parsed = input.safeParse(Object.fromEntries(await pageGuard(() => readForm(request))));
  if (!parsed.success) throw data({ message: "Choose a workspace from the list." }, { status: 400 });
  const all = await membershipsOf(user.id);
  if (!all.some((m) => m.workspace.id === parsed.data.workspaceId)) {
    throw data({ message: "You are not a member of that workspace." }, { status: 403 });
  }
  const session = await readSession(request);
  session.set("workspaceId", parsed.data.workspaceId);
  return redirect(safeReturnTo(parsed.data.returnTo), { headers: { "Set-Cookie": await commitSession(session) } });
}
