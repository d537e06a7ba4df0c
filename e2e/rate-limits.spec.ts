// Rate limits across real app processes: server.js started twice more, from
// this tree's build, against the database of the app under test, with the
// limits on (the app under test runs with GAITLOOM_RATE_LIMITS=off for the
// probe). Its people make the token; the two extra processes count it.
import { expect, test, type Page } from "./support/test";
import { spawn, type ChildProcess } from "node:child_process";
import { once } from "node:events";
import { createServer } from "node:net";
import { signInAs } from "./support/sign-in";

// One after the other: the failed attempts of the last test refuse this address's requests for a minute.
test.describe.configure({ mode: "serial" });

type App = { url: string; child: ChildProcess; output: () => string };

async function freePort(): Promise<number> {
  const server = createServer();
  server.listen(0, "127.0.0.1");
  await once(server, "listening");
  const { port } = server.address() as { port: number };
  server.close();
  await once(server, "close");
  return port;
}

/** server.js on a port of its own, as production runs it, limits on; `extra` adds to (or with "" removes from) the environment. */
function launch(port: number, extra: Record<string, string> = {}) {
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production", HOST: "127.0.0.1", PORT: String(port), ...extra };
  delete env.GAITLOOM_RATE_LIMITS;
  delete env.GAITLOOM_PROBE_COUNTS;
  for (const [name, value] of Object.entries(extra)) if (value === "") delete env[name];
  const child = spawn(process.execPath, ["server.js", "build/server/index.js"], { env, stdio: ["ignore", "pipe", "pipe"] });
  let output = "";
  child.stdout!.on("data", (chunk) => (output += chunk));
  child.stderr!.on("data", (chunk) => (output += chunk));
  return { child, output: () => output };
}

async function startApp(extra: Record<string, string> = {}): Promise<App> {
  const port = await freePort();
  const { child, output } = launch(port, extra);
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`server.js ended (${child.exitCode}):\n${output()}`);
    const ready = await fetch(`${url}/healthz`).then(
      (response) => response.ok,
      () => false,
    );
    if (ready) return { url, child, output };
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  child.kill();
  throw new Error(`server.js did not answer on ${url} within 30 s:\n${output()}`);
}

async function stopApp(app: App | undefined) {
  if (!app || app.child.exitCode !== null) return;
  app.child.kill("SIGTERM");
  await once(app.child, "exit");
}

async function createToken(page: Page, name: string): Promise<string> {
  await signInAs(page, "priya-sandoval", "/settings/tokens");
  await page.getByLabel("Token name").fill(name);
  await page.getByRole("button", { name: "Create token" }).click();
  const token = (await page.getByTestId("new-token").textContent())?.trim() ?? "";
  expect(token.length).toBeGreaterThan(20);
  return token;
}

type Answer = { status: number; retryAfter: string | null; body: { error?: { code: string; message: string } } };

async function workspaceWith(app: App, token: string, headers: Record<string, string> = {}): Promise<Answer> {
  const response = await fetch(`${app.url}/api/v1/workspace`, { headers: { Authorization: `Bearer ${token}`, ...headers } });
  return { status: response.status, retryAfter: response.headers.get("Retry-After"), body: await response.json() };
}

function expectRateLimited(answer: Answer) {
  expect(answer.status).toBe(429);
  expect(answer.body.error?.code).toBe("rate_limited");
  expect(Number(answer.retryAfter)).toBeGreaterThanOrEqual(1);
  expect(Number(answer.retryAfter)).toBeLessThanOrEqual(60);
}

const UNKNOWN_TOKEN = `gl_${"Z".repeat(43)}`;
const FAILED_ATTEMPTS_PER_MINUTE = 10;

let first: App | undefined;
let second: App | undefined;

test.beforeAll(async () => {
  [first, second] = await Promise.all([startApp(), startApp()]);
});

test.afterAll(async () => {
  await Promise.all([stopApp(first), stopApp(second)]);
});

test("Rate limit: two app processes on one database give one token 120 requests a minute in total, not 240", async ({ page }) => {
  const token = await createToken(page, `two processes ${Date.now()}`);
  const answers: Answer[] = [];
  for (let i = 0; i < 240; i++) answers.push(await workspaceWith(i % 2 === 0 ? first! : second!, token));
  const statuses = answers.map((answer) => answer.status);
  expect(statuses.slice(0, 120), "the first 120, alternating between the two processes").toEqual(Array(120).fill(200));
  expect(statuses.slice(120), "the next 120").toEqual(Array(120).fill(429));
  expectRateLimited(answers[120]);
  expectRateLimited(answers[121]);
});

test("failed token attempts count per client address, shared by the processes; X-Forwarded-For only from the proxy GAITLOOM_TRUST_PROXY names", async () => {
  const behindProxy = await startApp({ GAITLOOM_TRUST_PROXY: "127.0.0.1" });
  try {
    // The proxy (this machine) forwards for 203.0.113.7: that address is counted.
    for (let i = 0; i < FAILED_ATTEMPTS_PER_MINUTE; i++)
      expect((await workspaceWith(behindProxy, UNKNOWN_TOKEN, { "X-Forwarded-For": "203.0.113.7" })).status).toBe(401);
    expectRateLimited(await workspaceWith(behindProxy, UNKNOWN_TOKEN, { "X-Forwarded-For": "203.0.113.7" }));
    // A client cannot get round it by sending an address of its own first: the right-most address the proxy did not add counts.
    expectRateLimited(await workspaceWith(behindProxy, UNKNOWN_TOKEN, { "X-Forwarded-For": "198.51.100.1, 203.0.113.7" }));
    expect((await workspaceWith(behindProxy, UNKNOWN_TOKEN, { "X-Forwarded-For": "203.0.113.8" })).status).toBe(401);
  } finally {
    await stopApp(behindProxy);
  }
  // Without GAITLOOM_TRUST_PROXY the header is ignored: every attempt is this machine's, on either process.
  for (let i = 0; i < FAILED_ATTEMPTS_PER_MINUTE; i++) {
    const app = i % 2 === 0 ? first! : second!;
    expect((await workspaceWith(app, UNKNOWN_TOKEN, { "X-Forwarded-For": `198.51.100.${i + 10}` })).status).toBe(401);
  }
  expectRateLimited(await workspaceWith(second!, UNKNOWN_TOKEN, { "X-Forwarded-For": "198.51.100.99" }));
});

test("a GAITLOOM_TRUST_PROXY that names no address stops server.js at start, saying so", async () => {
  for (const value of ["true", "1", "proxy.example"]) {
    const { child, output } = launch(await freePort(), { GAITLOOM_TRUST_PROXY: value });
    const ended = await Promise.race([once(child, "exit").then(() => true), new Promise<false>((resolve) => setTimeout(resolve, 15_000, false))]);
    if (!ended) child.kill();
    expect(ended, `server.js still running 15 s after starting with GAITLOOM_TRUST_PROXY=${value}`).toBe(true);
    expect(child.exitCode, `GAITLOOM_TRUST_PROXY=${value}`).not.toBe(0);
    expect(output()).toContain("GAITLOOM_TRUST_PROXY");
  }
});
