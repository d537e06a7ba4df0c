// Reading request bodies within a limit: form posts (urlencoded or
// multipart) and the JSON bodies of the API. Every route that reads a body
// reads it here, never with request.formData(), .text() or .json(), which
// read whatever arrives to the end.
import { apiError, ServiceError } from "./errors.server";

/** What a form of a few short fields may take. */
export const FORM_LIMIT_BYTES = 16 * 1024;

type Bytes = { ok: true; bytes: Uint8Array<ArrayBuffer> } | { ok: false; bytes: number };

// A body declared up to this size is read to its end even when it is refused,
// discarding what is beyond the limit, so the connection can carry the next
// request and the client, still sending, is not cut off before the answer.
const DRAIN_LIMIT_BYTES = 8 * 1024 * 1024;

/**
 * The body's bytes, never holding more than `limitBytes`. A body over the
 * limit is refused; if its declared Content-Length is small enough it is read
 * to the end and discarded, otherwise (a larger one, or a chunked upload
 * with no declared length) reading stops at once, and the stream is released
 * rather than cancelled: cancelling destroys the connection under the answer,
 * so the client would see a reset instead of the 413. server.js closes a
 * connection whose body was left unread once the answer is out.
 */
async function readBytesWithin(request: Request, limitBytes: number): Promise<Bytes> {
  const header = request.headers.get("Content-Length");
  const declared = header !== null && /^\d+$/.test(header) ? Number(header) : null;
  const drain = declared !== null && declared <= DRAIN_LIMIT_BYTES;
  if (!request.body) return { ok: true, bytes: new Uint8Array(0) };
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  try {
    if (declared !== null && declared > limitBytes && !drain) return { ok: false, bytes: declared };
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      received += value.byteLength;
      if (received <= limitBytes) chunks.push(value);
      else if (!drain || received > DRAIN_LIMIT_BYTES) return { ok: false, bytes: received };
    }
  } finally {
    reader.releaseLock();
  }
  if (received > limitBytes) return { ok: false, bytes: received };
  return { ok: true, bytes: Buffer.concat(chunks) };
}

const kilobytes = (bytes: number) => `${Math.round((bytes / 1024) * 10) / 10} KB`;

export type LimitedForm = { ok: true; form: FormData } | { ok: false; tooLarge: true; bytes: number } | { ok: false; tooLarge: false; message: string };

/** A form read within `limitBytes`, or why not: too large (with the bytes declared or received so far), or unreadable. */
export async function readFormWithin(request: Request, limitBytes: number): Promise<LimitedForm> {
  const body = await readBytesWithin(request, limitBytes);
  if (!body.ok) return { ok: false, tooLarge: true, bytes: body.bytes };
  try {
    const form = await new Request(request.url, { method: "POST", headers: request.headers, body: body.bytes }).formData();
    return { ok: true, form };
  } catch (error) {
    return { ok: false, tooLarge: false, message: `The form could not be read: ${error instanceof Error ? error.message : String(error)}` };
  }
}

/**
 * A form within `limitBytes`; refused with a ServiceError (413 too large, 400
 * unreadable), so read it inside formAction, or with pageGuard where the
 * action needs the form before it can start.
 */
export async function readForm(request: Request, limitBytes = FORM_LIMIT_BYTES): Promise<FormData> {
  const body = await readFormWithin(request, limitBytes);
  if (body.ok) return body.form;
  if (body.tooLarge) throw new ServiceError(413, "too-large", `The form is larger than this page takes (${kilobytes(limitBytes)}); nothing was saved.`);
  throw new ServiceError(400, "bad-request", body.message);
}

/** Reads a body's text up to `limitBytes`, answering 413 with both sizes otherwise. */
export async function readBodyText(request: Request, limitBytes: number): Promise<string> {
  const body = await readBytesWithin(request, limitBytes);
  if (!body.ok) throw apiError(413, "payload_too_large", `The body is ${body.bytes} bytes or more; the limit is ${limitBytes}.`);
  return new TextDecoder().decode(body.bytes);
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
