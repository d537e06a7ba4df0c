// The security headers as the production server (server.js) sends them,
// over real sockets: every answer (pages, the API, build files, the server's
// own refusals) carries helmet's headers and our Permissions-Policy; a page
// its own Content-Security-Policy with a nonce, and `private, no-store` for a
// signed-in person; anything else a policy that loads nothing, build files
// their long cache. The shared test hears a violation when there is one, and
// a form posted with JavaScript off goes through the origin guard (the
// Referrer-Policy lets Chromium name our origin).
import http from "node:http";
import { expectedPagePolicy } from "../test/support/page-policy";
import { signInAs } from "./support/sign-in";
import { expect, test, type APIResponse, type Page } from "./support/test";

const signInOrigin = new URL(process.env.GITHUB_OAUTH_URL ?? "https://github.com").origin;

const pagePolicy = (nonce: string) => expectedPagePolicy(nonce, signInOrigin);

const NOTHING_POLICY = "default-src 'none'; frame-ancestors 'none'";

type Headers = Record<string, string[]>;

/** Each header's values as sent, by lower-case name, so a header sent twice shows. */
function sent(response: APIResponse): Headers {
  const headers: Headers = {};
  for (const { name, value } of response.headersArray()) (headers[name.toLowerCase()] ??= []).push(value);
  return headers;
}

/** The headers every answer carries, as one value each. */
function expectEveryAnswersHeaders(headers: Headers, what: string) {
  expect(headers["x-content-type-options"], what).toEqual(["nosniff"]);
  expect(headers["x-frame-options"], what).toEqual(["DENY"]);
  expect(headers["referrer-policy"], what).toEqual(["strict-origin-when-cross-origin"]);
  expect(headers["permissions-policy"], what).toHaveLength(1);
  const permissions = headers["permissions-policy"][0].split(/,\s*/);
  expect(permissions, what).toContain("serial=(self)");
  for (const feature of ["camera", "microphone", "geolocation", "usb", "payment"]) expect(permissions, what).toContain(`${feature}=()`);
}

test("a signed-in person's page: one policy, with a nonce of its own that every script names, private, no-store, and the headers of every answer", async ({
  page,
}) => {
  await signInAs(page, "kenji-wu", "/robots");
  const nonces = new Set<string>();
  for (const path of ["/robots", "/robots", "/no/such/page"]) {
    const response = await page.request.get(path);
    const headers = sent(response);
    expect(headers["content-security-policy"], path).toHaveLength(1);
    const nonce = /'nonce-([^']+)'/.exec(headers["content-security-policy"][0])?.[1] ?? "(none)";
    expect(headers["content-security-policy"][0], path).toBe(pagePolicy(nonce));
    nonces.add(nonce);
    const scripts = (await response.text()).match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length, `scripts on ${path}`).toBeGreaterThan(0);
    expect(
      scripts.filter((tag) => !tag.includes(` nonce="${nonce}"`)),
      `scripts on ${path} without the nonce`,
    ).toEqual([]);
    expect(headers["cache-control"], path).toEqual(["private, no-store"]);
    expectEveryAnswersHeaders(headers, path);
  }
  expect(nonces.size, "a nonce for each answer").toBe(3);
});

