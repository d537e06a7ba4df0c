// GET /api/v1/openapi.json: the OpenAPI 3.1 description of every /api/v1 route
// (app/features/api/openapi.server.ts; a unit test keeps it in step with app/routes.ts). Public.
import type { Route } from "./+types/openapi";
import { openApiPublicDocument, servePublicDocument } from "~/features/api/openapi.server";
import { apiPermissions } from "../permissions.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export function loader({ request }: Route.LoaderArgs) {
  return servePublicDocument(request, openApiPublicDocument(apiPermissions()), "application/json; charset=utf-8");
}
