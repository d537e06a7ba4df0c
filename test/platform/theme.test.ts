import { describe, expect, test } from "vitest";
import { readTheme, themeCookie } from "~/platform/theme";

describe("theme cookie", () => {
  test("reads the dark choice among other cookies", () => {
    expect(readTheme("a=1; gaitloom-theme=dark; b=2")).toBe("dark");
  });
  test("falls back to light for no cookie or an unknown value", () => {
    expect(readTheme(null)).toBe("light");
    expect(readTheme("gaitloom-theme=purple")).toBe("light");
    expect(readTheme("not-gaitloom-theme=dark")).toBe("light");
  });
  test("writes a cookie that reads back the same", () => {
    expect(readTheme(themeCookie("dark").split(";")[0])).toBe("dark");
  });
});
