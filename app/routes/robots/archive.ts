// /robots/:robotId/archive, a form action only (the archive controls on the
// robot page and in the archived list post here):
//   intent=archive | restore → { ok, notice }; intent=delete → back to the archived list.
// A GET goes to the robot's page.
import { redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/archive";
import { requireAccess } from "~/platform/access.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { readIntentForm } from "~/platform/intent-form.server";
import type { RoutePermissions } from "~/platform/permissions";
import { robotParams } from "~/features/robots/params";
import { archiveRobot, deleteRobot, restoreRobot } from "~/features/robots/archive.server";

export const actionForm = z.object({ intent: z.enum(["archive", "restore", "delete"], { error: "intent must be archive, restore or delete" }) });

export const permissions = {
  loader: "robots.read",
  action: { archive: "robots.edit", restore: "robots.edit", delete: "robots.delete" },
} satisfies RoutePermissions;

const NOT_FOUND = "There is no robot at this address in your workspace.";

export async function loader({ request, params }: Route.LoaderArgs) {
  await requireAccess(request, permissions.loader);
  const parsed = robotParams.safeParse(params);
  return redirect(parsed.success ? `/robots/${parsed.data.robotId}` : "/robots");
}

export async function action({ request, params }: Route.ActionArgs) {
  return formAction(async () => {
    const { member, form } = await readIntentForm(request, actionForm, permissions.action);
    const parsed = robotParams.safeParse(params);
    if (!parsed.success) throw new ServiceError(404, "not-found", NOT_FOUND);
    const actor = { userId: member.user.id, workspaceId: member.workspace.id };
    const { robotId } = parsed.data;
    if (form.intent === "delete") {
      const deleted = await deleteRobot(actor, robotId);
      return redirect(`/robots?show=archived&deleted=${encodeURIComponent(deleted.name)}`);
    }
    if (form.intent === "archive") {
      const robot = await archiveRobot(actor, robotId);
      return { ok: true as const, notice: `${robot.name} is archived: it is kept, out of the usual lists, and can be restored.` };
    }
    const robot = await restoreRobot(actor, robotId);
    return { ok: true as const, notice: `${robot.name} is back in the robot list.` };
  });
}
