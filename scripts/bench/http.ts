// Round trips on loopback against the running app, driven by autocannon (its
// HTTP client costs a fraction of fetch's, and client, app and PostgreSQL share
// this machine's cores): p50 and p95 at 1 and at 20 concurrent clients, the
// response size, and the CPU the app and the load generator spend per request.
// GET /healthz, the cheapest route through the same stack, is the floor the
// other figures stand on. benchHeavyWork sets the app with its worker pool
// beside one that solves on the request thread (GAITLOOM_SOLVE_POOL=off).
import autocannon from "autocannon";
import { readFileSync } from "node:fs";
import { generateGait } from "../../app/gait";
import { parseRobot } from "../../app/kinematics";

const CLIENTS = [1, 20] as const;
const REQUESTS = { 1: 100, 20: 400 } as const;
const WARM_UP_REQUESTS = 200;

type Scenario = { name: string; path: string; method?: "POST"; body?: string; headers?: Record<string, string> };

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

let cpuWarned = false;

/** CPU seconds a process has used so far (Linux /proc), or null where that cannot be read. */
function processCpuS(pid: number | undefined): number | null {
  if (!pid) return null;
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
    return (Number(fields[11]) + Number(fields[12])) / 100; // utime + stime, in clock ticks of 1/100 s
  } catch (error) {
    if (!cpuWarned) console.warn(`(no CPU figure for the app: ${error instanceof Error ? error.message : error})`);
    cpuWarned = true;
    return null;
  }
}

async function run(baseUrl: string, token: string, scenario: Scenario, connections: number, amount: number) {
  const started = performance.now();
  const times: number[] = [];
  let bytes = 0;
  let refused = 0;
  const failures: string[] = [];
  await new Promise<void>((resolve, reject) => {
    const options: autocannon.Options = {
      url: baseUrl + scenario.path,
      method: scenario.method ?? "GET",
      body: scenario.body,
      headers: { Authorization: `Bearer ${token}`, ...(scenario.body ? { "Content-Type": "application/json" } : {}), ...scenario.headers },
      connections,
      amount,
      // Twenty clients queued for one worker thread can wait longer than autocannon's default 10 s on a busy machine; an answer is waited for.
      timeout: 60,
    };
    const instance = autocannon(options, (error) => (error ? reject(error) : resolve()));
    instance.on("response", (_client, status, resBytes, ms) => {
      // A 503 is the worker pool's queue over its budget: counted and shown, not timed.
      if (status === 503) refused += 1;
      else if (status !== 200) failures.push(String(status));
      else {
        times.push(ms);
        bytes = resBytes;
      }
    });
  });
  if (failures.length > 0 || times.length + refused < amount)
    throw new Error(`${scenario.name}: ${failures.length} answers not 200 (${failures.slice(0, 3).join(", ")}), ${times.length} of ${amount} answered`);
  return { times: times.sort((a, b) => a - b), bytes, refused, seconds: (performance.now() - started) / 1000 };
}

const refusedNote = (refused: number) => (refused > 0 ? `; ${refused} refused with 503 (the worker queue over its budget)` : "");

async function measure(baseUrl: string, token: string, appPid: number | undefined, scenario: Scenario) {
  await run(baseUrl, token, scenario, 20, WARM_UP_REQUESTS); // warm the JIT and the connection pools
  for (const clients of CLIENTS) {
    const amount = REQUESTS[clients];
    const appBefore = processCpuS(appPid);
    const selfBefore = process.cpuUsage();
    const { times, bytes, refused } = await run(baseUrl, token, scenario, clients, amount);
    const self = process.cpuUsage(selfBefore);
    const appAfter = processCpuS(appPid);
    const appMs = appBefore !== null && appAfter !== null ? `app ${(((appAfter - appBefore) * 1000) / amount).toFixed(1)} ms, ` : "";
    console.log(
      `${scenario.name}, ${String(clients).padStart(2)} client${clients === 1 ? " " : "s"}: ` +
        `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms over ${amount} requests; ` +
        `response ${(bytes / 1024).toFixed(bytes < 10_240 ? 1 : 0)} KiB; CPU per request: ${appMs}load generator ${((self.user + self.system) / 1000 / amount).toFixed(1)} ms` +
        refusedNote(refused),
    );
  }
}

