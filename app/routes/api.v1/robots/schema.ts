// GET /api/v1/schema/robot.json: the robot definition's JSON Schema, generated
// from the zod schema (robotJsonSchema). Public: no sign-in, cacheable.
import { createHash } from "node:crypto";
import type { Route } from "./+types/schema";
import { robotJsonSchema } from "~/kinematics";
import { config } from "~/platform/config.server";
import type { RoutePermissions } from "~/platform/permissions";

let cached: { body: string; etag: string } | undefined;

function schemaDocument() {
  if (!cached) {
    const body = `${JSON.stringify({ $id: `${config().publicUrl}/api/v1/schema/robot.json`, ...robotJsonSchema() }, null, 2)}\n`;
    cached = { body, etag: `"${createHash("sha256").update(body).digest("hex").slice(0, 32)}"` };
  }
  return cached;
}

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { body, etag } = schemaDocument();
  const headers = {
    "Content-Type": "application/schema+json; charset=utf-8",
    "Cache-Control": "public, max-age=3600",
    ETag: etag,
    "Access-Control-Allow-Origin": "*",
  };
  if (request.headers.get("If-None-Match") === etag) return new Response(null, { status: 304, headers });
  return new Response(body, { headers });
}
