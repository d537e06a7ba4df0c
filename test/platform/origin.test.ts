import { describe, expect, test } from "vitest";
import { crossOriginRefusal } from "~/platform/origin.server";

const post = (path: string, headers: Record<string, string>) => new Request(`http://127.0.0.1:3000${path}`, { method: "POST", headers });

describe("the cross-origin guard on mutations", () => {
  test("a cookie-carrying POST from the app's own origin passes", () => {
    expect(crossOriginRefusal(post("/settings", { Cookie: "a=1", Origin: "http://127.0.0.1:3000" }))).toBeNull();
  });
  test("a cookie-carrying POST from another origin is refused with 403 and says where it came from", async () => {
    const refusal = crossOriginRefusal(post("/settings", { Cookie: "a=1", Origin: "http://evil.example" }))!;
    expect(refusal.status).toBe(403);
    expect(await refusal.text()).toContain("http://evil.example");
  });
  test("a cookie-carrying POST with no Origin is refused", () => {
    expect(crossOriginRefusal(post("/settings", { Cookie: "a=1" }))?.status).toBe(403);
  });
  test("API refusals are JSON errors", async () => {
    const refusal = crossOriginRefusal(post("/api/v1/solve", { Cookie: "a=1", Origin: "http://evil.example" }))!;
    expect(await refusal.json()).toMatchObject({ error: { code: "forbidden" } });
  });
  test("a bearer-token POST carries no cookie and needs no Origin", () => {
    expect(crossOriginRefusal(post("/api/v1/solve", { Authorization: "Bearer gl_x" }))).toBeNull();
  });
  test("reads are never refused", () => {
    expect(crossOriginRefusal(new Request("http://127.0.0.1:3000/robots", { headers: { Cookie: "a=1", Origin: "http://evil.example" } }))).toBeNull();
  });
});