export async function benchSolveApi(baseUrl: string, token: string, appPid?: number): Promise<void> {
  await measure(baseUrl, token, appPid, { name: "GET /healthz (the floor: one database ping, no token, no solve)", path: "/healthz" });
  const robotJson = JSON.parse(readFileSync(new URL("../../db/demo/robots/pier-crawler.json", import.meta.url), "utf8"));
  const parsed = parseRobot(robotJson);
  if (!parsed.ok) throw new Error("demo robot invalid");
  // 1 000 frames: a 20 s cycle at 50 frames per second.
  const sequence = generateGait(parsed.robot, { template: "tripod", cycleMs: 20_000, fps: 50, strideMm: 40 });
  for (const layout of ["frames", "columns", "checks"] as const) {
    for (const cache of ["cold", "cached"] as const) {
      await measure(baseUrl, token, appPid, {
        name: `POST /api/v1/solve, 6 legs, 1 000 frames, layout ${layout}, ${cache === "cold" ? "solved every time" : "answer cached"}`,
        path: "/api/v1/solve",
        method: "POST",
        body: JSON.stringify({ robot: robotJson, sequence, options: { layout } }),
        // The bench is on loopback, where compressing costs more than it saves.
        headers: { "Accept-Encoding": "identity", ...(cache === "cold" ? { "Cache-Control": "no-cache" } : {}) },
      });
    }
  }
}

/** GET of a released demo table in each format (the first request solves; the rest are what build scripts see). */
export async function benchTableApi(baseUrl: string, token: string, gaitId: string, appPid?: number): Promise<void> {
  for (const [format, units] of [
    ["csv", "deg"],
    ["json", "rad"],
    ["c", "us"],
  ] as const) {
    await measure(baseUrl, token, appPid, {
      name: `GET …/versions/released/table?format=${format}&units=${units} (Tripod cruise, 60 frames)`,
      path: `/api/v1/gaits/${gaitId}/versions/released/table?format=${format}&units=${units}`,
    });
  }
}

/** The demo hexapod's file and a tripod for it: `frames` frames at 1000 frames per second. */
function demoSolveBody(frames: number, layout: "frames" | "columns" | "checks"): string {
  const robotJson = JSON.parse(readFileSync(new URL("../../db/demo/robots/pier-crawler.json", import.meta.url), "utf8"));
  const parsed = parseRobot(robotJson);
  if (!parsed.ok) throw new Error("demo robot invalid");
  const sequence = generateGait(parsed.robot, { template: "tripod", cycleMs: frames, fps: 1000, strideMm: 40 });
  return JSON.stringify({ robot: robotJson, sequence, options: { layout } });
}

/** The demo robot with every femur and tibia `lengthMm` long: a hostile robot that froze the server before lengths were bounded. */
function hostileSolveBody(lengthMm: number): string {
  const robotJson = JSON.parse(readFileSync(new URL("../../db/demo/robots/pier-crawler.json", import.meta.url), "utf8"));
  const parsed = parseRobot(robotJson);
  if (!parsed.ok) throw new Error("demo robot invalid");
  const sequence = generateGait(parsed.robot, { template: "tripod", cycleMs: 1000, fps: 50, strideMm: 40 });
  for (const leg of robotJson.legs) Object.assign(leg, { femur: lengthMm, tibia: lengthMm });
  return JSON.stringify({ robot: robotJson, sequence });
}

/** `clients` loops that each post the same solve again as soon as its answer is in, until stopped. */
function backToBack(baseUrl: string, token: string, body: string, clients: number) {
  let stopped = false;
  const times: number[] = [];
  const failures: number[] = [];
  const loops = Array.from({ length: clients }, async () => {
    while (!stopped) {
      const started = performance.now();
      const response = await fetch(`${baseUrl}/api/v1/solve`, {
        method: "POST",
        headers: { Authorization: `Bearer ${token}`, "Content-Type": "application/json", "Cache-Control": "no-cache" },
        body,
      });
      await response.arrayBuffer();
      if (response.status === 200) times.push(performance.now() - started);
      else failures.push(response.status);
    }
  });
  return {
    async stop() {
      stopped = true;
      await Promise.all(loops);
      return { times: times.sort((a, b) => a - b), failures };
    },
  };
}

