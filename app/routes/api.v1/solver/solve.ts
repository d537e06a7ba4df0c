// POST /api/v1/solve — { robot, sequence, options? } → { frames, flags, summary };
// options.layout "columns" gives the compact column layout (app/gait/columns.ts),
// "checks" only flags and summary.
import type { Route } from "./+types/solve";
import { requireApiAccess } from "~/platform/access.server";
import { apiError, parseJsonText, readBodyText } from "~/platform/api-errors.server";
import { bodyKey, cachedAnswer, rememberAnswer } from "~/features/solver/answer-cache.server";
import { InputIssues, SOLVE_BODY_LIMIT_BYTES, solveRequest } from "~/features/solver/solve.server";

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") return apiError(400, "bad_request", "Use POST with a JSON body.");
  await requireApiAccess(request, "solver.use");
  const text = await readBodyText(request, SOLVE_BODY_LIMIT_BYTES);
  const key = bodyKey(text);
  // `Cache-Control: no-cache` asks for a fresh solve (the benchmarks use it to time cold requests).
  const fresh = /no-cache/.test(request.headers.get("Cache-Control") ?? "");
  let answer = fresh ? undefined : cachedAnswer(key);
  const hit = answer !== undefined;
  if (answer === undefined) {
    try {
      answer = solveRequest(parseJsonText(text));
    } catch (error) {
      if (error instanceof InputIssues) return apiError(422, "invalid", error.message, error.issues);
      throw error;
    }
    rememberAnswer(key, answer);
  }
  return new Response(answer, {
    headers: { "Content-Type": "application/json", "Cache-Control": "no-store", "X-Solve-Cache": hit ? "hit" : "miss" },
  });
}

export function loader() {
  return apiError(400, "bad_request", "POST a JSON body { robot, sequence, options? } to this address.");
}
