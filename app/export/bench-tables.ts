// Bench test tables for bring-up, played with the robot on a stand and its
// legs free (DESIGN.md, "Safety"): every servo at its centre, and a slow sweep
// of one joint through its range. Both are solved results (stand-frames.ts),
// so angleTable formats them like any gait — with the calibration applied —
// and both are checked with the gait engine's joint-limit, joint-speed and
// pulse-range checks: a sweep that would be too fast carries joint-speed flags.
import { MAX_FRAMES, type SolvedSequence } from "../gait/index";
import { JOINT_NAMES, findLeg, neutralStance, solveLeg, type JointName, type Robot } from "../kinematics/index";
import { TableExportError } from "./errors";
import { solveStandFrames } from "./stand-frames";

/** A bench table: a solved result, its name (for meta.gaitName) and how it plays. */
export type BenchTable = SolvedSequence & { name: string; loop: boolean };

export type CentreTableOptions = {
  /** How long the pose is held, seconds (default 2). */
  seconds?: number;
  /** Frames per second (default 50). */
  fps?: number;
};

export type SweepTableOptions = {
  legId: string;
  joint: JointName;
  /** Frames per second (default 50). */
  fps?: number;
  /** The sweep's speed as a fraction of the joint's maxSpeedDegS (default 0.25); above 1 is flagged joint-speed. */
  speedFraction?: number;
  /** Pause at the minimum and at the maximum, ms (default 500), to look at the end stops. */
  dwellMs?: number;
  /** Stay this far inside minDeg..maxDeg, degrees (default 0). */
  marginDeg?: number;
  /** What the other joints hold: the neutral stance's angles (default) or 0 servo degrees. */
  hold?: "stance" | "centre";
};

const DEFAULT_FPS = 50;
// Stepping a hair below the speed asked keeps round-off from putting a step a ulp above it.
const SPEED_SAFETY = 1 - 1e-9;

function invalid(path: string, message: string): never {
  throw new TableExportError("invalid-options", "the bench table options are not valid", [{ path, message }]);
}

function checkRate(fps: number): void {
  if (!(Number.isFinite(fps) && fps > 0 && fps <= 1000)) invalid("fps", `must lie in (0, 1000] (got ${fps})`);
}

function checkFrameCount(frames: number): void {
  if (frames > MAX_FRAMES) invalid("fps", `gives ${frames} frames, at most ${MAX_FRAMES} allowed`);
}

/**
 * Every servo at 0 servo degrees — its centre pulse, centerUs, before a
 * calibration's trim — for `seconds`. A joint whose limits exclude 0 is flagged
 * joint-limit.
 */
export function centreTable(robot: Robot, options: CentreTableOptions = {}): BenchTable {
  const seconds = options.seconds ?? 2;
  const fps = options.fps ?? DEFAULT_FPS;
  checkRate(fps);
  if (!(Number.isFinite(seconds) && seconds > 0)) invalid("seconds", `must be positive (got ${seconds})`);
  const frames = Math.max(1, Math.round(seconds * fps));
  checkFrameCount(frames);
  const solved = solveStandFrames(robot, new Float64Array(frames * robot.legs.length * 3), fps);
  return { ...solved, name: "centre", loop: false };
}

/** The servo angles the robot holds while one joint sweeps. */
function holdAngles(robot: Robot, hold: "stance" | "centre"): Float64Array {
  const angles = new Float64Array(robot.legs.length * 3);
  if (hold === "centre") return angles;
  const feet = neutralStance(robot);
  robot.legs.forEach((leg, index) => {
    const solution = solveLeg(robot, leg.id, feet[leg.id]);
    JOINT_NAMES.forEach((name, j) => (angles[index * 3 + j] = solution.angles[name]));
  });
  return angles;
}

/**
 * A slow sweep of one joint: from its centre (0 servo degrees, kept inside its
 * limits) to its minimum, a pause, to its maximum, a pause, and back to the
 * centre, at no more than speedFraction · maxSpeedDegS: each stretch takes
 * ⌈distance · fps / speed⌉ frames (one more where that is a whole number to
 * within 1e-9, so that round-off never puts a step above the speed). The other
 * joints hold the neutral stance (or 0°). Plays once.
 */
export function sweepTable(robot: Robot, options: SweepTableOptions): BenchTable {
  const fps = options.fps ?? DEFAULT_FPS;
  const speedFraction = options.speedFraction ?? 0.25;
  const dwellMs = options.dwellMs ?? 500;
  const marginDeg = options.marginDeg ?? 0;
  checkRate(fps);
  if (!robot.legs.some((leg) => leg.id === options.legId)) {
    invalid("legId", `names no leg of robot "${robot.name}" (legs: ${robot.legs.map((leg) => leg.id).join(", ")})`);
  }
  if (!JOINT_NAMES.includes(options.joint)) invalid("joint", `must be one of ${JOINT_NAMES.join(", ")} (got ${JSON.stringify(options.joint)})`);
  if (!(Number.isFinite(speedFraction) && speedFraction > 0 && speedFraction <= 10)) invalid("speedFraction", `must lie in (0, 10] (got ${speedFraction})`);
  if (!(Number.isFinite(dwellMs) && dwellMs >= 0)) invalid("dwellMs", `must be 0 or more (got ${dwellMs})`);
  const leg = findLeg(robot, options.legId);
  const joint = leg.joints[options.joint];
  const low = joint.minDeg + marginDeg;
  const high = joint.maxDeg - marginDeg;
  if (!(Number.isFinite(marginDeg) && marginDeg >= 0 && low < high)) {
    invalid("marginDeg", `must be 0 or more and leave some range of ${joint.minDeg}..${joint.maxDeg}° (got ${marginDeg})`);
  }
  const centre = Math.min(high, Math.max(low, 0));
  const speedDegS = speedFraction * joint.maxSpeedDegS * SPEED_SAFETY;
  const stepsOf = (distanceDeg: number): number => Math.ceil((distanceDeg * fps) / speedDegS);
  const dwellFrames = Math.round((dwellMs * fps) / 1000);
  // Positions of the swept joint, frame by frame.
  const path: number[] = [centre];
  const moveTo = (target: number): void => {
    const from = path[path.length - 1];
    const steps = stepsOf(Math.abs(target - from));
    for (let step = 1; step <= steps; step += 1) path.push(step === steps ? target : from + ((target - from) * step) / steps);
  };
  const dwell = (): void => {
    for (let i = 0; i < dwellFrames; i += 1) path.push(path[path.length - 1]);
  };
  moveTo(low);
  dwell();
  moveTo(high);
  dwell();
  moveTo(centre);
  checkFrameCount(path.length);

  const pose = holdAngles(robot, options.hold ?? "stance");
  const perFrame = robot.legs.length * 3;
  const swept = robot.legs.indexOf(leg) * 3 + JOINT_NAMES.indexOf(options.joint);
  const angles = new Float64Array(path.length * perFrame);
  path.forEach((value, frame) => {
    angles.set(pose, frame * perFrame);
    angles[frame * perFrame + swept] = value;
  });
  const solved = solveStandFrames(robot, angles, fps);
  return { ...solved, name: `sweep-${leg.id}-${options.joint}`, loop: false };
}
