// Bench of the exporter: for the six-legged demo robot and a 1 000-frame walk,
// the median time to build the table from the solved result, and the table's
// size in bytes, in each format (CSV, JSON, C header) and units (deg, rad, µs);
// and, for comparison, the solve itself and buildAngleTable (solve + table).
// Run alone with `npx tsx scripts/bench/export.ts`, or through benchExport().
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { parseRobot, type Robot } from "../../app/kinematics/index";
import { generateGait, solveSequence } from "../../app/gait/index";
import { TABLE_FORMATS, TABLE_UNITS, angleTable, buildAngleTable, type AngleTableOptions } from "../../app/export/index";

const FRAMES = 1000;
const FPS = 50;
const CYCLE_MS = (FRAMES * 1000) / FPS;
const ROUNDS = 40;
const WARMUP = 10;

function loadDemoRobot(file: string): Robot {
  const parsed = parseRobot(JSON.parse(readFileSync(new URL(`../../db/demo/robots/${file}`, import.meta.url), "utf8")));
  if (!parsed.ok) throw new Error(`${file}: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.robot;
}

/**
 * Median wall time (ms) of each run, timed in turns round after round so that
 * a busy machine or a garbage collection slows them alike.
 */
function medianInTurns(runs: Record<string, () => void>): Record<string, number> {
  const names = Object.keys(runs);
  const times: Record<string, number[]> = Object.fromEntries(names.map((name) => [name, []]));
  for (let round = 0; round < WARMUP + ROUNDS; round += 1) {
    for (const name of names) {
      const start = process.hrtime.bigint();
      runs[name]();
      if (round >= WARMUP) times[name].push(Number(process.hrtime.bigint() - start) / 1e6);
    }
  }
  return Object.fromEntries(names.map((name) => [name, [...times[name]].sort((a, b) => a - b)[Math.floor(ROUNDS / 2)]]));
}

export async function benchExport(): Promise<void> {
  const robot = loadDemoRobot("pier-crawler.json");
  const sequence = generateGait(robot, {
    template: "tripod",
    cycleMs: CYCLE_MS,
    fps: FPS,
    strideMm: 40,
    turnDegPerCycle: 10,
    stepHeightMm: 25,
    name: "Bench tripod",
  });
  const solved = solveSequence(robot, sequence);
  const meta = { robotName: robot.name, robotRevision: 1, gaitName: "Bench tripod", gaitVersion: 1, contentHash: "sha256:bench", loop: true };
  const overrideReason = solved.summary.errors > 0 ? "bench" : undefined;
  let sink = 0;

  console.log(`export: ${robot.name} (${robot.legs.length} legs, ${robot.legs.length * 3} channels), ${solved.frames.length} frames, median of ${ROUNDS} runs`);
  const runs: Record<string, () => void> = {};
  const sizes: Record<string, number> = {};
  for (const format of TABLE_FORMATS) {
    for (const units of TABLE_UNITS) {
      const options: AngleTableOptions = { format, units, meta, overrideReason };
      sizes[`${format} ${units}`] = Buffer.byteLength(angleTable(robot, solved, options), "utf8");
      runs[`${format} ${units}`] = () => void (sink += angleTable(robot, solved, options).length);
    }
  }
  runs.solve = () => void (sink += solveSequence(robot, sequence).frames.length);
  runs.build = () => void (sink += buildAngleTable(robot, sequence, { format: "c", units: "us", meta, overrideReason }).length);
  const medians = medianInTurns(runs);
  const rows: string[][] = [["format", "units", "build (median)", "size"]];
  for (const name of Object.keys(sizes)) {
    const [format, units] = name.split(" ");
    rows.push([format, units, `${medians[name].toFixed(3)} ms`, `${(sizes[name] / 1024).toFixed(1)} KiB (${sizes[name]} B)`]);
  }
  const widths = rows[0].map((_, c) => Math.max(...rows.map((row) => row[c].length)));
  for (const row of rows) console.log(`  ${row.map((cell, c) => (c >= 2 ? cell.padStart(widths[c]) : cell.padEnd(widths[c]))).join("  ")}`);
  console.log(`  solveSequence alone: ${medians.solve.toFixed(3)} ms; buildAngleTable (solve + C header in µs): ${medians.build.toFixed(3)} ms`);
  if (sink === 0.5) console.log("");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  await benchExport();
}
