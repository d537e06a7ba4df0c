// GET /healthz: is the app up and can it reach its database?
import { pingDatabase } from "~/platform/db.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader() {
  const database = await pingDatabase();
  const body = { ok: database.ok, service: "gaitloom", time: new Date().toISOString(), database };
  return Response.json(body, { status: database.ok ? 200 : 503, headers: { "Cache-Control": "no-store" } });
}
