// Reads a form post (urlencoded or multipart) without ever holding more than
// `limitBytes` of it: the declared Content-Length is checked first, then the
// stream is counted as it arrives, so a huge upload is refused early.

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
