// GET /api/v1/robots: the workspace's robots with their newest revision.
import type { Route } from "./+types/list";
import { requireApiAccess } from "~/platform/access.server";
import { listRobots } from "~/features/robots/robots.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  const robots = await listRobots(workspace.id);
  return Response.json({
    robots: robots.map((robot) => ({
      id: robot.id,
      name: robot.name,
      legCount: robot.legCount,
      latestRevision: robot.latestRevision,
      updatedAt: robot.updatedAt.toISOString(),
      url: `/api/v1/robots/${robot.id}`,
    })),
  });
}
