// The name a person recognises their browser by in the list of their sessions.
// The user-agent strings are of the shapes the browsers send (from memory).
import { describe, expect, test } from "vitest";
import { browserName } from "~/features/accounts/browser-name";

describe("browserName", () => {
  test.each([
    ["Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0", "Firefox on Windows"],
    ["Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36", "Chrome on Linux"],
    ["Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chromium/131.0.0.0 Chrome/131.0.0.0 Safari/537.36", "Chromium on Linux"],
    ["Mozilla/5.0 (Macintosh; Intel Mac OS X 14_5) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Safari/605.1.15", "Safari on macOS"],
    ["Mozilla/5.0 (Windows NT 10.0; Win64; x64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36 Edg/131.0.2903.70", "Edge on Windows"],
    ["Mozilla/5.0 (Linux; Android 14; Pixel 8) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Mobile Safari/537.36", "Chrome on Android"],
    [
      "Mozilla/5.0 (iPhone; CPU iPhone OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Mobile/15E148 Safari/604.1",
      "Safari on iOS",
    ],
    ["Mozilla/5.0 (X11; CrOS x86_64 14541.0.0) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36", "Chrome on ChromeOS"],
  ])("%s → %s", (userAgent, expected) => {
    expect(browserName(userAgent)).toBe(expected);
  });

  test("headless Chrome is Chrome; a browser of no name we know goes by its system", () => {
    expect(browserName("Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) HeadlessChrome/131.0.0.0 Safari/537.36")).toBe(
      "Chrome on Linux",
    );
    expect(browserName("Mozilla/5.0 (X11; Linux x86_64) Gecko/20100101 Nameless/1.0")).toBe("A browser on Linux");
    expect(browserName("Mozilla/5.0")).toBe("Unknown browser");
  });

  test("a client that is no browser goes by its first product", () => {
    expect(browserName("curl/8.5.0")).toBe("curl/8.5.0");
  });

  test("no user agent, or an empty one, is an unknown browser; a long one is cut", () => {
    expect(browserName(null)).toBe("Unknown browser");
    expect(browserName("  ")).toBe("Unknown browser");
    expect(browserName("x".repeat(500)).length).toBeLessThanOrEqual(60);
  });
});
