// POST /api/v1/ik — { robot, feet: { LF: [x, y, z], ... }, bodyPose? } → angles per leg.
import type { Route } from "./+types/ik";
import { requireApiAccess } from "~/platform/access.server";
import { readJsonBody } from "~/platform/body.server";
import { apiAction, apiError } from "~/platform/errors.server";
import { solveFeet } from "~/features/solver/solve.server";
import type { RoutePermissions } from "~/platform/permissions";

const IK_BODY_LIMIT_BYTES = 256 * 1024;

export const permissions = { loader: "public", action: "solver.use" } satisfies RoutePermissions;

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return apiError(400, "bad_request", "Use POST with a JSON body.");
  await requireApiAccess(request, permissions.action);
  const body = await readJsonBody(request, IK_BODY_LIMIT_BYTES);
  return apiAction(async () => Response.json({ legs: await solveFeet(body) }, { headers: { "Cache-Control": "no-store" } }));
}

export function loader() {
  return apiError(400, "bad_request", "POST a JSON body { robot, feet, bodyPose? } to this address.");
}
