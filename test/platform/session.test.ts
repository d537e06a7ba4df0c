// Where a person is sent after signing in or switching workspace. The
// addresses below are read the way the WHATWG URL Standard reads them (as
// browsers do): tabs and newlines are dropped, a backslash counts as a slash.
import { describe, expect, test } from "vitest";
import { safeReturnTo } from "~/platform/session.server";

describe("safeReturnTo (WHATWG URL parsing, as browsers follow a Location)", () => {
  test.each([
    ["/gaits", "/gaits"],
    ["/gaits/1234/edit", "/gaits/1234/edit"],
    ["/gaits?sort=date&dir=asc", "/gaits?sort=date&dir=asc"],
    ["/settings/members#invite", "/settings/members#invite"],
  ])("keeps the path on this site %s", (value, expected) => {
    expect(safeReturnTo(value)).toBe(expected);
  });

  test.each([
    ["a tab that browsers drop, leaving //evil.example", "/\t/evil.example"],
    ["a newline that browsers drop", "/\n/evil.example"],
    ["a carriage return and line feed", "/\r\n/evil.example"],
    ["a protocol-relative address", "//evil.example"],
    // Found by the full probe run: the parsed path is //evil.example, which a Location sends off the site.
    ["dot segments that collapse to //evil.example", "/./..//evil.example"],
    ["a dot segment before a doubled slash", "/.//evil.example"],
    ["a parent segment before a doubled slash", "/gaits/..//evil.example"],
    ["a backslash that browsers read as a slash", "/\\evil.example"],
    ["a backslash further in", "/\\/evil.example"],
    ["another site's absolute URL", "https://evil.example/"],
    ["this site's absolute URL (a path is expected)", "http://127.0.0.1:3000/gaits"],
    ["a javascript: address", "javascript:alert(1)"],
    ["a relative path", "gaits"],
    ["an empty string", ""],
    ["a NUL character", "/gaits\u0000"],
    ["a DEL character", "/gaits\u007f"],
  ])("falls back to / for %s", (_label, value) => {
    expect(safeReturnTo(value)).toBe("/");
  });

  test.each([undefined, null, 42, ["/gaits"], { path: "/gaits" }])("falls back to / for a value that is no string: %j", (value) => {
    expect(safeReturnTo(value)).toBe("/");
  });

  test("a path beyond Latin-1 comes back percent-encoded (UTF-8), so it can be a Location header", () => {
    expect(safeReturnTo("/gaits/Kőhíd lépés")).toBe("/gaits/K%C5%91h%C3%ADd%20l%C3%A9p%C3%A9s");
    expect(safeReturnTo("/gaits?q=歩行")).toBe("/gaits?q=%E6%AD%A9%E8%A1%8C");
    expect(() => new Headers({ Location: safeReturnTo("/gaits/🦀") })).not.toThrow();
  });

  test("dot segments are resolved on this site and stay on it", () => {
    expect(safeReturnTo("/gaits/../../../robots")).toBe("/robots");
  });

  test("an address too long to carry in the session cookie falls back to /", () => {
    expect(safeReturnTo(`/gaits?q=${"x".repeat(4096)}`)).toBe("/");
  });
});
