// POST /api/v1/gaits/:gaitId/archive → archives the gait: kept, out of the usual lists;
// DELETE /api/v1/gaits/:gaitId/archive → restores it. Either answers { id, name, archivedAt };
// doing it twice changes nothing.
import { z } from "zod";
import type { Route } from "./+types/archive";
import { requireApiAccess } from "~/platform/access.server";
import { apiAction, apiError, methodNotAllowed } from "~/platform/errors.server";
import { idParam } from "~/platform/params";
import type { RoutePermissions } from "~/platform/permissions";
import { archiveGait, restoreGait } from "~/features/gaits/archive.server";

const gaitParams = z.object({ gaitId: idParam("gaitId") });

export const permissions = { loader: "public", action: "gaits.edit" } satisfies RoutePermissions;

export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "POST" && request.method !== "DELETE") return methodNotAllowed(request.method, ["POST", "DELETE"]);
  const { user, workspace } = await requireApiAccess(request, permissions.action);
  const parsed = gaitParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  const actor = { userId: user.id, workspaceId: workspace.id };
  const change = request.method === "POST" ? archiveGait : restoreGait;
  return apiAction(async () => {
    const state = await change(actor, parsed.data.gaitId);
    return Response.json({ id: state.id, name: state.name, archivedAt: state.archivedAt?.toISOString() ?? null });
  });
}

// A GET reads nothing here: a gait's versions are at GET /api/v1/gaits/:gaitId/versions.
export function loader({ request }: Route.LoaderArgs) {
  return methodNotAllowed(request.method, ["POST", "DELETE"]);
}
