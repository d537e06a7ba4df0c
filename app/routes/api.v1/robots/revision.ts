// GET /api/v1/robots/:robotId/revisions/:number: one revision's definition, for build scripts that pin one.
import type { Route } from "./+types/revision";
import { apiError } from "~/platform/errors.server";
import { requireApiAccess } from "~/platform/access.server";
import { revisionParams } from "~/features/robots/params";
import { getRevision } from "~/features/robots/robots.server";
import { revisionJson } from "./robot";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  const parsed = revisionParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  const found = await getRevision(workspace.id, parsed.data.robotId, parsed.data.number);
  if (!found) throw apiError(404, "not_found", `No revision ${parsed.data.number} of robot ${parsed.data.robotId} in this workspace.`);
  return Response.json({
    robot: found.robot,
    latestRevision: found.latestNumber,
    revision: { ...revisionJson(found.revision), definition: found.revision.definition },
  });
}
