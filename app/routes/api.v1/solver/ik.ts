// POST /api/v1/ik — { robot, feet: { LF: [x, y, z], ... }, bodyPose? } → angles per leg.
import type { Route } from "./+types/ik";
import { requireApiAccess } from "~/platform/access.server";
import { readJsonBody } from "~/platform/body.server";
import { apiAction, methodNotAllowed } from "~/platform/errors.server";
import { solveFeet } from "~/features/solver/solve.server";
import type { RoutePermissions } from "~/platform/permissions";

const IK_BODY_LIMIT_BYTES = 256 * 1024;

export const permissions = { loader: "public", action: "solver.use" } satisfies RoutePermissions;

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return methodNotAllowed(request.method, ["POST"]);
  await requireApiAccess(request, permissions.action);
  const body = await readJsonBody(request, IK_BODY_LIMIT_BYTES);
  return apiAction(async () => Response.json({ legs: await solveFeet(body) }, { headers: { "Cache-Control": "no-store" } }));
}

// A GET asks the solver nothing: the address takes a POST of { robot, feet, bodyPose? }.
export function loader({ request }: Route.LoaderArgs) {
  return methodNotAllowed(request.method, ["POST"]);
}
