// The probe (npm run probe; scripts/probe.sh starts an app for it): signs in
// as every kind of caller, then sends --count malformed and hostile requests
// (default 10 000), made from --seed, across every loader, action and intent
// of app/routes.ts, at most --seconds of wall-clock in all, to an app on
// loopback only. The app, run with GAITLOOM_PROBE_COUNTS=1, names in each
// answer the handlers it entered; the probe prints per route and method how
// many requests reached a handler and how they were answered, and ends with
// "N server errors". It fails on any 5xx (but a 503 with Retry-After, a
// refusal for now), on a redirect off the site, on an answer other than the
// one a case expects (a session ended since must read as signed out, another
// account's invitation must be refused with 403), and on a loader, action or
// intent that no request reached.
import { closeSync, openSync, readSync, statSync, writeFileSync } from "node:fs";
import { parseArgs } from "node:util";
import { allowedIdentity, build, everyField, FAMILIES, type Case, type Context } from "./cases";
import { headerProblems } from "./headers";
import { bodySize, isLargeBody, makeAgent, send, type Answer } from "./http";
import { random } from "./prng";
import { isLoopbackHost, prepareWorld } from "./setup";
import { probeSharedLimit, TOKEN_CALLS_A_MINUTE, type SharedLimitResult } from "./shared-limit";
import { addOpenApiDetails, loadRoutes, targetsOf, type Target } from "./targets";

const { values: options } = parseArgs({
  options: {
    url: { type: "string", default: process.env.GAITLOOM_PROBE_URL },
    seed: { type: "string", default: "1" },
    count: { type: "string", default: "10000" },
    seconds: { type: "string", default: "900" },
    concurrency: { type: "string", default: "6" },
    timeout: { type: "string", default: "30" },
    "app-log": { type: "string" },
    report: { type: "string" },
    // Two or more apps on the probe's database with the rate limits on, for the shared-limit check.
    "limited-apps": { type: "string" },
  },
});

function die(message: string): never {
  console.error(`[probe] ${message}`);
  process.exit(2);
}

const wholeNumber = (name: string, value: string | undefined, min: number) => {
  if (!/^\d+$/.test(value ?? "") || Number(value) < min) die(`--${name} must be a whole number from ${min} (got ${JSON.stringify(value)})`);
  return Number(value);
};
const seed = wholeNumber("seed", options.seed, 0);
const count = wholeNumber("count", options.count, 1);
const seconds = wholeNumber("seconds", options.seconds, 1);
const concurrency = wholeNumber("concurrency", options.concurrency, 1);
const timeoutMs = wholeNumber("timeout", options.timeout, 1) * 1000;
if (!options.url) die("Name the app to probe: --url http://127.0.0.1:PORT (or GAITLOOM_PROBE_URL).");
let origin: URL;
try {
  origin = new URL(options.url);
} catch {
  die(`${options.url} is not a URL.`);
}
const limitedApps = (options["limited-apps"] ?? "")
  .split(",")
  .filter(Boolean)
  .map((url) => (URL.canParse(url) ? new URL(url) : die(`--limited-apps: ${url} is not a URL.`)));
for (const app of [origin, ...limitedApps]) {
  if (app.protocol !== "http:" || !isLoopbackHost(app.hostname)) {
    die(`Refusing to probe ${app.origin}: the probe sends hostile requests to loopback only (127.0.0.1, localhost, ::1).`);
  }
}

const startedAt = performance.now();
const elapsedS = () => (performance.now() - startedAt) / 1000;
const say = (message: string) => console.log(`[probe] ${message}`);

// What the app counts: refuse to run blind.
async function appCounts(): Promise<Record<string, number>> {
  const response = await fetch(new URL("/local/probe-counts", origin), { redirect: "manual" });
  if (response.status !== 200) {
    die(
      `${origin.origin}/local/probe-counts answered ${response.status}: start the app with GAITLOOM_PROBE_COUNTS=1 (and GAITLOOM_RATE_LIMITS=off) so the probe can tell which requests reached their handler.`,
    );
  }
  return (await response.json()) as Record<string, number>;
}

await appCounts();
const routes = await loadRoutes();
const targets = targetsOf(routes);
say(`${routes.length} routes, ${targets.length} loaders, actions and intents to reach; signing in`);
const world = await prepareWorld(origin.origin, `${seed}-${Date.now().toString(36)}`).catch((error: Error) => die(`Setting up failed: ${error.message}`));
addOpenApiDetails(targets, world.openApi);
say(
  `${world.identities.length} callers ready in ${elapsedS().toFixed(1)} s; sending ${count} requests (seed ${seed}, at most ${seconds} s in all, ${concurrency} at a time)`,
);

