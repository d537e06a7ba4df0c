// POST /api/v1/solve — { robot, sequence, options? } → { frames, flags, summary }.
import type { Route } from "./+types/solve";
import { requireApiAccess } from "~/lib/access.server";
import { apiError, readJsonBody } from "~/lib/api.server";
import { InputIssues, SOLVE_BODY_LIMIT_BYTES, solveRequest } from "~/lib/solver.server";

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return apiError(400, "bad_request", "Use POST with a JSON body.");
  await requireApiAccess(request, "solver.use");
  const body = await readJsonBody(request, SOLVE_BODY_LIMIT_BYTES);
  try {
    return Response.json(solveRequest(body), { headers: { "Cache-Control": "no-store" } });
  } catch (error) {
    if (error instanceof InputIssues) return apiError(422, "invalid", error.message, error.issues);
    throw error;
  }
}

export function loader() {
  return apiError(400, "bad_request", "POST a JSON body { robot, sequence, options? } to this address.");
}
