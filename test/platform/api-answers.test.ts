// Every /api/v1 answer that is a refusal or a failure is in the API's one
// error shape, `{ error: { code, message, details? } }`, including the
// answers the framework makes itself: its 405 for a method a route has no
// action for ({"message":"Unexpected Server Error"}) and its plain-text 500
// for an error no route caught. The root middleware runs this guard.
import { describe, expect, test } from "vitest";
import { apiErrorShape } from "~/platform/api-answers.server";
import { apiError } from "~/platform/errors.server";

const at = (path: string, method = "GET") => new Request(`http://127.0.0.1:3000${path}`, { method });
const answer = (request: Request, next: () => Promise<Response>) => apiErrorShape(request, next);

describe("framework answers under /api/v1 in the API's shape", () => {
  test.each(["POST", "PUT", "PATCH", "DELETE"])("its 405 for %s on a read-only route: method_not_allowed, naming the method, with Allow", async (method) => {
    const response = await answer(at("/api/v1/robots", method), async () => Response.json({ message: "Unexpected Server Error" }, { status: 405 }));
    expect(response.status).toBe(405);
    expect(response.headers.get("Allow")).toBe("GET, HEAD");
    const body = await response.json();
    expect(body).toMatchObject({ error: { code: "method_not_allowed" } });
    expect(body.error.message).toContain(method);
  });

  test("its plain-text 500 for an uncaught error: internal_error in JSON", async () => {
    const response = await answer(at("/api/v1/robots"), async () => new Response("Unexpected Server Error", { status: 500 }));
    expect(response.status).toBe(500);
    expect(response.headers.get("Content-Type")).toMatch(/^application\/json/);
    expect(await response.json()).toMatchObject({ error: { code: "internal_error", message: expect.stringMatching(/\w+ \w+/) } });
  });

  test("an error thrown past the route: 500 internal_error in JSON, without the error's own text", async () => {
    const response = await answer(at("/api/v1/solve", "POST"), async () => {
      throw new Error("connection to 10.0.0.7 refused");
    });
    expect(response.status).toBe(500);
    const body = await response.json();
    expect(body).toMatchObject({ error: { code: "internal_error" } });
    expect(JSON.stringify(body)).not.toContain("10.0.0.7");
  });

  test("a plain-text 404: not_found in JSON", async () => {
    const response = await answer(at("/api/v1/nothing-here"), async () => new Response("Not Found", { status: 404 }));
    expect(response.status).toBe(404);
    expect(await response.json()).toMatchObject({ error: { code: "not_found" } });
  });
});

describe("what is already right is left alone", () => {
  test("a refusal in the API's shape, returned or thrown, keeps its status, body and headers", async () => {
    const refusal = () => apiError(429, "rate_limited", "Too many requests with this token; try again in 12 s.", undefined, { "Retry-After": "12" });
    for (const next of [async () => refusal(), async () => Promise.reject(refusal())]) {
      const response = await answer(at("/api/v1/robots"), next);
      expect(response.status).toBe(429);
      expect(response.headers.get("Retry-After")).toBe("12");
      expect(await response.json()).toEqual({ error: { code: "rate_limited", message: "Too many requests with this token; try again in 12 s." } });
    }
  });

  test("an answer that is no refusal passes as it is", async () => {
    const ok = new Response("frame,time_ms\n", { status: 200, headers: { "Content-Type": "text/csv" } });
    expect(await answer(at("/api/v1/gaits/x/versions/1/table"), async () => ok)).toBe(ok);
    const notModified = new Response(null, { status: 304 });
    expect(await answer(at("/api/v1/gaits/x/versions/1/table"), async () => notModified)).toBe(notModified);
  });

  test("pages are not the API's business: their errors pass as they are", async () => {
    const page = new Response("<!DOCTYPE html>…", { status: 500, headers: { "Content-Type": "text/html" } });
    expect(await answer(at("/gaits"), async () => page)).toBe(page);
  });
});