const ms = (value: number) => `${value.toFixed(1)} ms`;

/**
 * The worker pool's figures, the app with it beside the app without it
 * (GAITLOOM_SOLVE_POOL=off): GET /healthz at 20 clients idle and while two
 * clients post the largest allowed solve back to back (the goal: p95 at most
 * twice the idle one), and the solve throughput at 20 clients; first, how
 * soon a hostile robot's solve is answered (the goal: within a second).
 */
export async function benchHeavyWork(poolUrl: string, noPoolUrl: string, token: string): Promise<void> {
  const health: Scenario = { name: "GET /healthz", path: "/healthz" };
  const largest = demoSolveBody(100_000, "checks");
  const apps = [
    ["pool on ", poolUrl],
    ["pool off", noPoolUrl],
  ] as const;
  for (const lengthMm of [1e7, 1e300]) {
    const started = performance.now();
    const response = await fetch(`${poolUrl}/api/v1/solve`, {
      method: "POST",
      headers: { Authorization: `Bearer ${token}`, "Content-Type": "application/json", "Cache-Control": "no-cache" },
      body: hostileSolveBody(lengthMm),
    });
    await response.arrayBuffer();
    console.log(
      `POST /api/v1/solve, a hostile robot (femur and tibia ${lengthMm.toExponential()} mm): ${response.status} in ${ms(performance.now() - started)} (goal ≤ 1 s)`,
    );
  }
  for (const [, url] of apps) await run(url, token, health, 20, WARM_UP_REQUESTS);
  const idle = await run(poolUrl, token, health, 20, REQUESTS[20]);
  const idleP95 = percentile(idle.times, 95);
  console.log(`GET /healthz, 20 clients, idle: p50 ${ms(percentile(idle.times, 50))}, p95 ${ms(idleP95)} over ${REQUESTS[20]} requests`);
  for (const [label, url] of apps) {
    const solving = backToBack(url, token, largest, 2);
    // Both large solves under way before the first health check.
    await new Promise((resolve) => setTimeout(resolve, 500));
    const busy = await run(url, token, health, 20, REQUESTS[20]);
    const large = await solving.stop();
    const p95 = percentile(busy.times, 95);
    console.log(
      `GET /healthz, 20 clients, 2 clients posting the largest allowed solve (100 000 frames × 6 legs, checks) back to back, ${label}: ` +
        `p50 ${ms(percentile(busy.times, 50))}, p95 ${ms(p95)} (${(p95 / idleP95).toFixed(1)}× idle, goal ≤ 2×); ` +
        `${large.times.length} large solves answered meanwhile, p50 ${large.times.length ? ms(percentile(large.times, 50)) : "—"}` +
        (large.failures.length ? `, ${large.failures.length} refused (${[...new Set(large.failures)].join(", ")})` : ""),
    );
  }
  const solve: Scenario = {
    name: "POST /api/v1/solve, 6 legs, 1 000 frames, layout frames, solved every time",
    path: "/api/v1/solve",
    method: "POST",
    body: demoSolveBody(1000, "frames"),
    headers: { "Accept-Encoding": "identity", "Cache-Control": "no-cache" },
  };
  for (const [label, url] of apps) {
    await run(url, token, solve, 20, WARM_UP_REQUESTS);
    const { times, seconds, refused } = await run(url, token, solve, 20, REQUESTS[20]);
    console.log(
      `${solve.name}, 20 clients, ${label}: ${(times.length / seconds).toFixed(1)} solves/s, p50 ${ms(percentile(times, 50))}, p95 ${ms(percentile(times, 95))} over ${REQUESTS[20]} requests` +
        refusedNote(refused),
    );
  }
}
