// The gait sequence, format "gaitloom.sequence/1" (DESIGN.md, "Gait sequence").
// One zod schema is the source of truth: parseSequence validates with it and
// sequenceJsonSchema publishes it. Field names are fixed by DESIGN.md; the
// additions (name, description, body key `resting`) are documented below.
import { z } from "zod";
import {
  BODY_HEIGHT_MM,
  BODY_OFFSET_MM,
  CYCLE_MS,
  EASE_Y,
  FOOT_MM,
  FRAME_RATE_FPS,
  FULL_TURN_DEG,
  HALF_TURN_DEG,
  STEP_HEIGHT_MM,
  STRIDE_MM,
  rangeText,
  type Bound,
  type Robot,
} from "../kinematics/index";
import { formatSequenceIssues, type SequenceIssue } from "./issues";
import { TEMPLATE_NAMES } from "./templates/names";

export const SEQUENCE_FORMAT = "gaitloom.sequence/1";

/** CSS `ease`, cubic-bezier(0.25, 0.1, 0.25, 1) (W3C CSS Easing Functions Level 1): the default of a key's `ease`. */
export const CSS_EASE: Ease = [0.25, 0.1, 0.25, 1];
/** CSS `ease-in-out`, cubic-bezier(0.42, 0, 0.58, 1): zero speed at both ends. */
export const CSS_EASE_IN_OUT: Ease = [0.42, 0, 0.58, 1];
/** Step height when neither a key nor the generator gives one, mm. */
export const DEFAULT_STEP_HEIGHT_MM = 25;
/** Limits that keep a solve bounded (a request can not ask for millions of frames). */
export const MAX_FRAMES = 100_000;
export const MAX_CYCLE_MS = CYCLE_MS.max;
export const MAX_FPS = FRAME_RATE_FPS.max;

// Every number of the format lies in a physical range (kinematics/bounds.ts); zod numbers are finite already.
const within = (bound: Bound) => z.number().min(bound.min).max(bound.max);
const fraction = z.number().min(0).max(1);
const easeY = within(EASE_Y);
const footMm = within(FOOT_MM);
const offsetMm = within(BODY_OFFSET_MM);
const offsetDeg = within(HALF_TURN_DEG);

// x1 and x2 of a CSS cubic-bezier must lie in [0, 1] so that the curve is a function of time.
export const easeSchema = z
  .tuple([fraction, easeY, fraction, easeY])
  .describe(`Cubic-Bézier easing [x1, y1, x2, y2] as in CSS cubic-bezier(); x1 and x2 in [0, 1], y1 and y2 within ${EASE_Y.min}..${EASE_Y.max}.`);

const vec3Schema = z.tuple([footMm, footMm, footMm]);

/** The generator's numbers with their ranges and units, shared with generateGait's flat parameters. */
export const cycleMsSchema = within(CYCLE_MS).describe(`Duration of the cycle (or of the one-shot move), ${rangeText("ms", CYCLE_MS)}.`);
export const fpsSchema = within(FRAME_RATE_FPS).describe(`Frame rate, ${rangeText("frames per second", FRAME_RATE_FPS)}.`);
export const strideMmSchema = within(STRIDE_MM);
export const directionDegSchema = within(FULL_TURN_DEG);
export const turnDegPerCycleSchema = within(FULL_TURN_DEG);
export const stepHeightMmSchema = within(STEP_HEIGHT_MM);
export const bodyHeightMmSchema = within(BODY_HEIGHT_MM);

export const contactSchema = z.enum(["stance", "swing"]);

const legKeySchema = z.strictObject({
  t: fraction.describe("Time as a fraction of the cycle."),
  contact: contactSchema.describe("Holds from this key until the next key of the track (half-open)."),
  foot: vec3Schema
    .optional()
    .describe(`Foot in the neutral body frame at the key's time, [x, y, z], each ${rangeText("mm", FOOT_MM)}; omitted: the generator's placement.`),
  ease: easeSchema.optional().describe("Shapes the segment that leaves the key; default CSS ease."),
  apexMm: stepHeightMmSchema.optional().describe(`Swing height above the straight path, ${rangeText("mm", STEP_HEIGHT_MM)}; default stepHeightMm.`),
});

