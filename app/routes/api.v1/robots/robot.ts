// GET /api/v1/robots/:robotId: the newest definition and the list of revisions.
// DELETE /api/v1/robots/:robotId: deletes an archived robot no gait uses → { id, name, deleted: true };
// 409 naming what still references it otherwise.
import type { Route } from "./+types/robot";
import { apiAction, apiError, methodNotAllowed } from "~/platform/errors.server";
import { requireApiAccess } from "~/platform/access.server";
import { robotParams } from "~/features/robots/params";
import { getRobot, type RevisionSummary } from "~/features/robots/robots.server";
import { deleteRobot } from "~/features/robots/archive.server";
import type { RoutePermissions } from "~/platform/permissions";

export const revisionJson = (revision: RevisionSummary) => ({
  number: revision.number,
  message: revision.message,
  author: revision.author,
  createdAt: revision.createdAt.toISOString(),
});

export const permissions = { loader: "robots.read", action: "robots.delete" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  const parsed = robotParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  const robot = await getRobot(workspace.id, parsed.data.robotId);
  if (!robot) throw apiError(404, "not_found", `No robot ${parsed.data.robotId} in this workspace.`);
  return Response.json({
    id: robot.id,
    name: robot.name,
    createdAt: robot.createdAt.toISOString(),
    archivedAt: robot.archivedAt?.toISOString() ?? null,
    latest: { ...revisionJson(robot.latest), definition: robot.latest.definition },
    revisions: robot.revisions.map(revisionJson),
  });
}

export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "DELETE") return methodNotAllowed(request.method, ["GET", "HEAD", "DELETE"]);
  const { user, workspace } = await requireApiAccess(request, permissions.action);
  const parsed = robotParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  return apiAction(async () => {
    const deleted = await deleteRobot({ userId: user.id, workspaceId: workspace.id }, parsed.data.robotId);
    return Response.json({ ...deleted, deleted: true });
  });
}
