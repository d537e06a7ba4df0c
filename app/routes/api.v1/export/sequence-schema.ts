// GET /api/v1/schema/sequence.json: the gait sequence's JSON Schema, generated
// from the zod schema (sequenceJsonSchema). Public: no sign-in, cacheable.
import type { Route } from "./+types/sequence-schema";
import { sequenceSchemaDocument, servePublicDocument } from "~/features/api/openapi.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export function loader({ request }: Route.LoaderArgs) {
  return servePublicDocument(request, sequenceSchemaDocument(), "application/schema+json; charset=utf-8");
}
