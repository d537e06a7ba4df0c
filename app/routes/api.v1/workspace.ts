// GET /api/v1/workspace: which workspace and role a token or session acts with
// (build scripts call it to check their token).
import type { Route } from "./+types/workspace";
import { requireApiAccess } from "~/platform/access.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "workspace.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireApiAccess(request, permissions.loader);
  return Response.json({
    workspace: { id: member.workspace.id, slug: member.workspace.slug, name: member.workspace.name },
    role: member.role,
    user: { login: member.user.login, name: member.user.name },
    via: member.tokenId ? "token" : "session",
  });
}
