// GET /api/v1/workspace: which workspace and role a token or session acts with
// (build scripts call it to check their token).
import type { Route } from "./+types/workspace";
import { requireApiAccess } from "~/platform/access.server";

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireApiAccess(request, "workspace.read");
  return Response.json({
    workspace: { id: member.workspace.id, slug: member.workspace.slug, name: member.workspace.name },
    role: member.role,
    user: { login: member.user.login, name: member.user.name },
    via: member.tokenId ? "token" : "session",
  });
}
