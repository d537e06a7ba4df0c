// GET /api/v1/schema/calibration.json: the calibration profile's JSON Schema,
// generated from the zod schema (calibrationProfileJsonSchema). Public.
import type { Route } from "./+types/calibration-schema";
import { calibrationSchemaDocument, servePublicDocument } from "~/features/api/openapi.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export function loader({ request }: Route.LoaderArgs) {
  return servePublicDocument(request, calibrationSchemaDocument(), "application/schema+json; charset=utf-8");
}