const legTrackSchema = z.strictObject({ keys: z.array(legKeySchema).min(1).max(10_000) });

const poseSchema = z
  .strictObject({
    x: offsetMm.default(0),
    y: offsetMm.default(0),
    z: offsetMm.default(0),
    roll: offsetDeg.default(0),
    pitch: offsetDeg.default(0),
    yaw: offsetDeg.default(0),
  })
  .describe(
    `Pose offset: translation in the heading frame, each ${rangeText("mm", BODY_OFFSET_MM)}, then roll, pitch, yaw, each ${rangeText("°", HALF_TURN_DEG)}; R = Rz·Ry·Rx.`,
  );

export const bodyKeySchema = z.strictObject({
  t: fraction,
  pose: poseSchema,
  ease: easeSchema.optional().describe("Shapes the segment that leaves the key; default CSS ease."),
  resting: z
    .boolean()
    .optional()
    .describe(
      "The body lies on the ground from this key until the next body key (half-open), so its weight is not on the feet: support checks skip those frames. Entry and exit moves use it.",
    ),
});

const generatorSchema = z.strictObject({
  template: z.enum(TEMPLATE_NAMES).optional(),
  dutyFactor: z.number().gt(0).lt(1).optional().describe("Fraction of the cycle a foot is on the ground."),
  phase: z.record(z.string(), fraction).optional().describe("Lift-off time of each leg, fraction of the cycle."),
  strideMm: strideMmSchema.default(0).describe(`Distance the body travels in one cycle, ${rangeText("mm", STRIDE_MM)}.`),
  directionDeg: directionDegSchema.default(0).describe(`Direction of travel in the body frame (0 forward, 90 left), ${rangeText("°", FULL_TURN_DEG)}.`),
  turnDegPerCycle: turnDegPerCycleSchema.default(0).describe(`Turn of the body about its centre over one cycle, ${rangeText("°", FULL_TURN_DEG)}.`),
  stepHeightMm: stepHeightMmSchema.default(DEFAULT_STEP_HEIGHT_MM).describe(`Default swing apex, ${rangeText("mm", STEP_HEIGHT_MM)}.`),
  bodyHeightMm: bodyHeightMmSchema
    .optional()
    .describe(`Height of the body origin above the ground, ${rangeText("mm", BODY_HEIGHT_MM)}; default the robot's standHeight.`),
});

const sequenceObjectSchema = z.strictObject({
  format: z.literal(SEQUENCE_FORMAT),
  name: z.string().max(200).optional(),
  description: z.string().max(2000).optional(),
  cycleMs: cycleMsSchema,
  fps: fpsSchema,
  loop: z.boolean().describe("True for a gait cycle; false for a one-shot move (frames 0..N, t = 1 at the end)."),
  generator: generatorSchema.default({ strideMm: 0, directionDeg: 0, turnDegPerCycle: 0, stepHeightMm: DEFAULT_STEP_HEIGHT_MM }),
  legs: z.record(z.string(), legTrackSchema),
  body: z.strictObject({ keys: z.array(bodyKeySchema).max(10_000) }).default({ keys: [] }),
});

// Keys strictly in time order within a track; a loop's keys lie in [0, 1) since t = 1 is the next cycle's t = 0.
function checkKeyTimes(keys: readonly { t: number }[], loop: boolean, path: (string | number)[], ctx: z.RefinementCtx): void {
  keys.forEach((key, index) => {
    if (loop && key.t >= 1) {
      ctx.addIssue({
        code: "custom",
        path: [...path, index, "t"],
        message: `must be below 1 in a loop, where t = 1 is t = 0 of the next cycle (got ${key.t})`,
      });
    }
    if (index > 0 && key.t <= keys[index - 1].t) {
      ctx.addIssue({
        code: "custom",
        path: [...path, index, "t"],
        message: `must come after keys[${index - 1}].t (got ${key.t} ≤ ${keys[index - 1].t})`,
      });
    }
  });
}

