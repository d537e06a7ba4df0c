// The guard on request addresses that the root middleware applies to every
// route: a NUL character (U+0000, which PostgreSQL's text cannot hold) in a
// query parameter or a path segment is refused with 400 naming where it is,
// before any loader or action can pass it to a query.
import { describe, expect, test } from "vitest";
import { addressRefusal } from "~/platform/address.server";

const at = (path: string) => new Request(`http://127.0.0.1:3000${path}`);

describe("NUL characters in the address", () => {
  test("a query parameter holding one is refused with 400 naming the parameter", async () => {
    const refusal = addressRefusal(at("/gaits/5f1e9a52-2c57-4c83-a8a1-8fbd2a3f1f4e?sort=date&q=wave%00creep"))!;
    expect(refusal.status).toBe(400);
    const text = await refusal.text();
    expect(text).toContain('"q"');
    expect(text).toMatch(/NUL/);
  });

  test("a parameter name holding one is refused too", async () => {
    const refusal = addressRefusal(at("/gaits?q%00x=1"))!;
    expect(refusal.status).toBe(400);
    expect(await refusal.text()).toMatch(/NUL/);
  });

  test("a path segment holding one is refused with 400", async () => {
    const refusal = addressRefusal(at("/invitations/abc%00def"))!;
    expect(refusal.status).toBe(400);
    expect(await refusal.text()).toMatch(/NUL/);
  });

  test("the API's refusal is its JSON error naming the parameter", async () => {
    const refusal = addressRefusal(at("/api/v1/gaits/5f1e9a52-2c57-4c83-a8a1-8fbd2a3f1f4e/versions/1/table?profile=unit%007"))!;
    expect(refusal.status).toBe(400);
    expect(await refusal.json()).toMatchObject({ error: { code: "bad_request", details: { parameter: "profile" } } });
  });

  test.each(["/gaits?q=wave", "/gaits?q=%2500", "/robots/%2500", "/gaits?q=%E2%80%94", "/"])("%s passes", (path) => {
    expect(addressRefusal(at(path))).toBeNull();
  });
});
