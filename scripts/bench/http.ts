// Round trips on loopback against the running app, driven by autocannon (its
// HTTP client costs a fraction of fetch's, and client, app and PostgreSQL share
// this machine's cores): p50 and p95 at 1 and at 20 concurrent clients, the
// response size, and the CPU the app and the load generator spend per request.
// GET /healthz, the cheapest route through the same stack, is the floor the
// other figures stand on.
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
  const times: number[] = [];
  let bytes = 0;
  const failures: string[] = [];
  await new Promise<void>((resolve, reject) => {
    const options: autocannon.Options = {
      url: baseUrl + scenario.path,
      method: scenario.method ?? "GET",
      body: scenario.body,
      headers: { Authorization: `Bearer ${token}`, ...(scenario.body ? { "Content-Type": "application/json" } : {}), ...scenario.headers },
      connections,
      amount,
    };
    const instance = autocannon(options, (error) => (error ? reject(error) : resolve()));
    instance.on("response", (_client, status, resBytes, ms) => {
      if (status !== 200) failures.push(String(status));
      times.push(ms);
      bytes = resBytes;
    });
  });
  if (failures.length > 0 || times.length < amount)
    throw new Error(`${scenario.name}: ${failures.length} answers not 200 (${failures.slice(0, 3).join(", ")}), ${times.length} of ${amount} answered`);
  return { times: times.sort((a, b) => a - b), bytes };
}

async function measure(baseUrl: string, token: string, appPid: number | undefined, scenario: Scenario) {
  await run(baseUrl, token, scenario, 20, WARM_UP_REQUESTS); // warm the JIT and the connection pools
  for (const clients of CLIENTS) {
    const amount = REQUESTS[clients];
    const appBefore = processCpuS(appPid);
    const selfBefore = process.cpuUsage();
    const { times, bytes } = await run(baseUrl, token, scenario, clients, amount);
    const self = process.cpuUsage(selfBefore);
    const appAfter = processCpuS(appPid);
    const appMs = appBefore !== null && appAfter !== null ? `app ${(((appAfter - appBefore) * 1000) / amount).toFixed(1)} ms, ` : "";
    console.log(
      `${scenario.name}, ${String(clients).padStart(2)} client${clients === 1 ? " " : "s"}: ` +
        `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms over ${amount} requests; ` +
        `response ${(bytes / 1024).toFixed(bytes < 10_240 ? 1 : 0)} KiB; CPU per request: ${appMs}load generator ${((self.user + self.system) / 1000 / amount).toFixed(1)} ms`,
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
