// Harmless malformed addresses against the production server: a NUL
// character in a query string or a path (PostgreSQL's text cannot hold
// U+0000) is a 400 naming where it is, on pages and in the API alike.
import { signInAs } from "./support/sign-in";
import { expect, test } from "./support/test";

test("a NUL character in a query string or a path is a 400 naming it, not a server error", async ({ page }) => {
  await signInAs(page, "mara-lindqvist", "/gaits");
  const gaitPath = await page.getByRole("link", { name: "Tripod cruise", exact: true }).getAttribute("href");
  expect(gaitPath).toMatch(/^\/gaits\/[0-9a-f-]{36}$/);

  const filtered = await page.request.get(`${gaitPath}?q=wave%00creep`);
  expect(filtered.status()).toBe(400);
  expect(await filtered.text()).toContain("q");

  const table = await page.request.get(`/api/v1${gaitPath}/versions/1/table?profile=unit%007`);
  expect(table.status()).toBe(400);
  expect(await table.json()).toMatchObject({ error: { code: "bad_request", details: { parameter: "profile" } } });

  const override = await page.request.get(`/api/v1${gaitPath}/versions/1/table?override=first%00run`);
  expect(override.status()).toBe(400);
  expect(await override.json()).toMatchObject({ error: { code: "bad_request", details: { parameter: "override" } } });

  const invitation = await page.request.get("/invitations/abc%00def");
  expect(invitation.status()).toBe(400);
});
