// Every /api/v1 refusal and failure in the API's one error shape,
// `{ error: { code, message, details? } }`, applied by the root middleware.
// Routes answer in that shape themselves (apiError, apiAction); what this
// catches are the answers the framework makes on its own: its 405 for a
// method a route has no action for, which reads {"message":"Unexpected
// Server Error"}, and its plain-text 500 for an error no route caught, or an
// error thrown past the routes.
import { apiError, methodNotAllowed, type ApiErrorCode } from "./errors.server";

const isApiPath = (request: Request) => /^\/api\/v1(\/|$)/.test(new URL(request.url).pathname);

// The sentence for a status when the answer being replaced has none worth keeping.
const FALLBACKS: Record<number, [ApiErrorCode, string]> = {
  400: ["bad_request", "The request is malformed."],
  401: ["unauthorized", "Sign in, or send `Authorization: Bearer <token>`."],
  403: ["forbidden", "This request is not allowed."],
  404: ["not_found", "There is nothing at this address; /api/v1/openapi.json lists what there is."],
  409: ["conflict", "The request conflicts with the current state."],
  413: ["payload_too_large", "The body is larger than this route takes."],
  415: ["unsupported_media_type", "The body's Content-Type is not one this route takes."],
  422: ["invalid", "The request is well-formed but not valid."],
  429: ["rate_limited", "Too many requests; try again later."],
  503: ["unavailable", "The service is busy; try again shortly."],
};

const INTERNAL: [ApiErrorCode, string] = ["internal_error", "Something went wrong on our side and the request was not completed; the error has been logged."];

async function isApiError(response: Response): Promise<boolean> {
  if (!/^application\/json/i.test(response.headers.get("Content-Type") ?? "")) return false;
  try {
    const body = (await response.clone().json()) as { error?: { code?: unknown; message?: unknown } };
    return typeof body?.error?.code === "string" && typeof body.error.message === "string";
  } catch {
    return false;
  }
}

async function reshape(request: Request, response: Response): Promise<Response> {
  // The framework's own 405 comes only for a write to a route with no action: a read-only route.
  if (response.status === 405) return methodNotAllowed(request.method, ["GET", "HEAD"]);
  const known = response.status < 500 ? FALLBACKS[response.status] : undefined;
  const [status, [code, message]] = known ? [response.status, known] : response.status < 500 ? [400, FALLBACKS[400]] : [500, INTERNAL];
  const headers = new Headers(response.headers);
  headers.delete("Content-Type");
  headers.delete("Content-Length");
  return apiError(status as Parameters<typeof apiError>[0], code, message, undefined, headers);
}

/**
 * The answer of `next` for an /api/v1 request, with any refusal or failure
 * not yet in the API's shape put into it (other requests' answers pass as
 * they are). An error thrown past the routes is logged and answered 500
 * without its own text, which may name internals.
 */
export async function apiErrorShape(request: Request, next: () => Promise<Response>): Promise<Response> {
  if (!isApiPath(request)) return next();
  let response: Response;
  try {
    response = await next();
  } catch (error) {
    if (!(error instanceof Response)) {
      console.error(error);
      return apiError(500, INTERNAL[0], INTERNAL[1]);
    }
    response = error;
  }
  if (response.status < 400 || (await isApiError(response))) return response;
  return reshape(request, response);
}
