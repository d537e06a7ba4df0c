// Every /api/v1 answer of the production server that is a refusal is in the
// API's one error shape, `{ error: { code, message, details? } }`, whatever
// stage makes it: an address no route has, a method a route does not answer,
// a malformed percent-encoding, a method no route knows.
import http from "node:http";
import { expect, test, type APIResponse } from "./support/test";

async function expectApiError(response: APIResponse, status: number, code: string) {
  expect(response.status()).toBe(status);
  expect(response.headers()["content-type"]).toMatch(/^application\/json/);
  const body = await response.json();
  expect(body).toMatchObject({ error: { code, message: expect.stringMatching(/\w+ \w+/) } });
  return body as { error: { code: string; message: string; details?: unknown } };
}

/** A request as sent, byte for byte: clients (and Playwright) would tidy a malformed address or an unknown method. */
function raw(baseURL: string, method: string, path: string): Promise<{ status: number; headers: http.IncomingHttpHeaders; text: string }> {
  const { hostname, port } = new URL(baseURL);
  return new Promise((resolve, reject) => {
    const request = http.request({ host: hostname, port, method, path, headers: { Accept: "application/json" } }, (response) => {
      let text = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (text += chunk));
      response.on("end", () => resolve({ status: response.statusCode ?? 0, headers: response.headers, text }));
    });
    request.on("error", reject);
    request.end();
  });
}

test("an address under /api/v1 that no route has is 404 not_found in JSON, for any method", async ({ request }) => {
  const unknown = await expectApiError(await request.get("/api/v1/robotz"), 404, "not_found");
  expect(unknown.error.message).toContain("/api/v1/robotz");
  await expectApiError(await request.post("/api/v1/gaits/x/versions/1/tables", { data: {} }), 404, "not_found");
  await expectApiError(await request.get("/api/v1/robots/a/b/c/d"), 404, "not_found");
});

test("a write to a read-only API route is 405 method_not_allowed in JSON, with Allow", async ({ request }) => {
  for (const [method, path] of [
    ["POST", "/api/v1/robots"],
    ["PUT", "/api/v1/openapi.json"],
    ["DELETE", "/api/v1/schema/robot.json"],
    ["PATCH", "/api/v1/workspace"],
  ]) {
    const response = await request.fetch(path, { method, data: {} });
    const body = await expectApiError(response, 405, "method_not_allowed");
    expect(response.headers()["allow"]).toBe("GET, HEAD");
    expect(body.error.message).toContain(method);
  }
});

test("a malformed percent-encoding in an API address is a JSON refusal, not the server's HTML", async ({ baseURL }) => {
  for (const path of ["/api/v1/robots/%E0%A4%A", "/api/v1/%E0", "/api/v1/gaits/%ZZ/versions"]) {
    const answer = await raw(baseURL!, "GET", path);
    expect(answer.status, path).toBeGreaterThanOrEqual(400);
    expect(answer.status, path).toBeLessThan(500);
    expect(answer.headers["content-type"], path).toMatch(/^application\/json/);
    expect(JSON.parse(answer.text), path).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
  }
});

test("a method no route knows is a JSON refusal too", async ({ baseURL }) => {
  const answer = await raw(baseURL!, "PROPFIND", "/api/v1/robots");
  expect([405, 501]).toContain(answer.status);
  expect(answer.headers["content-type"]).toMatch(/^application\/json/);
  expect(JSON.parse(answer.text)).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
});

test("pages keep their own answers: an unknown page is the HTML 404 page", async ({ request }) => {
  const page = await request.get("/robotz");
  expect(page.status()).toBe(404);
  expect(page.headers()["content-type"]).toMatch(/^text\/html/);
});
