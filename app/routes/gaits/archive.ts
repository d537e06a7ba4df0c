// /gaits/:gaitId/archive, a form action only (the archive controls on the
// gait page and in the archived list post here):
//   intent=archive | restore → { ok, notice }; intent=delete → back to the archived list.
// A GET goes to the gait's page.
import { redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/archive";
import { requireAccess } from "~/platform/access.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { readIntentForm } from "~/platform/intent-form.server";
import { id } from "~/platform/params";
import type { RoutePermissions } from "~/platform/permissions";
import { archiveGait, deleteGait, restoreGait } from "~/features/gaits/archive.server";

const gaitParams = z.object({ gaitId: id() });

export const actionForm = z.object({ intent: z.enum(["archive", "restore", "delete"], { error: "intent must be archive, restore or delete" }) });

export const permissions = {
  loader: "gaits.read",
  action: { archive: "gaits.edit", restore: "gaits.edit", delete: "gaits.delete" },
} satisfies RoutePermissions;

const NOT_FOUND = "There is no gait at this address in your workspace.";

export async function loader({ request, params }: Route.LoaderArgs) {
  await requireAccess(request, permissions.loader);
  const parsed = gaitParams.safeParse(params);
  return redirect(parsed.success ? `/gaits/${parsed.data.gaitId}` : "/gaits");
}

export async function action({ request, params }: Route.ActionArgs) {
  return formAction(async () => {
    const { member, form } = await readIntentForm(request, actionForm, permissions.action);
    const parsed = gaitParams.safeParse(params);
    if (!parsed.success) throw new ServiceError(404, "not-found", NOT_FOUND);
    const actor = { userId: member.user.id, workspaceId: member.workspace.id };
    const { gaitId } = parsed.data;
    if (form.intent === "delete") {
      const deleted = await deleteGait(actor, gaitId);
      return redirect(`/gaits?show=archived&deleted=${encodeURIComponent(deleted.name)}`);
    }
    if (form.intent === "archive") {
      const gait = await archiveGait(actor, gaitId);
      return { ok: true as const, notice: `${gait.name} is archived: it is kept, out of the usual lists, and can be restored.` };
    }
    const gait = await restoreGait(actor, gaitId);
    return { ok: true as const, notice: `${gait.name} is back in the gait list.` };
  });
}
