// GET /api/v1/gaits/:gaitId/versions: every version of a gait, newest first,
// with its state, message, author, time, content hash and solved summary.
import { z } from "zod";
import type { Route } from "./+types/versions";
import { requireApiAccess } from "~/platform/access.server";
import { idParam } from "~/platform/params";
import { apiError } from "~/platform/errors.server";
import { getGait, listVersions } from "~/features/versions/versions.server";
import type { RoutePermissions } from "~/platform/permissions";

const params = z.object({ gaitId: idParam("gaitId") });

export const permissions = { loader: "gaits.read" } satisfies RoutePermissions;

export async function loader({ request, params: raw }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  const parsed = params.safeParse(raw);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  const gait = await getGait(workspace.id, parsed.data.gaitId);
  if (!gait) throw apiError(404, "not_found", `No gait ${parsed.data.gaitId} in this workspace.`);
  const versions = await listVersions(workspace.id, gait.id);
  return Response.json({
    gait: { id: gait.id, name: gait.name, robotId: gait.robot.id, robotName: gait.robot.name, releasedVersion: gait.releasedVersion },
    versions: versions.map((version) => ({
      id: version.id,
      number: version.number,
      state: version.state,
      message: version.message,
      author: version.author ? { login: version.author.login, name: version.author.name } : null,
      createdAt: version.createdAt.toISOString(),
      stateChangedAt: version.stateChangedAt.toISOString(),
      robotRevision: version.robotRevision,
      contentHash: version.contentHash,
      summary: version.summary,
    })),
  });
}