const rng = random(seed);
let serial = 0;
const context: Context = { world, random: rng, serial: () => ++serial };

/**
 * The cases in order: each target once as its own clients send it, NUL or
 * bytes that are not UTF-8 in each of its fields and parameters, each family
 * on each target it fits, then families and targets drawn at random.
 */
function* cases(): Generator<Case> {
  for (const target of targets)
    yield build(target, { identity: allowedIdentity(target, world, rng) }, context, "well-formed", "as its own pages or clients send it");
  for (const target of targets) yield* everyField(target, context);
  const pairs = FAMILIES.flatMap((family) => targets.filter((target) => family.applies(target)).map((target) => ({ family, target })));
  for (let i = pairs.length - 1; i > 0; i--) {
    const j = rng.int(i + 1);
    [pairs[i], pairs[j]] = [pairs[j], pairs[i]];
  }
  for (const { family, target } of pairs) yield family.make(target, context);
  for (;;) {
    const family = rng.weighted(FAMILIES.map((candidate) => [candidate.weight, candidate] as const));
    const fitting = targets.filter((target) => family.applies(target));
    if (fitting.length) yield family.make(rng.pick(fitting), context);
  }
}

type Row = { route: string; method: string; requests: number; reached: number; byClass: number[]; unanswered: number };
const rows = new Map<string, Row>();
const families = new Map<string, { requests: number; serverErrors: number }>();
const reachedTargets = new Set<string>();
const serverErrors: { item: Case; answer: Answer }[] = [];
const offSite: { item: Case; answer: Answer }[] = [];
const unanswered: { item: Case; answer: Answer }[] = [];
const unexpected: { item: Case; answer: Answer }[] = [];
const badHeaders: { item: Case; answer: Answer; problems: string[] }[] = [];
const nonces = new Set<string>();
let handlerEntries = 0;
let sent = 0;
let stoppedByClock = false;

const targetKey = (target: Target) => `${target.route.id} ${target.kind}${target.intent ? ` intent=${target.intent}` : ""}`;
const isServerError = (answer: Answer) => answer.status !== null && answer.status >= 500 && !(answer.status === 503 && answer.retryAfter);

function record(item: Case, answer: Answer) {
  const route = item.target.route.id;
  const key = `${route}\t${item.sent.method}`;
  const row = rows.get(key) ?? { route, method: item.sent.method, requests: 0, reached: 0, byClass: [0, 0, 0, 0], unanswered: 0 };
  rows.set(key, row);
  row.requests += 1;
  const entered = answer.reached.filter((entry) => entry.startsWith(`${route} `));
  handlerEntries += answer.reached.length;
  if (entered.length) row.reached += 1;
  if (answer.reached.includes(`${route} ${item.target.kind}`)) reachedTargets.add(targetKey(item.target));
  if (answer.status === null) {
    row.unanswered += 1;
    unanswered.push({ item, answer });
  } else {
    row.byClass[Math.min(3, Math.max(0, Math.floor(answer.status / 100) - 2))] += 1;
  }
  const family = families.get(item.family) ?? { requests: 0, serverErrors: 0 };
  families.set(item.family, family);
  family.requests += 1;
  if (isServerError(answer)) {
    family.serverErrors += 1;
    serverErrors.push({ item, answer });
  }
  const forNow = answer.status === 503 && answer.retryAfter;
  if (item.expect && answer.status !== null && !forNow && !isServerError(answer) && !item.expect.holds(answer)) unexpected.push({ item, answer });
  if (answer.status !== null) {
    const problems = headerProblems(answer, { signInOrigin: world.githubOrigin, personal: carriesLiveSession(item), method: item.sent.method, nonces });
    if (problems.length) badHeaders.push({ item, answer, problems });
  }
  if (answer.location) {
    const target = URL.canParse(answer.location, origin) ? new URL(answer.location, origin) : null;
    // Signing in starts at GitHub's authorize page (the local stand-in's here).
    const toGitHub = target?.origin === world.githubOrigin && target.pathname === "/login/oauth/authorize";
    if (!target || (target.origin !== origin.origin && !toGitHub)) offSite.push({ item, answer });
  }
}

/** The request carries one session cookie, and it is one of the sessions that stay signed in. */
function carriesLiveSession(item: Case): boolean {
  const sessions = (item.sent.headers.Cookie ?? "").split(/;\s*/).filter((pair) => pair.startsWith("gaitloom_session="));
  return sessions.length === 1 && world.liveSessions.includes(sessions[0].slice("gaitloom_session=".length));
}

