// JSON errors of the /api/v1 routes: { error: { code, message, details? } }.
export type ApiErrorCode =
  | "bad_request"
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "invalid"
  | "rate_limited";

export function apiError(
  status: 400 | 401 | 403 | 404 | 409 | 413 | 422 | 429,
  code: ApiErrorCode,
  message: string,
  details?: unknown,
  headers?: HeadersInit,
): Response {
  return Response.json({ error: { code, message, ...(details === undefined ? {} : { details }) } }, { status, headers });
}

/** Reads a body's text up to `limitBytes`, answering 413 with both sizes otherwise. */
export async function readBodyText(request: Request, limitBytes: number): Promise<string> {
  const declared = Number(request.headers.get("Content-Length") ?? "0");
  if (declared > limitBytes) throw apiError(413, "payload_too_large", `The body is ${declared} bytes; the limit is ${limitBytes}.`);
  const text = await request.text();
  const size = Buffer.byteLength(text);
  if (size > limitBytes) throw apiError(413, "payload_too_large", `The body is ${size} bytes; the limit is ${limitBytes}.`);
  return text;
}

export function parseJsonText(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw apiError(400, "bad_request", `The body is not valid JSON: ${error instanceof Error ? error.message : String(error)}`);
  }
}

/** Reads a JSON body up to `limitBytes`, answering 413 or 400 with a clear message otherwise. */
export async function readJsonBody(request: Request, limitBytes: number): Promise<unknown> {
  return parseJsonText(await readBodyText(request, limitBytes));
}
