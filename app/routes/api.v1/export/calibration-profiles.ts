// GET /api/v1/robots/:robotId/calibration-profiles: the robot's calibration
// profiles (one per physical unit), for build scripts choosing `profile=`.
import type { Route } from "./+types/calibration-profiles";
import { requireApiAccess } from "~/platform/access.server";
import { calibrationRobot, listProfiles } from "~/features/robots/calibration.server";
import { apiAction } from "~/platform/errors.server";
import { parseParams, robotParamsSchema } from "~/features/tables/query";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  return apiAction(async () => {
    const { robotId } = parseParams(robotParamsSchema, params);
    const robot = await calibrationRobot(workspace.id, robotId);
    const profiles = await listProfiles(robot.id);
    return Response.json(
      {
        robot: { id: robot.id, name: robot.name, revision: robot.revision },
        profiles: profiles.map((entry) => ({
          id: entry.id,
          name: entry.name,
          revision: entry.revision,
          updatedAt: entry.updatedAt.toISOString(),
          updatedBy: entry.updatedBy,
          profile: entry.profile,
        })),
      },
      { headers: { "Cache-Control": "no-store" } },
    );
  });
}
