// GET /api/v1/gaits/:gaitId/versions/:number/table?format=&units=&rate=&profile=&override=
// The per-frame angle table of a version (`released` for the gait's released
// one), solved with the robot revision the version pins, at the asked rate (a
// new solve), with a calibration profile applied; an ETag per representation
// and 304 on If-None-Match; every download in the audit log.
import type { Route } from "./+types/table";
import { requireApiAccess } from "~/platform/access.server";
import { apiAction } from "~/platform/errors.server";
import { matchesIfNoneMatch, parseParams, parseQuery, tableHeaders, tableParamsSchema, tableQuerySchema } from "~/features/tables/query";
import { prepareVersionTable, recordTableDownload, renderVersionTable } from "~/features/tables/version-table.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "tables.download" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireApiAccess(request, permissions.loader);
  return apiAction(async () => {
    const { gaitId, number } = parseParams(tableParamsSchema, params);
    const query = parseQuery(tableQuerySchema, new URL(request.url).searchParams);
    const prepared = await prepareVersionTable(member.workspace.id, gaitId, number, query);
    if (matchesIfNoneMatch(request.headers.get("If-None-Match"), prepared.etag)) {
      return new Response(null, { status: 304, headers: tableHeaders(prepared.etag) });
    }
    const rendered = await renderVersionTable(prepared);
    // A HEAD asks about the file without taking it: not a download.
    if (request.method !== "HEAD")
      await recordTableDownload({ workspaceId: member.workspace.id, userId: member.user.id, tokenId: member.tokenId }, prepared, rendered, number);
    return new Response(rendered.body, { headers: tableHeaders(prepared.etag, rendered) });
  });
}
