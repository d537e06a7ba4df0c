// Reading request bodies within a limit: form posts (urlencoded or
// multipart) and the JSON bodies of the API.
import { apiError } from "./errors.server";

// A form is never held beyond `limitBytes`: the declared Content-Length is
// checked first, then the stream is counted as it arrives, so a huge upload
// is refused early.

export type LimitedForm = { ok: true; form: FormData } | { ok: false; tooLarge: true; bytes: number } | { ok: false; tooLarge: false; message: string };

export async function readFormWithin(request: Request, limitBytes: number): Promise<LimitedForm> {
  const declared = Number(request.headers.get("Content-Length") ?? "0");
  if (Number.isFinite(declared) && declared > limitBytes) return { ok: false, tooLarge: true, bytes: declared };
  const chunks: Uint8Array[] = [];
  let received = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      received += value.byteLength;
      if (received > limitBytes) {
        await reader.cancel();
        return { ok: false, tooLarge: true, bytes: received };
      }
      chunks.push(value);
    }
  }
  const body = Buffer.concat(chunks);
  try {
    const form = await new Request(request.url, { method: "POST", headers: request.headers, body }).formData();
    return { ok: true, form };
  } catch (error) {
    return { ok: false, tooLarge: false, message: `The form could not be read: ${error instanceof Error ? error.message : String(error)}` };
  }
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
