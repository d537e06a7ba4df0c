// GET /api/v1/robots/:robotId: the newest definition and the list of revisions.
import type { Route } from "./+types/robot";
import { apiError } from "~/platform/errors.server";
import { requireApiAccess } from "~/platform/access.server";
import { robotParams } from "~/features/robots/params";
import { getRobot, type RevisionSummary } from "~/features/robots/robots.server";
import type { RoutePermissions } from "~/platform/permissions";

export const revisionJson = (revision: RevisionSummary) => ({
  number: revision.number,
  message: revision.message,
  author: revision.author,
  createdAt: revision.createdAt.toISOString(),
});

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

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
    latest: { ...revisionJson(robot.latest), definition: robot.latest.definition },
    revisions: robot.revisions.map(revisionJson),
  });
}