test("a page for someone signed out has the page policy and no Cache-Control of a signed-in page", async ({ request }) => {
  const headers = sent(await request.get("/"));
  expect(headers["content-security-policy"]).toHaveLength(1);
  expect(headers["content-security-policy"][0]).toMatch(/^default-src 'self'; script-src 'self' 'nonce-/);
  expect(headers["cache-control"]).toBeUndefined();
  expectEveryAnswersHeaders(headers, "/");
});

test("API answers, refusals and the server's own answers load nothing; build files keep their long cache", async ({ page, request, baseURL }) => {
  await signInAs(page, "mara-lindqvist");
  for (const [what, response] of [
    ["GET /api/v1/robots, signed in", await page.request.get("/api/v1/robots")],
    ["GET /api/v1/robots, signed out", await request.get("/api/v1/robots")],
    ["an address no API route has", await request.get("/api/v1/robotz")],
    ["GET /healthz", await request.get("/healthz")],
  ] as const) {
    const headers = sent(response);
    expect(headers["content-security-policy"], what).toEqual([NOTHING_POLICY]);
    expect(headers["cache-control"] ?? [], what).not.toContain("private, no-store");
    expectEveryAnswersHeaders(headers, what);
  }

  const html = await (await request.get("/")).text();
  const script = /"(\/assets\/[^"]+\.js)"/.exec(html)?.[1];
  expect(script, "a build file named by the page").toBeDefined();
  for (const path of [script!, "/favicon.svg"]) {
    const headers = sent(await request.get(path));
    expect(headers["cache-control"], path).toEqual([path.startsWith("/assets/") ? "public, max-age=31536000, immutable" : "public, max-age=3600"]);
    expect(headers["content-security-policy"], path).toEqual([NOTHING_POLICY]);
    expectEveryAnswersHeaders(headers, path);
  }

  // Answered by server.js before the app: a method the API does not route (405), under /api/v1.
  const trace = await new Promise<http.IncomingMessage>((resolve, reject) => {
    const call = http.request(new URL("/api/v1/robots", baseURL), { method: "TRACE" }, (response) => resolve(response.resume()));
    call.on("error", reject);
    call.end();
  });
  expect(trace.statusCode).toBe(405);
  expect(trace.headers["content-security-policy"]).toBe(NOTHING_POLICY);
  expect(trace.headers["x-content-type-options"]).toBe("nosniff");
});

test("the shared test hears a Content-Security-Policy violation: an inline script without the nonce", async ({ page, cspViolations }) => {
  await page.goto("/");
  await expect(page.getByRole("heading", { name: "Walking motions you can ship" })).toBeVisible();
  const ran = await page.evaluate(() => {
    const script = document.createElement("script");
    script.textContent = "document.body.dataset.injected = 'ran'";
    document.body.append(script);
    return document.body.dataset.injected ?? "refused";
  });
  expect(ran, "the injected inline script").toBe("refused");
  await expect.poll(() => cspViolations.length, { message: "violations heard" }).toBeGreaterThan(0);
  expect(cspViolations[0]).toContain("script-src");
  // Provoked on purpose: not a failure of this test.
  cspViolations.length = 0;
});

async function signInWithoutJavaScript(page: Page, name: string) {
  await page.goto("/sign-in?returnTo=%2Fsettings%2Ftokens");
  await page.getByRole("button", { name: "Sign in with GitHub" }).click();
  await page.getByRole("button", { name: new RegExp(`^Continue as ${name}`) }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Settings" })).toBeVisible();
}

test("with JavaScript off, a form posted from a page goes through: the browser names our origin", async ({ browser }) => {
  const context = await browser.newContext({ javaScriptEnabled: false });
  try {
    const page = await context.newPage();
    await signInWithoutJavaScript(page, "Ines Okafor");
    const tokens = await page.request.get("/settings/tokens");
    expect(sent(tokens)["referrer-policy"]).toEqual(["strict-origin-when-cross-origin"]);

    const name = `E2E no-script ${Date.now().toString(36)}`;
    await page.getByLabel("Token name").fill(name);
    const posted = page.waitForRequest((request) => request.method() === "POST" && new URL(request.url()).pathname === "/settings/tokens");
    await page.getByRole("button", { name: "Create token" }).click();
    expect((await (await posted).allHeaders())["origin"], "the Origin the form's post named").toBe(new URL(page.url()).origin);
    await expect(page.getByRole("status", { name: "New token" })).toContainText(`Token “${name}” created`);
    await expect(page.getByRole("cell", { name, exact: true })).toBeVisible();
  } finally {
    await context.close();
  }
});
