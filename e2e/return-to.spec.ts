// The return address through the whole sign-in in Chromium: the sign-in page,
// POST /auth/github, the local GitHub stand-in and the callback's redirect,
// which the browser follows as browsers do (the WHATWG URL Standard drops tabs
// and newlines, so "/\t/evil.example" reads as "//evil.example").
import { signInAs } from "./support/sign-in";
import { expect, test } from "./support/test";

test("an address browsers would read as another site ends on this site's home page after the callback", async ({ page, baseURL }) => {
  await signInAs(page, "kenji-wu", "/\t/evil.example");
  const landed = new URL(page.url());
  expect(landed.origin).toBe(new URL(baseURL!).origin);
  expect(landed.pathname).toBe("/");
});

test("an address beyond Latin-1 is followed to the page it names, percent-encoded, not answered with a server error", async ({ page }) => {
  await signInAs(page, "kenji-wu", "/gaits?q=Kőhíd");
  const landed = new URL(page.url());
  expect(landed.pathname).toBe("/gaits");
  expect(landed.searchParams.get("q")).toBe("Kőhíd");
  await expect(page.getByRole("heading", { level: 1, name: "Gaits" })).toBeVisible();
});
