// The solver behind POST /api/v1/solve and /api/v1/ik: parse, check the
// input fits, run the pure engine. The browser runs the same app/gait code.
import { z } from "zod";
import { columnsOf, encodeColumns, framesOf, GaitInputError, parseSequence, runSolve, type SolveOptions } from "../../gait/index";
import { angleToPulse, JOINT_NAMES, parseRobot, solveLeg, type JointAngles, type Robot } from "../../kinematics/index";
import { ServiceError, type Issue } from "../../platform/errors.server";

export const SOLVE_BODY_LIMIT_BYTES = 2 * 1024 * 1024;

/** frames: DESIGN.md's layout; columns: the compact one (app/gait/columns.ts); checks: flags and summary only (the editor's reference). */
export const SOLVE_LAYOUTS = ["frames", "columns", "checks"] as const;

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

export type IkResult = Record<
  string,
  { reachable: boolean; reason?: string; angles: JointAngles; pulses: JointAngles; violations: ReturnType<typeof solveLeg>["violations"] }
>;

export function solveFeet(body: unknown): IkResult {
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
  const result: IkResult = {};
  for (const [legId, foot] of Object.entries(parsed.data.feet)) {
    const solved = solveLeg(robot, legId, foot, parsed.data.bodyPose);
    const leg = robot.legs.find((candidate) => candidate.id === legId)!;
    const pulses = Object.fromEntries(JOINT_NAMES.map((joint) => [joint, angleToPulse(leg.joints[joint], solved.angles[joint]).us])) as JointAngles;
    result[legId] = { ...solved, pulses };
  }
  return result;
}

const utf8 = new TextEncoder();
const base64 = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("base64");

/** The answer to POST /api/v1/solve as the UTF-8 bytes of its JSON, in the layout the options ask for. */
export function solveRequest(body: unknown): Uint8Array<ArrayBuffer> {
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
  let run;
  try {
    run = runSolve(robot, sequence.sequence, options as SolveOptions);
  } catch (error) {
    if (error instanceof GaitInputError) {
      throw inputIssues(
        "The sequence does not fit this robot.",
        error.issues.map((issue) => ({ path: issue.path ? `sequence.${issue.path}` : "sequence", message: issue.message })),
      );
    }
    throw error;
  }
  const { flags, summary } = run;
  const answer =
    layout === "columns" ? encodeColumns(columnsOf(run), base64) : layout === "checks" ? { flags, summary } : { frames: framesOf(run), flags, summary };
  return utf8.encode(JSON.stringify(answer));
}
