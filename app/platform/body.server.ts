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

// ---------------------------------------------------------------------------
// Forms

const FORM_TYPES = "application/x-www-form-urlencoded or multipart/form-data";

// Form text must be UTF-8 (the HTML standard's form encoding; RFC 3629): bytes
// that are not are refused rather than stored as U+FFFD.
const utf8 = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true });

/** Refusals of a form's content, each naming the field (or the part) at fault. */
const badForm = (message: string, field?: string) => new ServiceError(400, "bad-request", message, field === undefined ? undefined : { field });

/**
 * A field's text: UTF-8, and without U+0000, which PostgreSQL's text cannot
 * hold (refused here once, not as a failed query wherever the text goes).
 */
function fieldText(bytes: Uint8Array, name: string | null): string {
  const label = name === null ? "A field name" : `The field "${name}"`;
  let text: string;
  try {
    text = utf8.decode(bytes);
  } catch {
    throw badForm(`${label} is not UTF-8 text; send the form in UTF-8.`, name ?? undefined);
  }
  if (text.includes("\u0000")) throw badForm(`${label} contains a NUL character (U+0000), which cannot be stored; remove it.`, name ?? undefined);
  return text;
}

const isHex = (byte: number) => (byte >= 0x30 && byte <= 0x39) || (byte >= 0x41 && byte <= 0x46) || (byte >= 0x61 && byte <= 0x66);

/** Percent-decoding of bytes, as the URL Standard does it: a "%" not followed by two hex digits stays as it is. */
function percentDecode(bytes: Uint8Array): Uint8Array {
  const out = new Uint8Array(bytes.length);
  let length = 0;
  for (let i = 0; i < bytes.length; i += 1) {
    const byte = bytes[i];
    if (byte === 0x25 && i + 2 < bytes.length && isHex(bytes[i + 1]) && isHex(bytes[i + 2])) {
      out[length++] = parseInt(String.fromCharCode(bytes[i + 1], bytes[i + 2]), 16);
      i += 2;
    } else {
      out[length++] = byte === 0x2b ? 0x20 : byte;
    }
  }
  return out.subarray(0, length);
}

/** application/x-www-form-urlencoded, parsed as the URL Standard parses it, but with strict UTF-8. */
function parseUrlEncoded(body: Uint8Array): FormData {
  const form = new FormData();
  let start = 0;
  while (start <= body.length) {
    let end = body.indexOf(0x26, start);
    if (end < 0) end = body.length;
    const sequence = body.subarray(start, end);
    start = end + 1;
    if (sequence.length === 0) continue;
    const equals = sequence.indexOf(0x3d);
    const name = fieldText(percentDecode(equals < 0 ? sequence : sequence.subarray(0, equals)), null);
    form.append(name, fieldText(percentDecode(equals < 0 ? new Uint8Array(0) : sequence.subarray(equals + 1)), name));
  }
  return form;
}

/** A header parameter (`name="…"` or `name=token`) of a multipart part's Content-Disposition. */
function dispositionParameter(disposition: string, parameter: string): string | null {
  const match = new RegExp(`;\\s*${parameter}\\s*=\\s*(?:"((?:[^"\\\\]|\\\\.)*)"|([^;\\s]*))`, "i").exec(disposition);
  if (!match) return null;
  return match[1] !== undefined ? match[1].replace(/\\(.)/g, "$1") : match[2];
}

/**
 * multipart/form-data (RFC 7578): text parts decoded as strict UTF-8 like
 * any field, parts with a filename kept as files (their bytes are checked by
 * whoever reads them).
 */
