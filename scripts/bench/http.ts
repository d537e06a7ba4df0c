// Round trips of POST /api/v1/solve on loopback against a running app:
// p50 and p95 at 1 and at 20 concurrent clients, and the response size.
import { readFileSync } from "node:fs";
import { generateGait } from "../../app/gait";
import { parseRobot } from "../../app/kinematics";

const REQUESTS_PER_CLIENT = { 1: 60, 20: 15 } as const;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

export async function benchSolveApi(baseUrl: string, token: string): Promise<void> {
  const robotJson = JSON.parse(readFileSync(new URL("../../db/demo/robots/pier-crawler.json", import.meta.url), "utf8"));
  const parsed = parseRobot(robotJson);
  if (!parsed.ok) throw new Error("demo robot invalid");
  // 1 000 frames: a 20 s cycle at 50 frames per second.
  const sequence = generateGait(parsed.robot, { template: "tripod", cycleMs: 20_000, fps: 50, strideMm: 40 });
  for (const layout of ["frames", "columns"] as const) {
    for (const cache of ["cold", "warm"] as const) {
      await measure(baseUrl, token, JSON.stringify({ robot: robotJson, sequence, options: { layout } }), layout, cache);
    }
  }
}

async function measure(baseUrl: string, token: string, body: string, layout: string, cache: "cold" | "warm") {
  const call = async () => {
    const started = performance.now();
    const response = await fetch(`${baseUrl}/api/v1/solve`, {
      method: "POST",
      headers: {
        Authorization: `Bearer ${token}`,
        "Content-Type": "application/json",
        "Accept-Encoding": "identity",
        ...(cache === "cold" ? { "Cache-Control": "no-cache" } : {}),
      },
      body,
    });
    const text = await response.text();
    if (response.status !== 200) throw new Error(`solve answered ${response.status}: ${text.slice(0, 200)}`);
    return { ms: performance.now() - started, bytes: Buffer.byteLength(text) };
  };
  for (let i = 0; i < 5; i++) await call(); // warm-up
  for (const clients of [1, 20] as const) {
    const times: number[] = [];
    let bytes = 0;
    await Promise.all(
      Array.from({ length: clients }, async () => {
        for (let i = 0; i < REQUESTS_PER_CLIENT[clients]; i++) {
          const result = await call();
          times.push(result.ms);
          bytes = result.bytes;
        }
      }),
    );
    times.sort((a, b) => a - b);
    console.log(
      `POST /api/v1/solve, 6 legs, 1 000 frames, layout ${layout}, ${cache === "cold" ? "solved every time" : "answer cached"}, ${String(clients).padStart(2)} client${clients === 1 ? " " : "s"}: ` +
        `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms over ${times.length} requests; ` +
        `response ${(bytes / 1024).toFixed(0)} KiB`,
    );
  }
}

/** GET of a released demo table in each format (first request solves; the rest are what build scripts see). */
export async function benchTableApi(baseUrl: string, token: string, gaitId: string): Promise<void> {
  for (const [format, units] of [["csv", "deg"], ["json", "rad"], ["c", "us"]] as const) {
    const url = `${baseUrl}/api/v1/gaits/${gaitId}/versions/released/table?format=${format}&units=${units}`;
    const times: number[] = [];
    let bytes = 0;
    for (let i = 0; i < 65; i++) {
      const started = performance.now();
      const response = await fetch(url, { headers: { Authorization: `Bearer ${token}` } });
      const text = await response.text();
      if (response.status !== 200) throw new Error(`table answered ${response.status}: ${text.slice(0, 200)}`);
      if (i >= 5) times.push(performance.now() - started);
      bytes = Buffer.byteLength(text);
    }
    times.sort((a, b) => a - b);
    console.log(
      `GET …/versions/released/table?format=${format}&units=${units} (Tripod cruise, 60 frames): ` +
        `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms over ${times.length} requests; ${(bytes / 1024).toFixed(1)} KiB`,
    );
  }
}
