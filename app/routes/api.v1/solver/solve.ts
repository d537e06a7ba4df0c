// POST /api/v1/solve — { robot, sequence, options? } → { frames, flags, summary };
// options.layout "columns" gives the compact column layout (app/gait/columns.ts),
// "checks" only flags and summary.
import type { Route } from "./+types/solve";
import { requireApiAccess } from "~/platform/access.server";
import { parseJsonText, readBodyText } from "~/platform/body.server";
import { apiAction, methodNotAllowed } from "~/platform/errors.server";
import { bodyKey, cachedAnswer, rememberAnswer } from "~/features/solver/answer-cache.server";
import { SOLVE_BODY_LIMIT_BYTES, solveRequest } from "~/features/solver/solve.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public", action: "solver.use" } satisfies RoutePermissions;

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return methodNotAllowed(request.method, ["POST"]);
  await requireApiAccess(request, permissions.action);
  const text = await readBodyText(request, SOLVE_BODY_LIMIT_BYTES);
  const key = bodyKey(text);
  // `Cache-Control: no-cache` asks for a fresh solve (the benchmarks use it to time cold requests).
  const fresh = /no-cache/.test(request.headers.get("Cache-Control") ?? "");
  const cached = fresh ? undefined : cachedAnswer(key);
  return apiAction(async () => {
    const answer = cached ?? (await solveRequest(parseJsonText(text)));
    if (cached === undefined) rememberAnswer(key, answer);
    return new Response(answer, {
      headers: { "Content-Type": "application/json", "Cache-Control": "no-store", "X-Solve-Cache": cached !== undefined ? "hit" : "miss" },
    });
  });
}

// A GET asks the solver nothing: the address takes a POST of { robot, sequence, options? }.
export function loader({ request }: Route.LoaderArgs) {
  return methodNotAllowed(request.method, ["POST"]);
}
