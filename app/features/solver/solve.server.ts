// The solver behind POST /api/v1/solve and /api/v1/ik: parse, check the
// input fits and is within the limits, run the pure engine on the worker
// pool. The browser runs the same app/gait code.
import { z } from "zod";
import { parseSequence, type Sequence } from "../../gait/index";
import { parseRobot, type Robot } from "../../kinematics/index";
import { ServiceError, type Issue } from "../../platform/errors.server";
import { runCoreTask } from "../../platform/worker-pool.server";
import { SOLVE_LAYOUTS, type GaitRefusal, type IkResult, type SolveLayout, type SolveTaskResult } from "../../workers/core-tasks";
import { MAX_ANSWER_FLAGS, MAX_ANSWER_LEG_FRAMES, MAX_SOLVE_LEG_FRAMES } from "./limits";

export const SOLVE_BODY_LIMIT_BYTES = 2 * 1024 * 1024;

// The layouts and the IK answer are the worker task's (app/workers/core-tasks.ts).
export { SOLVE_LAYOUTS };
export type { IkResult };

/** Input that does not parse or does not fit: 422 with the issues, by path into the body, as the details. */
const inputIssues = (message: string, issues: Issue[]) => new ServiceError(422, "invalid", message, issues);

function robotFrom(json: unknown, path = "robot"): Robot {
  const parsed = parseRobot(json);
  if (!parsed.ok) {
    throw inputIssues(
      `The robot definition is invalid (${parsed.issues.length} problem${parsed.issues.length === 1 ? "" : "s"}).`,
      parsed.issues.map((issue) => ({ path: issue.path ? `${path}.${issue.path}` : path, message: issue.message })),
    );
  }
  return parsed.robot;
}

const vec3 = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);
const pose = z.strictObject({
  x: z.number().finite().default(0),
  y: z.number().finite().default(0),
  z: z.number().finite().default(0),
  roll: z.number().finite().default(0),
  pitch: z.number().finite().default(0),
  yaw: z.number().finite().default(0),
});

const ikBody = z.strictObject({ robot: z.unknown(), feet: z.record(z.string(), vec3), bodyPose: pose.optional() });

const solveBody = z.strictObject({
  robot: z.unknown(),
  sequence: z.unknown(),
  options: z
    .strictObject({
      marginThresholdMm: z.number().finite().min(0).max(1000).optional(),
      slipToleranceMm: z.number().finite().min(0).max(1000).optional(),
      clearanceMm: z.number().finite().min(0).max(1000).optional(),
      fps: z.number().int().min(1).max(1000).optional(),
      layout: z.enum(SOLVE_LAYOUTS).optional(),
    })
    .optional(),
});

function shapeIssues(error: z.ZodError): { path: string; message: string }[] {
  return error.issues.map((issue) => ({ path: issue.path.join(".") || "(body)", message: issue.message }));
}

export async function solveFeet(body: unknown): Promise<IkResult> {
  const parsed = ikBody.safeParse(body);
  if (!parsed.success) throw inputIssues("The body must be { robot, feet: { LEG: [x, y, z] }, bodyPose? }.", shapeIssues(parsed.error));
  const robot = robotFrom(parsed.data.robot);
  const legIds = new Set(robot.legs.map((leg) => leg.id));
  const unknown = Object.keys(parsed.data.feet).filter((id) => !legIds.has(id));
  if (unknown.length > 0) {
    throw inputIssues(
      "Some feet name legs the robot does not have.",
      unknown.map((id) => ({ path: `feet.${id}`, message: `no leg "${id}" on this robot (legs: ${[...legIds].join(", ")})` })),
    );
  }
  return runCoreTask("ik", { robot, feet: parsed.data.feet, bodyPose: parsed.data.bodyPose });
}

/** Frames × legs within the solve limit and the layout's answer limit, or 422 naming the limit (before any solving). */
function checkSolveSize(robot: Robot, sequence: Sequence, fps: number | undefined, layout: SolveLayout): void {
  const cycleFrames = Math.round((sequence.cycleMs * (fps ?? sequence.fps)) / 1000);
  const frames = sequence.loop ? cycleFrames : cycleFrames + 1;
  const legs = robot.legs.length;
  const legFrames = frames * legs;
  const size = `${frames} frames × ${legs} legs = ${legFrames} leg-frames`;
  const lowerRate = fps === undefined ? "a lower frame rate (options.fps)" : "a lower options.fps";
  if (legFrames > MAX_SOLVE_LEG_FRAMES) {
    throw new ServiceError(
      422,
      "too-many-frames",
      `The solve is too large: ${size}, and one request solves at most ${MAX_SOLVE_LEG_FRAMES} (${MAX_SOLVE_LEG_FRAMES / 6} frames of a hexapod). Ask for ${lowerRate} or a shorter cycle.`,
      { limit: MAX_SOLVE_LEG_FRAMES, legFrames, frames, legs },
    );
  }
  const limit = MAX_ANSWER_LEG_FRAMES[layout];
  if (legFrames > limit) {
    const smaller = layout === "frames" ? "the columns or checks layout" : "the checks layout";
    throw new ServiceError(
      422,
      "too-many-frames",
      `The answer is too large: ${size}, and the ${layout} layout carries at most ${limit}. Ask for ${smaller}, or ${lowerRate}.`,
      { limit, legFrames, frames, legs, layout },
    );
  }
}

function solveRefusal(refusal: Exclude<SolveTaskResult, { ok: true }>["refusal"]): ServiceError {
  if (refusal.kind === "too-many-flags") {
    return new ServiceError(
      422,
      "too-many-flags",
      `The solve raised ${refusal.flags} flags, and an answer carries at most ${refusal.limit}. Solve at a lower frame rate (options.fps) to see where they are.`,
      { limit: refusal.limit, flags: refusal.flags },
    );
  }
  return gaitRefusal(refusal);
}

const gaitRefusal = (refusal: GaitRefusal) =>
  inputIssues(
    "The sequence does not fit this robot.",
    refusal.issues.map((issue) => ({ path: issue.path ? `sequence.${issue.path}` : "sequence", message: issue.message })),
  );

/** The answer to POST /api/v1/solve as the UTF-8 bytes of its JSON, in the layout the options ask for. */
export async function solveRequest(body: unknown): Promise<Uint8Array<ArrayBuffer>> {
  const parsed = solveBody.safeParse(body);
  if (!parsed.success) throw inputIssues("The body must be { robot, sequence, options? }.", shapeIssues(parsed.error));
  const robot = robotFrom(parsed.data.robot);
  const sequence = parseSequence(parsed.data.sequence);
  if (!sequence.ok) {
    throw inputIssues(
      `The sequence is invalid (${sequence.issues.length} problem${sequence.issues.length === 1 ? "" : "s"}).`,
      sequence.issues.map((issue) => ({ path: issue.path ? `sequence.${issue.path}` : "sequence", message: issue.message })),
    );
  }
  const { layout = "frames", ...options } = parsed.data.options ?? {};
  checkSolveSize(robot, sequence.sequence, options.fps, layout);
  const solved = await runCoreTask("solve", { robot, sequence: sequence.sequence, options, layout, maxFlags: MAX_ANSWER_FLAGS });
  if (!solved.ok) throw solveRefusal(solved.refusal);
  return solved.answer;
}
