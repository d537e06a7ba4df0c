// POST /api/v1/ik — { robot, feet: { LF: [x, y, z], ... }, bodyPose? } → angles per leg.
import type { Route } from "./+types/ik";
import { requireApiAccess } from "~/platform/access.server";
import { apiError, readJsonBody } from "~/platform/api-errors.server";
import { InputIssues, solveFeet } from "~/features/solver/solve.server";

const IK_BODY_LIMIT_BYTES = 256 * 1024;

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return apiError(400, "bad_request", "Use POST with a JSON body.");
  await requireApiAccess(request, "solver.use");
  const body = await readJsonBody(request, IK_BODY_LIMIT_BYTES);
  try {
    return Response.json({ legs: solveFeet(body) }, { headers: { "Cache-Control": "no-store" } });
  } catch (error) {
    if (error instanceof InputIssues) return apiError(422, "invalid", error.message, error.issues);
    throw error;
  }
}

export function loader() {
  return apiError(400, "bad_request", "POST a JSON body { robot, feet, bodyPose? } to this address.");
}
