// Benchmark of the kinematics core: median time per call of the public leg
// solve, the hot-path solver and the forward solve, over ≥ 1e6 calls each, and
// a general-purpose minimiser's time per solve for comparison.
// Run: npx tsx scripts/bench/kinematics.ts
import { readFileSync } from "node:fs";
import { fileURLToPath, pathToFileURL } from "node:url";
import numeric from "numeric";
import { createLegSolver, forwardLeg, neutralStance, parseRobot, solveLeg, type BodyPose, type Robot, type Vec3 } from "../../app/kinematics";

// How long each measurement runs, and the target it is held to (DESIGN.md).
const RUN = { batches: 11, callsPerBatch: 200_000, targetCount: 4096, minimiserSolves: 200, targetNs: 250 } as const;

// Keeps the optimiser from dropping the work being timed.
let sink = 0;

function loadRobot(file: string): Robot {
  const path = fileURLToPath(new URL(`../../db/demo/robots/${file}.json`, import.meta.url));
  const parsed = parseRobot(JSON.parse(readFileSync(path, "utf8")));
  if (!parsed.ok) throw new Error(`${file}.json: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.robot;
}

// Seeded, so every run times the same targets (mulberry32).
function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Targets = { legIndex: Int32Array; legId: string[]; xyz: Float64Array; angles: Float64Array };

// Feet around the neutral stance, within a 60 mm stride and a 30 mm step, the work of a gait solve.
function makeTargets(robot: Robot): Targets {
  const random = seeded(2024);
  const stance = neutralStance(robot);
  const targets: Targets = {
    legIndex: new Int32Array(RUN.targetCount),
    legId: [],
    xyz: new Float64Array(RUN.targetCount * 3),
    angles: new Float64Array(RUN.targetCount * 3),
  };
  for (let index = 0; index < RUN.targetCount; index += 1) {
    const legIndex = index % robot.legs.length;
    const foot = stance[robot.legs[legIndex].id];
    targets.legIndex[index] = legIndex;
    targets.legId.push(robot.legs[legIndex].id);
    targets.xyz[index * 3] = foot[0] + (random() - 0.5) * 60;
    targets.xyz[index * 3 + 1] = foot[1] + (random() - 0.5) * 60;
    targets.xyz[index * 3 + 2] = foot[2] + random() * 30;
    const solution = solveLeg(robot, robot.legs[legIndex].id, [targets.xyz[index * 3], targets.xyz[index * 3 + 1], targets.xyz[index * 3 + 2]]);
    targets.angles[index * 3] = solution.angles.coxa;
    targets.angles[index * 3 + 1] = solution.angles.femur;
    targets.angles[index * 3 + 2] = solution.angles.tibia;
  }
  return targets;
}

/** Median over batches of the mean ns per call; the first batch warms up and is dropped. */
function timeBatches(run: (calls: number) => void): number {
  const means: number[] = [];
  for (let batch = 0; batch <= RUN.batches; batch += 1) {
    const start = process.hrtime.bigint();
    run(RUN.callsPerBatch);
    const elapsedNs = Number(process.hrtime.bigint() - start);
    if (batch > 0) means.push(elapsedNs / RUN.callsPerBatch);
  }
  means.sort((a, b) => a - b);
  return means[Math.floor(means.length / 2)];
}

function line(label: string, value: string): void {
  console.log(`kinematics: ${label.padEnd(44)} ${value}`);
}

export async function benchKinematics(): Promise<void> {
  const robot = loadRobot("pier-crawler");
  const targets = makeTargets(robot);
  const mask = RUN.targetCount - 1;
  const { xyz, angles, legId, legIndex } = targets;
  const pose: BodyPose = { x: 5, y: -3, z: 8, roll: 4, pitch: -6, yaw: 10 };
  const calls = `median of ${RUN.batches} batches × ${RUN.callsPerBatch} calls (${RUN.batches * RUN.callsPerBatch} calls)`;
  console.log(`kinematics: robot "${robot.name}" (${robot.legs.length} legs), ${RUN.targetCount} seeded feet around the neutral stance; ${calls}`);

  const publicNs = timeBatches((count) => {
    for (let call = 0; call < count; call += 1) {
      const index = call & mask;
      const foot: Vec3 = [xyz[index * 3], xyz[index * 3 + 1], xyz[index * 3 + 2]];
      sink += solveLeg(robot, legId[index], foot).angles.femur;
    }
  });
  line("solveLeg (public API)", `${publicNs.toFixed(1)} ns/call`);

  const posedNs = timeBatches((count) => {
    for (let call = 0; call < count; call += 1) {
      const index = call & mask;
      const foot: Vec3 = [xyz[index * 3], xyz[index * 3 + 1], xyz[index * 3 + 2]];
      sink += solveLeg(robot, legId[index], foot, pose).angles.femur;
    }
  });
  line("solveLeg with a body pose (public API)", `${posedNs.toFixed(1)} ns/call`);

  const solver = createLegSolver(robot);
  const out = new Float64Array(3);
  const hotNs = timeBatches((count) => {
    for (let call = 0; call < count; call += 1) {
      const index = call & mask;
      sink += solver.solve(legIndex[index], xyz[index * 3], xyz[index * 3 + 1], xyz[index * 3 + 2], out, 0) + out[1];
    }
  });
  line("createLegSolver().solve (hot path)", `${hotNs.toFixed(1)} ns/call`);

  solver.setBodyPose(pose);
  const hotPosedNs = timeBatches((count) => {
    for (let call = 0; call < count; call += 1) {
      const index = call & mask;
      sink += solver.solve(legIndex[index], xyz[index * 3], xyz[index * 3 + 1], xyz[index * 3 + 2], out, 0) + out[1];
    }
  });
  solver.setBodyPose(undefined);
  line("createLegSolver().solve with a body pose", `${hotPosedNs.toFixed(1)} ns/call`);

  const forwardNs = timeBatches((count) => {
    for (let call = 0; call < count; call += 1) {
      const index = call & mask;
      sink += forwardLeg(robot, legId[index], { coxa: angles[index * 3], femur: angles[index * 3 + 1], tibia: angles[index * 3 + 2] })[2];
    }
  });
  line("forwardLeg (public API)", `${forwardNs.toFixed(1)} ns/call`);

  const hotForwardNs = timeBatches((count) => {
    for (let call = 0; call < count; call += 1) {
      const index = call & mask;
      solver.forward(legIndex[index], angles[index * 3], angles[index * 3 + 1], angles[index * 3 + 2], out, 0);
      sink += out[2];
    }
  });
  line("createLegSolver().forward (hot path)", `${hotForwardNs.toFixed(1)} ns/call`);

  // The minimiser on the same kind of targets: squared foot distance over the servo angles,
  // from a neutral posture, with numeric's own finite-difference gradient.
  const minimiserNs: number[] = [];
  let worstMm = 0;
  for (let solve = 0; solve < RUN.minimiserSolves; solve += 1) {
    const index = (solve * 7) & mask;
    const target = [xyz[index * 3], xyz[index * 3 + 1], xyz[index * 3 + 2]];
    const id = legId[index];
    const objective = (x: number[]): number => {
      const foot = forwardLeg(robot, id, { coxa: x[0], femur: x[1], tibia: x[2] });
      return (foot[0] - target[0]) ** 2 + (foot[1] - target[1]) ** 2 + (foot[2] - target[2]) ** 2;
    };
    const start = process.hrtime.bigint();
    const result = numeric.uncmin(objective, [0, 0, 0], 1e-10, undefined, 1000);
    minimiserNs.push(Number(process.hrtime.bigint() - start));
    worstMm = Math.max(worstMm, Math.sqrt(result.f));
  }
  minimiserNs.sort((a, b) => a - b);
  const minimiserMedianNs = minimiserNs[Math.floor(minimiserNs.length / 2)];
  line(
    "numeric.uncmin per solve (reference minimiser)",
    `${(minimiserMedianNs / 1000).toFixed(1)} µs/solve, median of ${RUN.minimiserSolves} (worst foot error ${worstMm.toExponential(1)} mm)`,
  );
  line("numeric.uncmin ÷ solveLeg", `${Math.round(minimiserMedianNs / publicNs)}×`);
  line(`target ≤ ${RUN.targetNs} ns per solve`, publicNs <= RUN.targetNs && hotNs <= RUN.targetNs ? "met" : "NOT met");
  if (sink === 0.123456789) console.log("");
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await benchKinematics();
}
