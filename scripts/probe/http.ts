// Sending one request exactly as written: node:http, not fetch, so the
// request target keeps its malformed percent-encoding and raw bytes, a body
// can be declared or chunked, and redirects are not followed.
import { Agent, request as httpRequest } from "node:http";

/** A body of `size` bytes made by repeating `chunk` after `prefix`, sent with Content-Length (declared) or chunked. */
export type LargeBody = { prefix: Buffer; chunk: Buffer; size: number; chunked: boolean };

export type Body = Buffer | LargeBody;

export type Sent = {
  method: string;
  /** The request target as sent: path and query, already encoded. */
  path: string;
  headers: Record<string, string>;
  body?: Body;
};

export type Answer = {
  /** null when no answer came (reset, timeout). */
  status: number | null;
  /** The handlers the app entered (its X-Gaitloom-Probe-Reached header): "routes/robots/list action", … */
  reached: string[];
  location: string | null;
  /** Every header as sent, by lower-case name, so a header sent twice shows ({} when no answer came). */
  headers: Record<string, string[]>;
  /** Retry-After, on a refusal for now (a full worker queue: 503). */
  retryAfter: string | null;
  /** The start of the answer's body, for the report. */
  excerpt: string;
  error: string | null;
  ms: number;
};

const EXCERPT_BYTES = 600;

export const isLargeBody = (body: Body | undefined): body is LargeBody => body !== undefined && !Buffer.isBuffer(body);

export function bodySize(body: Body | undefined): number {
  if (!body) return 0;
  return isLargeBody(body) ? body.size : body.length;
}

export function makeAgent(connections: number): Agent {
  return new Agent({ keepAlive: true, maxSockets: connections, maxFreeSockets: connections });
}

export function send(origin: URL, sent: Sent, agent: Agent, timeoutMs: number): Promise<Answer> {
  const started = performance.now();
  return new Promise((resolve) => {
    let done = false;
    let answered = false;
    // A large body cut short by an early answer leaves the connection mid-request: it is closed, never reused.
    let written = true;
    const finish = (answer: Omit<Answer, "ms">) => {
      if (done) return;
      done = true;
      clearTimeout(timer);
      resolve({ ...answer, ms: performance.now() - started });
    };
    const headers: Record<string, string | number> = { ...sent.headers };
    const body = sent.body;
    if (body && !isLargeBody(body)) headers["Content-Length"] = body.length;
    if (isLargeBody(body) && !body.chunked) headers["Content-Length"] = body.size;
    let req: ReturnType<typeof httpRequest>;
    try {
      req = httpRequest({ host: origin.hostname, port: origin.port, method: sent.method, path: sent.path, headers, agent, setHost: !("Host" in headers) });
    } catch (error) {
      // Node refused to send it (a character it will not put on the wire): not the app's doing.
      resolve({ status: null, reached: [], location: null, headers: {}, retryAfter: null, excerpt: "", error: `not sent: ${(error as Error).message}`, ms: 0 });
      return;
    }
    const timer = setTimeout(() => {
      req.destroy(new Error(`no answer within ${timeoutMs} ms`));
    }, timeoutMs);
    req.on("response", (res) => {
      answered = true;
      const chunks: Buffer[] = [];
      let kept = 0;
      res.on("data", (chunk: Buffer) => {
        if (kept < EXCERPT_BYTES) {
          chunks.push(chunk);
          kept += chunk.length;
        }
      });
      const settle = () => {
        if (!written) req.destroy();
        finish({
          status: res.statusCode ?? null,
          reached: String(res.headers["x-gaitloom-probe-reached"] ?? "")
            .split(",")
            .map((entry) => entry.trim())
            .filter(Boolean),
          headers: headersAsSent(res.rawHeaders),
          retryAfter: typeof res.headers["retry-after"] === "string" ? res.headers["retry-after"] : null,
          location: typeof res.headers.location === "string" ? res.headers.location : ((res.headers["x-remix-redirect"] as string | undefined) ?? null),
          excerpt: Buffer.concat(chunks).subarray(0, EXCERPT_BYTES).toString("utf8"),
          error: null,
        });
      };
      res.on("end", settle);
      res.on("error", settle);
      res.on("close", settle);
    });
    req.on("error", (error) => {
      // Writing on after an early answer (a 413 before the body was all sent) fails: the answer stands.
      if (answered) return;
      finish({ status: null, reached: [], location: null, headers: {}, retryAfter: null, excerpt: "", error: error.message });
    });
    if (!body) {
      req.end();
    } else if (!isLargeBody(body)) {
      req.end(body);
    } else {
      written = false;
      void writeLarge(req, body, () => answered || done).then((complete) => (written = complete));
    }
  });
}

function headersAsSent(raw: string[]): Record<string, string[]> {
  const headers: Record<string, string[]> = {};
  for (let i = 0; i + 1 < raw.length; i += 2) (headers[raw[i].toLowerCase()] ??= []).push(raw[i + 1]);
  return headers;
}

/** Writes the body until it is all sent (true) or the answer came first (false). */
async function writeLarge(req: ReturnType<typeof httpRequest>, body: LargeBody, stop: () => boolean): Promise<boolean> {
  const closed = new Promise<void>((resolve) => req.once("close", resolve));
  const write = (chunk: Buffer) => (req.write(chunk) ? Promise.resolve() : Promise.race([new Promise<void>((resolve) => req.once("drain", resolve)), closed]));
  let left = body.size;
  const prefix = body.prefix.subarray(0, left);
  await write(prefix);
  left -= prefix.length;
  while (left > 0 && !stop() && !req.destroyed) {
    const piece = body.chunk.length <= left ? body.chunk : body.chunk.subarray(0, left);
    await write(piece);
    left -= piece.length;
  }
  if (left > 0 || req.destroyed) return false;
  req.end();
  return true;
}
