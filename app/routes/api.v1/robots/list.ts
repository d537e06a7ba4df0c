// GET /api/v1/robots: the workspace's robots with their newest revision; ?archived=true: the archived ones.
import type { Route } from "./+types/list";
import { requireApiAccess } from "~/platform/access.server";
import { apiError } from "~/platform/errors.server";
import { listRobots } from "~/features/robots/robots.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  const archived = new URL(request.url).searchParams.get("archived");
  if (archived !== null && archived !== "true" && archived !== "false")
    throw apiError(400, "bad_request", `archived must be true or false (got ${JSON.stringify(archived)})`);
  const robots = await listRobots(workspace.id, { archived: archived === "true" });
  return Response.json({
    robots: robots.map((robot) => ({
      id: robot.id,
      name: robot.name,
      legCount: robot.legCount,
      latestRevision: robot.latestRevision,
      updatedAt: robot.updatedAt.toISOString(),
      archivedAt: robot.archivedAt?.toISOString() ?? null,
      url: `/api/v1/robots/${robot.id}`,
    })),
  });
}