export const sequenceSchema = sequenceObjectSchema
  .superRefine((sequence, ctx) => {
    const frames = frameCount(sequence);
    if (frames < 1) {
      ctx.addIssue({ code: "custom", path: ["fps"], message: `gives no frame: cycleMs · fps / 1000 rounds to ${frames}, at least 1 needed` });
    } else if (frames > MAX_FRAMES) {
      ctx.addIssue({ code: "custom", path: ["fps"], message: `gives ${frames} frames (cycleMs · fps / 1000), at most ${MAX_FRAMES}` });
    }
    for (const [legId, track] of Object.entries(sequence.legs)) checkKeyTimes(track.keys, sequence.loop, ["legs", legId, "keys"], ctx);
    checkKeyTimes(sequence.body.keys, sequence.loop, ["body", "keys"], ctx);
    if (Object.keys(sequence.legs).length === 0) ctx.addIssue({ code: "custom", path: ["legs"], message: "must give at least one leg" });
  })
  .meta({
    id: "gaitloom.sequence/1",
    title: "Gaitloom gait sequence",
    description:
      "Key poses of every leg and of the body over one cycle (or one move): t is a fraction of the cycle, millimetres and degrees, x forward, y left, z up.",
  });

export type Sequence = z.output<typeof sequenceSchema>;
/** What a writer may leave out (defaults filled in by parseSequence). */
export type SequenceInput = z.input<typeof sequenceSchema>;
export type Contact = z.output<typeof contactSchema>;
export type LegKey = Sequence["legs"][string]["keys"][number];
export type BodyKey = Sequence["body"]["keys"][number];
export type BodyOffset = BodyKey["pose"];
export type Generator = Sequence["generator"];
export type Ease = [number, number, number, number];

export type { SequenceIssue };
export type ParseSequenceResult = { ok: true; sequence: Sequence } | { ok: false; issues: SequenceIssue[] };

/** Validates an untrusted sequence (already JSON-decoded); paths like `legs.LF.keys[2].t`. */
export function parseSequence(json: unknown): ParseSequenceResult {
  const result = sequenceSchema.safeParse(json, { reportInput: true });
  if (result.success) return { ok: true, sequence: result.data };
  return { ok: false, issues: formatSequenceIssues(result.error.issues) };
}

/** The JSON Schema of the sequence, generated from the zod schema (draft 2020-12). */
export function sequenceJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(sequenceSchema, { io: "input", target: "draft-2020-12" }) as Record<string, unknown>;
}

/** N = round(cycleMs · fps / 1000) (DESIGN.md): a loop has frames 0..N−1, a one-shot move 0..N. */
export function frameCount(sequence: Pick<Sequence, "cycleMs" | "fps">): number {
  return Math.round((sequence.cycleMs * sequence.fps) / 1000);
}

/** Problems of a valid sequence against a robot: every robot leg needs a track, and no track may name another leg. */
export function sequenceIssuesForRobot(robot: Robot, sequence: Sequence): SequenceIssue[] {
  const issues: SequenceIssue[] = [];
  const robotLegs = new Set(robot.legs.map((leg) => leg.id));
  for (const leg of robot.legs) {
    if (!sequence.legs[leg.id]) issues.push({ path: `legs.${leg.id}`, message: `is missing: robot "${robot.name}" has a leg ${leg.id}` });
  }
  for (const legId of Object.keys(sequence.legs)) {
    if (!robotLegs.has(legId)) {
      issues.push({ path: `legs.${legId}`, message: `names no leg of robot "${robot.name}" (legs: ${[...robotLegs].join(", ")})` });
    }
  }
  if (sequence.generator.phase) {
    for (const legId of Object.keys(sequence.generator.phase)) {
      if (!robotLegs.has(legId)) issues.push({ path: `generator.phase.${legId}`, message: `names no leg of robot "${robot.name}"` });
    }
  }
  return issues;
}

/**
 * Numbers of a sequence outside the format's ranges — what parseSequence
 * refuses, but a sequence built or changed in code may hold (a NaN foot, an
 * infinite offset) — as issues with paths, at most `limit`. The solve checks
 * with it, so that such a sequence is refused rather than solved into NaN.
 * Plain comparisons; a path is only written for what is found.
 */
