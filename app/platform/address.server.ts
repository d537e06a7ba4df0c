// A guard on request addresses, applied by the root middleware to every
// route: a NUL character (U+0000) can arrive percent-encoded in a path
// segment or a query parameter, and PostgreSQL's text cannot hold or compare
// it, so a loader that passed it on would fail its query. It is refused here,
// once, with 400 naming where it is.
import { apiError } from "./errors.server";

const NUL = "\u0000";

function refuse(request: Request, message: string, parameter?: string): Response {
  const wantsJson = new URL(request.url).pathname.startsWith("/api/");
  if (wantsJson) return apiError(400, "bad_request", message, parameter === undefined ? undefined : { parameter });
  return new Response(message, { status: 400, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

/** 400 for a NUL character in the path or a query parameter (name or value); null when there is none. */
export function addressRefusal(request: Request): Response | null {
  const url = new URL(request.url);
  // In a path, a NUL can only come percent-encoded (a literal "%" is itself "%25").
  if (/%00/.test(url.pathname)) return refuse(request, "The address contains a NUL character (%00), which no page or resource has; remove it.");
  for (const [name, value] of url.searchParams) {
    if (name.includes(NUL)) return refuse(request, "A query parameter's name contains a NUL character (%00); remove it.");
    if (value.includes(NUL))
      return refuse(request, `The query parameter "${name}" contains a NUL character (%00), which cannot be searched for or stored; remove it.`, name);
  }
  return null;
}
