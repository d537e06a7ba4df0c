// /api/v1/* that no other route has: 404 in the API's error shape, for any
// method, rather than the app's HTML page for unknown addresses. Public: it
// says only that nothing is there.
import type { Route } from "./+types/not-found";
import { apiError } from "~/platform/errors.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public", action: "public" } satisfies RoutePermissions;

function notFound(request: Request): Response {
  const { pathname } = new URL(request.url);
  return apiError(404, "not_found", `There is no API route at ${pathname}; /api/v1/openapi.json lists them all.`);
}

export function loader({ request }: Route.LoaderArgs) {
  return notFound(request);
}

export function action({ request }: Route.ActionArgs) {
  return notFound(request);
}
