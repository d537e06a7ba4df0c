// A robot revision's definition as a JSON file.
import { data } from "react-router";
import type { Route } from "./+types/download";
import { requireAccess } from "~/platform/access.server";
import { definitionFileName, definitionFileText } from "~/features/robots/files";
import { revisionParams } from "~/features/robots/params";
import { getRevision } from "~/features/robots/robots.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace } = await requireAccess(request, permissions.loader);
  const parsed = revisionParams.safeParse(params);
  if (!parsed.success) throw data({ message: parsed.error.issues[0].message }, { status: 404 });
  const found = await getRevision(workspace.id, parsed.data.robotId, parsed.data.number);
  if (!found) throw data({ message: "There is no such robot revision in your workspace." }, { status: 404 });
  const fileName = definitionFileName(found.robot.name, found.revision.number);
  return new Response(definitionFileText(found.revision.definition), {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${fileName}"`,
      // A revision never changes, but who may read it can: private.
      "Cache-Control": "private, max-age=3600",
    },
  });
}
