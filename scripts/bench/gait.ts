// Bench of the gait engine: the median time of solveSequence for the
// six-legged demo robot at 1 000 frames with every check on (target ≤ 2 ms),
// of runSolve (the same solve without building the frame objects), of the bare IK of the same 6 000 targets (the floor, for the ratio), and of
// generateGait. Run alone with `npx tsx scripts/bench/gait.ts`, or through
// benchGait(). Each is timed in a loop of its own; the median leaves out the
// rounds a garbage collection lands in, the mean and p90 keep them.
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { createLegSolver, parseRobot, type Robot } from "../../app/kinematics/index";
import { generateGait, runSolve, solveSequence } from "../../app/gait/index";

const FRAMES = 1000;
const FPS = 50;
const CYCLE_MS = (FRAMES * 1000) / FPS;

function loadDemoRobot(file: string): Robot {
  const parsed = parseRobot(JSON.parse(readFileSync(new URL(`../../db/demo/robots/${file}`, import.meta.url), "utf8")));
  if (!parsed.ok) throw new Error(`${file}: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.robot;
}

type Timing = { medianMs: number; p90Ms: number; meanMs: number };

/** Times `run` over `rounds` rounds after `warmup` untimed ones. `run` returns a number so that nothing is optimised away. */
function time(run: () => number, rounds: number, warmup: number): Timing & { sink: number } {
  let sink = 0;
  for (let i = 0; i < warmup; i += 1) sink += run();
  const times: number[] = [];
  for (let i = 0; i < rounds; i += 1) {
    const start = process.hrtime.bigint();
    sink += run();
    times.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  times.sort((a, b) => a - b);
  return {
    medianMs: times[Math.floor(rounds / 2)],
    p90Ms: times[Math.floor(rounds * 0.9)],
    meanMs: times.reduce((sum, value) => sum + value, 0) / rounds,
    sink,
  };
}

export async function benchGait(): Promise<void> {
  const robot = loadDemoRobot("pier-crawler.json");
  const legCount = robot.legs.length;
  const params = { template: "tripod", cycleMs: CYCLE_MS, fps: FPS, strideMm: 40, turnDegPerCycle: 10, stepHeightMm: 25 } as const;
  const sequence = generateGait(robot, params);

  const solve = time(() => solveSequence(robot, sequence).frames.length, 300, 60);
  // The same solve without the frame objects (what the column and checks layouts of the API use).
  const run = time(() => runSolve(robot, sequence).flags.length + 1, 300, 60);

  // The bare IK of the same 6 000 targets (the planned feet of the frames).
  const solver = createLegSolver(robot);
  const targets = new Float64Array(FRAMES * legCount * 3);
  solveSequence(robot, sequence, { checks: [] }).frames.forEach((frame, f) =>
    solver.legIds.forEach((legId, l) => targets.set(frame.legs[legId].foot, (f * legCount + l) * 3)),
  );
  const out = new Float64Array(3);
  const ik = time(
    () => {
      let status = 0;
      for (let i = 0; i < FRAMES * legCount; i += 1) status |= solver.solve(i % legCount, targets[i * 3], targets[i * 3 + 1], targets[i * 3 + 2], out, 0);
      return status + out[0];
    },
    300,
    60,
  );

  const generate = time(() => generateGait(robot, params).cycleMs, 300, 30);

  const flags = solveSequence(robot, sequence).flags.length;
  const ms = (value: number): string => `${value.toFixed(3)} ms`;
  console.log(
    `gait: solveSequence, ${robot.name} (${legCount} legs), ${FRAMES} frames, all checks (${flags} flags): median ${ms(solve.medianMs)} (target ≤ 2 ms), p90 ${ms(solve.p90Ms)}, mean ${ms(solve.meanMs)}`,
  );
  console.log(`gait: runSolve (the same, without the frame objects): median ${ms(run.medianMs)}, p90 ${ms(run.p90Ms)}, mean ${ms(run.meanMs)}`);
  console.log(
    `gait: bare IK of the same ${FRAMES * legCount} targets: median ${ms(ik.medianMs)}; solveSequence / IK = ${(solve.medianMs / ik.medianMs).toFixed(1)}`,
  );
  console.log(`gait: generateGait (tripod, ${legCount} legs): median ${ms(generate.medianMs)}`);
  if (Number.isNaN(solve.sink + run.sink + ik.sink + generate.sink)) console.log("(unreachable)");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  await benchGait();
}
