// DELETE /api/v1/gaits/:gaitId → deletes an archived gait none of whose versions
// was released: { id, name, deleted: true }; 409 naming what still references it otherwise.
import { z } from "zod";
import type { Route } from "./+types/gait";
import { requireApiAccess } from "~/platform/access.server";
import { apiAction, apiError, methodNotAllowed } from "~/platform/errors.server";
import { idParam } from "~/platform/params";
import type { RoutePermissions } from "~/platform/permissions";
import { deleteGait } from "~/features/gaits/archive.server";

const gaitParams = z.object({ gaitId: idParam("gaitId") });

export const permissions = { loader: "public", action: "gaits.delete" } satisfies RoutePermissions;

export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "DELETE") return methodNotAllowed(request.method, ["DELETE"]);
  const { user, workspace } = await requireApiAccess(request, permissions.action);
  const parsed = gaitParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  return apiAction(async () => {
    const deleted = await deleteGait({ userId: user.id, workspaceId: workspace.id }, parsed.data.gaitId);
    return Response.json({ ...deleted, deleted: true });
  });
}

// The API reads gaits through their versions (GET /api/v1/gaits/:gaitId/versions); this address only deletes.
export function loader({ request }: Route.LoaderArgs) {
  return methodNotAllowed(request.method, ["DELETE"]);
}
