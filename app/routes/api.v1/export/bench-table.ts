// GET /api/v1/robots/:robotId/bench-table?kind=centre|sweep&leg=&joint=&speed=&dwell=&seconds=&fps=&hold=&format=&units=&profile=&override=
// Bring-up tables of the robot's newest revision, for a robot on a stand:
// every servo at its centre, or a slow sweep of one joint checked for speed.
import type { Route } from "./+types/bench-table";
import { requireApiAccess } from "~/platform/access.server";
import { apiAction } from "~/platform/errors.server";
import { prepareBenchTable, recordBenchDownload, renderBenchTable } from "~/features/tables/bench-tables.server";
import { benchQuerySchema, matchesIfNoneMatch, parseParams, parseQuery, robotParamsSchema, tableHeaders } from "~/features/tables/query";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "tables.download" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireApiAccess(request, permissions.loader);
  return apiAction(async () => {
    const { robotId } = parseParams(robotParamsSchema, params);
    const query = parseQuery(benchQuerySchema, new URL(request.url).searchParams);
    const prepared = await prepareBenchTable(member.workspace.id, robotId, query);
    if (matchesIfNoneMatch(request.headers.get("If-None-Match"), prepared.etag)) {
      return new Response(null, { status: 304, headers: tableHeaders(prepared.etag) });
    }
    const rendered = await renderBenchTable(prepared);
    // A HEAD asks about the file without taking it: not a download.
    if (request.method !== "HEAD")
      await recordBenchDownload({ workspaceId: member.workspace.id, userId: member.user.id, tokenId: member.tokenId }, prepared, rendered);
    return new Response(rendered.body, { headers: tableHeaders(prepared.etag, rendered) });
  });
}