const countsBefore = await appCounts();
const logStart = options["app-log"] ? safeSize(options["app-log"]) : 0;
const agent = makeAgent(concurrency);
const queue = cases();
async function worker() {
  for (;;) {
    if (sent >= count) return;
    if (elapsedS() >= seconds) {
      stoppedByClock = true;
      return;
    }
    const item = queue.next().value as Case;
    sent += 1;
    const remainingMs = Math.max(1000, (seconds - elapsedS()) * 1000);
    record(item, await send(origin, item.sent, agent, Math.min(timeoutMs, remainingMs + 5000)));
    if (sent % 1000 === 0) say(`${sent} sent, ${serverErrors.length} server errors, ${elapsedS().toFixed(0)} s`);
  }
}
await Promise.all(Array.from({ length: concurrency }, worker));
agent.destroy();
const countsAfter = await appCounts();
let sharedLimit: SharedLimitResult | null = null;
if (limitedApps.length > 1) {
  say(`one token, ${2 * TOKEN_CALLS_A_MINUTE} calls spread over ${limitedApps.length} app processes with the limits on`);
  sharedLimit = await probeSharedLimit(limitedApps, world.limitToken, world.githubOrigin);
}

// ---------------------------------------------------------------------------
// The report

const total = (counts: Record<string, number>) => Object.values(counts).reduce((sum, n) => sum + n, 0);
const pad = (value: string | number, width: number, right = false) => (right ? String(value).padStart(width) : String(value).padEnd(width));
const sorted = [...rows.values()].sort((a, b) => a.route.localeCompare(b.route) || a.method.localeCompare(b.method));
const routeWidth = Math.max(5, ...sorted.map((row) => row.route.length));
const line = (cells: (string | number)[]) =>
  `${pad(cells[0], routeWidth)}  ${pad(cells[1], 8)}${cells
    .slice(2)
    .map((cell) => pad(cell, 10, true))
    .join("")}`;
console.log("");
console.log(line(["route", "method", "requests", "reached", "2xx", "3xx", "4xx", "5xx", "no answer"]));
for (const row of sorted) console.log(line([row.route, row.method, row.requests, row.reached, ...row.byClass, row.unanswered]));
const sum = (pick: (row: Row) => number) => sorted.reduce((n, row) => n + pick(row), 0);
console.log(line(["all", "", sum((r) => r.requests), sum((r) => r.reached), ...[0, 1, 2, 3].map((i) => sum((r) => r.byClass[i])), sum((r) => r.unanswered)]));

console.log("");
console.log(`${pad("family", 24)}${pad("requests", 10, true)}${pad("5xx", 10, true)}`);
for (const [name, family] of [...families].sort((a, b) => b[1].requests - a[1].requests)) {
  console.log(`${pad(name, 24)}${pad(family.requests, 10, true)}${pad(family.serverErrors, 10, true)}`);
}

const describe = ({ item, answer }: { item: Case; answer: Answer }) => {
  const body = item.sent.body;
  const size = bodySize(body);
  const preview =
    body && !isLargeBody(body)
      ? JSON.stringify(body.subarray(0, 160).toString("latin1")) + (size > 160 ? "…" : "")
      : size
        ? `${size} bytes${isLargeBody(body) && body.chunked ? " chunked" : ""}`
        : "";
  const type = item.sent.headers["Content-Type"] ? ` [${item.sent.headers["Content-Type"]}]` : "";
  return [
    `  ${answer.status ?? answer.error} ${item.sent.method} ${item.sent.path.length > 300 ? `${item.sent.path.slice(0, 300)}…` : item.sent.path}`,
    `      ${item.family}: ${item.note}; as ${item.identity}${type}${preview ? ` body ${preview}` : ""}`,
    ...(answer.excerpt ? [`      answered: ${JSON.stringify(answer.excerpt.slice(0, 200))}`] : []),
  ].join("\n");
};

