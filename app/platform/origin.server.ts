// Cross-site request forgery guard: a mutation that carries a cookie must come
// from the app's own origin. Bearer-token calls carry no cookie, so build
// scripts need no Origin header.
import { config } from "./config.server";
import { apiError } from "./errors.server";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export function crossOriginRefusal(request: Request): Response | null {
  if (SAFE_METHODS.has(request.method) || !request.headers.has("Cookie")) return null;
  const origin = request.headers.get("Origin");
  const allowed = new Set([config().publicUrl, new URL(request.url).origin]);
  if (origin && allowed.has(origin)) return null;
  const message = origin
    ? `Refused: this request came from ${origin}, not from Gaitloom's own pages.`
    : "Refused: a request that carries a session cookie must name its Origin.";
  const wantsJson = new URL(request.url).pathname.startsWith("/api/");
  return wantsJson ? apiError(403, "forbidden", message) : new Response(message, { status: 403, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}