function parseMultipart(body: Buffer, boundary: string): FormData {
  const unreadable = (why: string) => badForm(`The form could not be read: ${why}.`);
  const delimiter = Buffer.from(`--${boundary}`);
  const nextPart = Buffer.from(`\r\n--${boundary}`);
  const form = new FormData();
  let position = body.indexOf(delimiter);
  if (position < 0) throw unreadable("its boundary never appears");
  position += delimiter.length;
  for (;;) {
    if (body[position] === 0x2d && body[position + 1] === 0x2d) return form;
    const lineEnd = body.indexOf("\r\n", position);
    const headersEnd = lineEnd < 0 ? -1 : body.indexOf("\r\n\r\n", lineEnd);
    if (headersEnd < 0) throw unreadable("a part's headers do not end");
    const contentEnd = body.indexOf(nextPart, headersEnd + 4);
    if (contentEnd < 0) throw unreadable("a part is not closed by the boundary");
    const headers = fieldText(body.subarray(lineEnd + 2, headersEnd), null).split("\r\n");
    const header = (name: string) =>
      headers
        .find((line) => line.toLowerCase().startsWith(`${name}:`))
        ?.slice(name.length + 1)
        .trim() ?? null;
    const disposition = header("content-disposition");
    const name = disposition && /^form-data\b/i.test(disposition) ? dispositionParameter(disposition, "name") : null;
    if (name === null) throw unreadable("a part has no Content-Disposition: form-data with a name");
    const content = body.subarray(headersEnd + 4, contentEnd);
    const fileName = dispositionParameter(disposition!, "filename");
    if (fileName === null) form.append(name, fieldText(content, name));
    else form.append(name, new File([new Uint8Array(content)], fileName, { type: header("content-type") ?? "application/octet-stream" }));
    position = contentEnd + nextPart.length;
  }
}

/** The form in a body, by its media type; a body of any other type is refused with 415 naming the form types. */
function parseForm(request: Request, body: Uint8Array<ArrayBuffer>): FormData {
  const contentType = request.headers.get("Content-Type");
  const [mediaType, ...parameters] = (contentType ?? "").split(";").map((part) => part.trim());
  switch (mediaType.toLowerCase()) {
    case "application/x-www-form-urlencoded":
      return parseUrlEncoded(body);
    case "multipart/form-data": {
      const boundary = dispositionParameter(`; ${parameters.join("; ")}`, "boundary");
      if (!boundary) throw badForm("The form could not be read: its Content-Type names no multipart boundary.");
      return parseMultipart(Buffer.from(body.buffer, body.byteOffset, body.byteLength), boundary);
    }
    default:
      throw new ServiceError(
        415,
        "unsupported-media-type",
        `Send this form as ${FORM_TYPES}${contentType ? `, not ${mediaType}` : "; it came with no Content-Type"}.`,
      );
  }
}

export type LimitedForm = { ok: true; form: FormData } | { ok: false; tooLarge: true; bytes: number } | { ok: false; tooLarge: false; refusal: ServiceError };

/**
 * A form read within `limitBytes`, or why not: too large (with the bytes
 * declared or received so far), or a refusal of its type (415) or content
 * (400 naming the field: text that is not UTF-8, or holds a NUL character).
 */
export async function readFormWithin(request: Request, limitBytes: number): Promise<LimitedForm> {
  const body = await readBytesWithin(request, limitBytes);
  if (!body.ok) return { ok: false, tooLarge: true, bytes: body.bytes };
  try {
    return { ok: true, form: parseForm(request, body.bytes) };
  } catch (error) {
    if (error instanceof ServiceError) return { ok: false, tooLarge: false, refusal: error };
    throw error;
  }
}

/**
 * A form within `limitBytes`; refused with a ServiceError (413 too large,
 * 415 not a form, 400 naming a field that is not UTF-8 or holds a NUL), so
 * read it inside formAction, or with pageGuard where the action needs the
 * form before it can start.
 */
export async function readForm(request: Request, limitBytes = FORM_LIMIT_BYTES): Promise<FormData> {
  const body = await readFormWithin(request, limitBytes);
  if (body.ok) return body.form;
  if (body.tooLarge) throw new ServiceError(413, "too-large", `The form is larger than this page takes (${kilobytes(limitBytes)}); nothing was saved.`);
  throw body.refusal;
}

// ---------------------------------------------------------------------------
// JSON