console.log("");
say(
  `${sent} requests in ${elapsedS().toFixed(0)} s${stoppedByClock ? ` (stopped by the ${seconds} s limit)` : ""}; ${world.identities.length} callers; seed ${seed}`,
);
const appEntries = total(countsAfter) - total(countsBefore);
say(
  `handler entries: ${handlerEntries} named in answers, ${appEntries} counted by the app${appEntries === handlerEntries ? "" : " (others were using the app too, or answers were cut short)"}`,
);
const unreached = targets.filter((target) => !reachedTargets.has(targetKey(target)));
if (unanswered.length) {
  say(`${unanswered.length} requests got no answer (reset or timed out), e.g.:`);
  for (const entry of unanswered.slice(0, 5)) console.log(describe(entry));
}
if (offSite.length) {
  say(`${offSite.length} redirects off the site:`);
  for (const entry of offSite.slice(0, 20)) console.log(`${describe(entry)}\n      Location: ${entry.answer.location}`);
}
if (serverErrors.length) {
  say(`server errors (first 40 of ${serverErrors.length}):`);
  for (const entry of serverErrors.slice(0, 40)) console.log(describe(entry));
  if (options["app-log"]) printLogErrors(options["app-log"], logStart);
}
if (unexpected.length) {
  say(`answers other than the case expects (first 20 of ${unexpected.length}):`);
  for (const entry of unexpected.slice(0, 20)) console.log(`${describe(entry)}\n      expected: ${entry.item.expect!.what}`);
}
if (badHeaders.length) {
  say(`answers without the headers of decision 010 (first 20 of ${badHeaders.length}):`);
  for (const entry of badHeaders.slice(0, 20)) console.log(`${describe(entry)}\n      ${entry.problems.join("\n      ")}`);
}
if (sharedLimit) {
  say(
    `shared limit: ${sharedLimit.answered200} of ${sharedLimit.sent} calls answered 200 and ${sharedLimit.refused429} refused 429 across ${limitedApps.length} app processes (allowance ${TOKEN_CALLS_A_MINUTE} a minute)`,
  );
  for (const problem of sharedLimit.problems.slice(0, 20)) console.log(`  ${problem}`);
}
for (const target of unreached) say(`never reached: ${targetKey(target)}`);
if (options.report) {
  writeFileSync(
    options.report,
    JSON.stringify(
      {
        seed,
        count,
        sent,
        seconds: elapsedS(),
        rows: sorted,
        families: Object.fromEntries(families),
        unreached: unreached.map(targetKey),
        serverErrors: serverErrors.map(reportEntry),
        offSite: offSite.map(reportEntry),
        unexpected: unexpected.map((entry) => ({ ...reportEntry(entry), expected: entry.item.expect!.what })),
        unanswered: unanswered.map(reportEntry),
        sharedLimit,
        badHeaders: badHeaders.map((entry) => ({ ...reportEntry(entry), problems: entry.problems })),
      },
      null,
      1,
    ),
  );
  say(`the details: ${options.report}`);
}
if (offSite.length) console.log(`${offSite.length} redirects off the site`);
if (unreached.length) console.log(`${unreached.length} loaders, actions or intents never reached`);
if (unexpected.length) console.log(`${unexpected.length} answers other than expected`);
if (badHeaders.length) console.log(`${badHeaders.length} answers without the headers every answer carries`);
console.log(`${nonces.size} pages, each with a nonce of its own`);
if (sharedLimit?.problems.length) console.log(`the limit two app processes share: ${sharedLimit.problems.length} problems`);
console.log(`${serverErrors.length} server errors`);
process.exit(serverErrors.length || unreached.length || offSite.length || unexpected.length || badHeaders.length || sharedLimit?.problems.length ? 1 : 0);

function reportEntry({ item, answer }: { item: Case; answer: Answer }) {
  const body = item.sent.body;
  return {
    family: item.family,
    note: item.note,
    identity: item.identity,
    route: item.target.route.id,
    method: item.sent.method,
    path: item.sent.path,
    headers: {
      ...item.sent.headers,
      ...(item.sent.headers.Cookie ? { Cookie: "(the caller's)" } : {}),
      ...(item.sent.headers.Authorization ? { Authorization: "(the caller's)" } : {}),
    },
    body: body && !isLargeBody(body) ? body.subarray(0, 4096).toString("base64") : undefined,
    bodySize: bodySize(body),
    status: answer.status,
    error: answer.error,
    excerpt: answer.excerpt,
    location: answer.location,
  };
}

function safeSize(file: string): number {
  try {
    return statSync(file).size;
  } catch {
    return 0;
  }
}

/** The error lines the app logged during the probe, each once with how often. */
function printLogErrors(file: string, from: number) {
  const size = safeSize(file) - from;
  if (size <= 0) return;
  const buffer = Buffer.alloc(Math.min(size, 64 * 1024 * 1024));
  const fd = openSync(file, "r");
  readSync(fd, buffer, 0, buffer.length, from);
  closeSync(fd);
  const seen = new Map<string, number>();
  // The router's own complaints about methods, addresses and forwarded origins come with 4xx answers.
  const refusals = /You made a \w+ request|Invalid request method|Failed to decode param|forwarded action request/;
  for (const entry of buffer.toString("utf8").split("\n")) {
    const message = entry.trim().slice(0, 200);
    if (/^\w*Error\b[^\n]*:/.test(message) && !refusals.test(message)) seen.set(message, (seen.get(message) ?? 0) + 1);
  }
  if (!seen.size) return;
  say(`errors the app logged meanwhile (${file}):`);
  for (const [message, times] of [...seen].sort((a, b) => b[1] - a[1]).slice(0, 20)) console.log(`  ${times}× ${message}`);
}
