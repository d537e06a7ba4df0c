// GET /api/v1/schema/calibration.json: the calibration profile's JSON Schema,
// generated from the zod schema (calibrationProfileJsonSchema). Public.
import type { Route } from "./+types/calibration-schema";
import { calibrationSchemaDocument, servePublicDocument } from "~/features/api/openapi.server";

export function loader({ request }: Route.LoaderArgs) {
  return servePublicDocument(request, calibrationSchemaDocument(), "application/schema+json; charset=utf-8");
}