/**
 * Where parsed JSON holds U+0000 in a string or a key (as the escape
 * \u0000, which no form or body reader sees): a path like `legs[2].id`, or
 * null. PostgreSQL's text and jsonb cannot hold it. The walk keeps its own
 * stack, as a hostile body may nest 100 000 levels deep, and builds the path
 * only for the value it finds.
 */
export function nulPathIn(value: unknown): string | null {
  type Step = { value: unknown; parent: Step | null; key: string | number | null };
  const pathOf = (step: Step): string => {
    const parts: string[] = [];
    for (let at: Step | null = step; at && at.key !== null; at = at.parent) parts.push(typeof at.key === "number" ? `[${at.key}]` : `.${at.key}`);
    const path = parts.reverse().join("");
    return path.startsWith(".") ? path.slice(1) : path || "(the whole value)";
  };
  const pending: Step[] = [{ value, parent: null, key: null }];
  while (pending.length > 0) {
    const step = pending.pop()!;
    const here = step.value;
    if (typeof here === "string") {
      if (here.includes("\u0000")) return pathOf(step);
    } else if (Array.isArray(here)) {
      // Pushed last to first, so the first element is looked at first.
      for (let index = here.length - 1; index >= 0; index -= 1) pending.push({ value: here[index], parent: step, key: index });
    } else if (here !== null && typeof here === "object") {
      const entries = Object.entries(here);
      for (const [key] of entries) if (key.includes("\u0000")) return pathOf({ value: undefined, parent: step, key });
      for (let index = entries.length - 1; index >= 0; index -= 1) pending.push({ value: entries[index][1], parent: step, key: entries[index][0] });
    }
  }
  return null;
}

/** The sentence for a NUL character found at `path` of `what` (the body, a field's JSON, a file). */
export const nulMessage = (what: string, path: string) => `${what} holds a NUL character (U+0000) at ${path}, which cannot be stored; remove it.`;

/** Refuses parsed JSON from a form (a field's text, an uploaded file) that holds a NUL character: 400 naming `what`, the path and the form field. */
export function refuseNulIn(value: unknown, what: string, field: string): void {
  const path = nulPathIn(value);
  if (path !== null) throw new ServiceError(400, "bad-request", nulMessage(what, path), { field, path });
}

/** An uploaded file's text: strict UTF-8 without NUL characters, like any form field; 400 naming the file otherwise. */
export async function fileText(file: File, field: string): Promise<string> {
  let text: string;
  try {
    text = utf8.decode(await file.arrayBuffer());
  } catch {
    throw badForm(`${file.name || "The file"} is not UTF-8 text; save it as UTF-8 and try again.`, field);
  }
  if (text.includes("\u0000")) throw badForm(`${file.name || "The file"} contains a NUL character (U+0000), which cannot be stored; remove it.`, field);
  return text;
}

/** Reads a body's text up to `limitBytes`, answering 413 with both sizes otherwise. */
export async function readBodyText(request: Request, limitBytes: number): Promise<string> {
  const body = await readBytesWithin(request, limitBytes);
  if (!body.ok) throw apiError(413, "payload_too_large", `The body is ${body.bytes} bytes or more; the limit is ${limitBytes}.`);
  return new TextDecoder().decode(body.bytes);
}

/** A JSON body parsed, or the API's 400: not JSON, or holding a NUL character (named by its path). */
export function parseJsonText(text: string): unknown {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw apiError(400, "bad_request", `The body is not valid JSON: ${error instanceof Error ? error.message : String(error)}`);
  }
  const nul = nulPathIn(value);
  if (nul !== null) throw apiError(400, "bad_request", nulMessage("The body", nul), { path: nul });
  return value;
}

/** Reads a JSON body up to `limitBytes`, answering 413 or 400 with a clear message otherwise. */
export async function readJsonBody(request: Request, limitBytes: number): Promise<unknown> {
  return parseJsonText(await readBodyText(request, limitBytes));
}