export function sequenceRangeIssues(sequence: Sequence, limit = 10): SequenceIssue[] {
  const issues: SequenceIssue[] = [];
  const note = (path: string, value: unknown, bound: Bound) => {
    if (issues.length < limit) issues.push({ path, message: `must be a number from ${bound.min} to ${bound.max} (got ${String(value)})` });
  };
  if (outside(sequence.cycleMs, CYCLE_MS)) note("cycleMs", sequence.cycleMs, CYCLE_MS);
  if (outside(sequence.fps, FRAME_RATE_FPS)) note("fps", sequence.fps, FRAME_RATE_FPS);
  const generator = sequence.generator;
  if (generator.dutyFactor !== undefined && outside(generator.dutyFactor, UNIT_INTERVAL)) note("generator.dutyFactor", generator.dutyFactor, UNIT_INTERVAL);
  for (const [legId, phase] of Object.entries(generator.phase ?? {})) if (outside(phase, UNIT_INTERVAL)) note(`generator.phase.${legId}`, phase, UNIT_INTERVAL);
  if (outside(generator.strideMm, STRIDE_MM)) note("generator.strideMm", generator.strideMm, STRIDE_MM);
  if (outside(generator.directionDeg, FULL_TURN_DEG)) note("generator.directionDeg", generator.directionDeg, FULL_TURN_DEG);
  if (outside(generator.turnDegPerCycle, FULL_TURN_DEG)) note("generator.turnDegPerCycle", generator.turnDegPerCycle, FULL_TURN_DEG);
  if (outside(generator.stepHeightMm, STEP_HEIGHT_MM)) note("generator.stepHeightMm", generator.stepHeightMm, STEP_HEIGHT_MM);
  if (generator.bodyHeightMm !== undefined && outside(generator.bodyHeightMm, BODY_HEIGHT_MM)) {
    note("generator.bodyHeightMm", generator.bodyHeightMm, BODY_HEIGHT_MM);
  }
  for (const [legId, track] of Object.entries(sequence.legs)) {
    track.keys.forEach((key, index) => {
      if (outside(key.t, UNIT_INTERVAL)) note(`legs.${legId}.keys[${index}].t`, key.t, UNIT_INTERVAL);
      for (let axis = 0; key.foot && axis < 3; axis += 1) {
        if (outside(key.foot[axis], FOOT_MM)) note(`legs.${legId}.keys[${index}].foot[${axis}]`, key.foot[axis], FOOT_MM);
      }
      for (let i = 0; key.ease && i < 4; i += 1) {
        const bound = i % 2 === 0 ? UNIT_INTERVAL : EASE_Y;
        if (outside(key.ease[i], bound)) note(`legs.${legId}.keys[${index}].ease[${i}]`, key.ease[i], bound);
      }
      if (key.apexMm !== undefined && outside(key.apexMm, STEP_HEIGHT_MM)) note(`legs.${legId}.keys[${index}].apexMm`, key.apexMm, STEP_HEIGHT_MM);
    });
  }
  sequence.body.keys.forEach((key, index) => {
    if (outside(key.t, UNIT_INTERVAL)) note(`body.keys[${index}].t`, key.t, UNIT_INTERVAL);
    for (const field of POSE_FIELDS) {
      const bound = field === "x" || field === "y" || field === "z" ? BODY_OFFSET_MM : HALF_TURN_DEG;
      if (outside(key.pose[field], bound)) note(`body.keys[${index}].pose.${field}`, key.pose[field], bound);
    }
    for (let i = 0; key.ease && i < 4; i += 1) {
      const bound = i % 2 === 0 ? UNIT_INTERVAL : EASE_Y;
      if (outside(key.ease[i], bound)) note(`body.keys[${index}].ease[${i}]`, key.ease[i], bound);
    }
  });
  return issues;
}

const UNIT_INTERVAL: Bound = { min: 0, max: 1 };
const POSE_FIELDS = ["x", "y", "z", "roll", "pitch", "yaw"] as const;

// NaN and a missing number fail both comparisons, so they are outside every range.
function outside(value: number | undefined, bound: Bound): boolean {
  return !(value !== undefined && value >= bound.min && value <= bound.max);
}

/** Thrown by the engine for a sequence or parameters that do not fit the robot; carries the issues. */
export class GaitInputError extends Error {
  readonly issues: SequenceIssue[];
  constructor(message: string, issues: SequenceIssue[]) {
    super(`${message}: ${issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join("; ")}`);
    this.name = "GaitInputError";
    this.issues = issues;
  }
}
