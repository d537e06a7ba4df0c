// POST /api/v1/robots/:robotId/archive → archives the robot: kept, out of the usual lists;
// DELETE /api/v1/robots/:robotId/archive → restores it. Either answers { id, name, archivedAt };
// doing it twice changes nothing.
import type { Route } from "./+types/archive";
import { requireApiAccess } from "~/platform/access.server";
import { apiAction, apiError, methodNotAllowed } from "~/platform/errors.server";
import type { RoutePermissions } from "~/platform/permissions";
import { robotParams } from "~/features/robots/params";
import { archiveRobot, restoreRobot, type ArchiveState } from "~/features/robots/archive.server";

export const permissions = { loader: "public", action: "robots.edit" } satisfies RoutePermissions;

export const archiveJson = (state: ArchiveState) => ({ id: state.id, name: state.name, archivedAt: state.archivedAt?.toISOString() ?? null });

export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "POST" && request.method !== "DELETE") return methodNotAllowed(request.method, ["POST", "DELETE"]);
  const { user, workspace } = await requireApiAccess(request, permissions.action);
  const parsed = robotParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  const actor = { userId: user.id, workspaceId: workspace.id };
  const change = request.method === "POST" ? archiveRobot : restoreRobot;
  return apiAction(async () => Response.json(archiveJson(await change(actor, parsed.data.robotId))));
}

// A GET reads nothing here: the robot's state is in GET /api/v1/robots/:robotId.
export function loader({ request }: Route.LoaderArgs) {
  return methodNotAllowed(request.method, ["POST", "DELETE"]);
}
