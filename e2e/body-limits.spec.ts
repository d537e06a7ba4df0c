// Request bodies beyond a route's limit, against the production server
// (server.js) over real sockets: the upload is refused with 413 once the limit
// is passed, without reading the rest, and the keep-alive connection it came
// on is either still usable or closed with `Connection: close`, so the
// client's next request goes through.
import http from "node:http";
import { signInAs } from "./support/sign-in";
import { expect, test, type Page } from "./support/test";

type Answer = { status: number; headers: http.IncomingHttpHeaders; text: string; sentBytes: number };

/**
 * POSTs `prefix` then "a" up to `totalBytes`, declared with Content-Length
 * unless `chunked`. With `stopOnAnswer` the upload stops once an answer has
 * come (as a browser does); otherwise the whole body is sent, answer or not.
 */
function upload(
  agent: http.Agent,
  url: URL,
  options: { headers?: Record<string, string>; prefix: string; totalBytes: number; chunked?: boolean; stopOnAnswer?: boolean },
): Promise<Answer> {
  return new Promise((resolve, reject) => {
    let sentBytes = 0;
    let answered = false;
    const headers: Record<string, string> = { ...options.headers };
    if (!options.chunked) headers["Content-Length"] = String(options.totalBytes);
    const request = http.request(url, { method: "POST", agent, headers });
    request.setTimeout(20_000, () => request.destroy(new Error("no answer within 20 s")));
    request.on("response", (response) => {
      answered = true;
      let text = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (text += chunk));
      const done = () => resolve({ status: response.statusCode ?? 0, headers: response.headers, text, sentBytes });
      response.on("end", done);
      response.on("error", done);
    });
    // Once the answer is in, a closed connection only ends the upload.
    request.on("error", (error) => (answered ? undefined : reject(error)));
    const chunk = Buffer.alloc(64 * 1024, "a");
    const first = Buffer.from(options.prefix);
    request.write(first);
    sentBytes += first.byteLength;
    const pump = () => {
      while (sentBytes < options.totalBytes && !(options.stopOnAnswer && answered) && !request.destroyed) {
        const piece = chunk.subarray(0, Math.min(chunk.byteLength, options.totalBytes - sentBytes));
        sentBytes += piece.byteLength;
        if (!request.write(piece)) return void request.once("drain", pump);
      }
      if (!request.destroyed && !(options.stopOnAnswer && answered)) request.end();
    };
    pump();
  });
}

function get(agent: http.Agent, url: URL): Promise<{ status: number; reusedSocket: boolean }> {
  return new Promise((resolve, reject) => {
    const request = http.get(url, { agent }, (response) => {
      response.resume();
      response.on("end", () => resolve({ status: response.statusCode ?? 0, reusedSocket: request.reusedSocket }));
    });
    request.setTimeout(3_000, () => request.destroy(new Error("the next request got no answer within 3 s")));
    request.on("error", reject);
  });
}

/** The signed-in browser's session, as a script on the same machine would send it. */
async function sessionHeaders(page: Page, baseURL: string): Promise<Record<string, string>> {
  await signInAs(page, "mara-lindqvist");
  const cookies = await page.context().cookies(baseURL);
  return { Cookie: cookies.map((cookie) => `${cookie.name}=${cookie.value}`).join("; "), Origin: new URL(baseURL).origin };
}

test("a sign-in form of 64 MB from someone signed out is refused with 413 long before it has all been sent", async ({ baseURL }) => {
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const totalBytes = 64 * 1024 * 1024;
  const answer = await upload(agent, new URL("/auth/github", baseURL), {
    headers: { "Content-Type": "application/x-www-form-urlencoded" },
    prefix: "returnTo=%2Fgaits&padding=",
    totalBytes,
    stopOnAnswer: true,
  });
  expect(answer.status).toBe(413);
  expect(answer.sentBytes, "bytes sent before the answer").toBeLessThan(totalBytes / 4);
  expect((await get(agent, new URL("/healthz", baseURL))).status).toBe(200);
  agent.destroy();
});

test("after a 413 for a declared length beyond the API's limit, the next request on the keep-alive agent is answered", async ({ page, baseURL }) => {
  const headers = { ...(await sessionHeaders(page, baseURL!)), "Content-Type": "application/json" };
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const refused = await upload(agent, new URL("/api/v1/ik", baseURL), { headers, prefix: '{"robot": "', totalBytes: 1024 * 1024 });
  expect(refused.status).toBe(413);
  expect(JSON.parse(refused.text)).toMatchObject({ error: { code: "payload_too_large" } });
  const next = await get(agent, new URL("/healthz", baseURL));
  expect(next.status).toBe(200);
  // A connection whose body was not read must not be offered for reuse.
  if (next.reusedSocket) expect(refused.headers.connection).not.toBe("close");
  agent.destroy();
});

test("a chunked JSON body beyond the limit is refused with 413, and the next request on the keep-alive agent is answered", async ({ page, baseURL }) => {
  const headers = { ...(await sessionHeaders(page, baseURL!)), "Content-Type": "application/json" };
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const totalBytes = 64 * 1024 * 1024;
  const refused = await upload(agent, new URL("/api/v1/solve", baseURL), { headers, prefix: '{"robot": "', totalBytes, chunked: true, stopOnAnswer: true });
  expect(refused.status).toBe(413);
  expect(JSON.parse(refused.text)).toMatchObject({ error: { code: "payload_too_large" } });
  expect(refused.sentBytes, "bytes sent before the answer").toBeLessThan(totalBytes / 4);
  expect((await get(agent, new URL("/healthz", baseURL))).status).toBe(200);
  agent.destroy();
});

test("a form beyond a signed-in page's limit is refused with 413, and the next request on the keep-alive agent is answered", async ({ page, baseURL }) => {
  const headers = { ...(await sessionHeaders(page, baseURL!)), "Content-Type": "application/x-www-form-urlencoded" };
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const refused = await upload(agent, new URL("/settings/tokens", baseURL), { headers, prefix: "intent=create&name=", totalBytes: 1024 * 1024 });
  expect(refused.status).toBe(413);
  expect((await get(agent, new URL("/healthz", baseURL))).status).toBe(200);
  agent.destroy();
});
