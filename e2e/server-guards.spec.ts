// What the production server (server.js) answers before the framework, over
// real sockets: requests the framework cannot make a Fetch Request of are
// refused as the client's mistake (4xx), not failed as 500s; and the probe's
// switches (npm test runs the app with GAITLOOM_PROBE_COUNTS=1) name the
// handlers a request entered and count them for loopback.
import http from "node:http";
import { expect, test } from "./support/test";

type Answer = { status: number; headers: http.IncomingHttpHeaders; text: string };

function call(url: URL, method: string, headers: Record<string, string> = {}): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const request = http.request(url, { method, headers, setHost: !("Host" in headers) }, (response) => {
      let text = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (text += chunk));
      response.on("end", () => resolve({ status: response.statusCode ?? 0, headers: response.headers, text }));
    });
    request.setTimeout(10_000, () => request.destroy(new Error("no answer within 10 s")));
    request.on("error", reject);
    request.end();
  });
}

test("TRACE is refused with 405 on a page, and TRACE or PROPFIND with 405 in the API's error shape under /api/v1 (a refusal, not a server error)", async ({
  baseURL,
}) => {
  const page = await call(new URL("/robots", baseURL), "TRACE");
  expect(page.status).toBe(405);
  for (const method of ["TRACE", "PROPFIND"]) {
    const api = await call(new URL("/api/v1/robots", baseURL), method);
    expect(api.status, method).toBe(405);
    expect(api.headers.allow, method).toBe("GET, HEAD, OPTIONS, POST, PUT, PATCH, DELETE");
    expect(JSON.parse(api.text), method).toMatchObject({ error: { code: "method_not_allowed" } });
  }
});

test("a Host header that names no host is refused with 400, in the API's error shape under /api/v1", async ({ baseURL }) => {
  const answer = await call(new URL("/healthz", baseURL), "GET", { Host: "[::1" });
  expect(answer.status).toBe(400);
  expect(answer.text).toContain("Host");
  const api = await call(new URL("/api/v1/robots", baseURL), "GET", { Host: "[::1" });
  expect(api.status).toBe(400);
  expect(JSON.parse(api.text)).toMatchObject({ error: { code: "bad_request" } });
});

test("with GAITLOOM_PROBE_COUNTS=1 an answer names the handlers it entered, and loopback reads the counts", async ({ baseURL }) => {
  const before = (await call(new URL("/local/probe-counts", baseURL), "GET")).text;
  const answer = await call(new URL("/healthz", baseURL), "GET");
  expect(answer.headers["x-gaitloom-probe-reached"]).toBe("routes/healthz loader");
  const counts = JSON.parse((await call(new URL("/local/probe-counts", baseURL), "GET")).text) as Record<string, number>;
  const previous = (JSON.parse(before) as Record<string, number>)["routes/healthz GET loader"] ?? 0;
  expect(counts["routes/healthz GET loader"]).toBeGreaterThan(previous);
});
