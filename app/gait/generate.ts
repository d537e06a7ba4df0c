// generateGait (DESIGN.md, "Core module contracts"): a template and a few
// numbers in, a sequence of keys out. The keys are the source of truth; the
// parameters are kept in `generator` only to regenerate.
import { z } from "zod";
import { neutralStance, type Robot } from "../kinematics/index";
import { placeStanceFoot } from "./interpolate/stance";
import { createTravel } from "./interpolate/travel";
import { formatSequenceIssues } from "./issues";
import {
  CSS_EASE,
  DEFAULT_STEP_HEIGHT_MM,
  GaitInputError,
  SEQUENCE_FORMAT,
  bodyHeightMmSchema,
  bodyKeySchema,
  cycleMsSchema,
  directionDegSchema,
  easeSchema,
  fpsSchema,
  parseSequence,
  stepHeightMmSchema,
  strideMmSchema,
  turnDegPerCycleSchema,
  type LegKey,
  type Sequence,
  type SequenceIssue,
} from "./sequence";
import { TEMPLATES, TEMPLATE_NAMES, legLayout } from "./templates/index";
import { cycleFraction } from "./templates/template";

/** Defaults of the parameters that no template sets. */
export const GAIT_DEFAULTS = {
  cycleMs: 1200,
  fps: 50,
  strideMm: 40,
  directionDeg: 0,
  turnDegPerCycle: 0,
  stepHeightMm: DEFAULT_STEP_HEIGHT_MM,
} as const;

/** One flat object of the generator fields plus cycleMs and fps (and body keys, a name, the swing curve). */
export const gaitParamsSchema = z.strictObject({
  template: z.enum(TEMPLATE_NAMES),
  name: z.string().max(200).optional(),
  cycleMs: cycleMsSchema.default(GAIT_DEFAULTS.cycleMs),
  fps: fpsSchema.default(GAIT_DEFAULTS.fps),
  dutyFactor: z.number().gt(0).lt(1).optional().describe("Default: the template's."),
  phase: z.record(z.string(), z.number().min(0).max(1)).optional().describe("Lift-off times; default: the template's table."),
  strideMm: strideMmSchema.default(GAIT_DEFAULTS.strideMm),
  directionDeg: directionDegSchema.default(GAIT_DEFAULTS.directionDeg),
  turnDegPerCycle: turnDegPerCycleSchema.default(GAIT_DEFAULTS.turnDegPerCycle),
  stepHeightMm: stepHeightMmSchema.default(GAIT_DEFAULTS.stepHeightMm),
  bodyHeightMm: bodyHeightMmSchema.optional().describe("Default: the robot's standHeight."),
  swingEase: easeSchema.optional().describe("Curve of every swing's horizontal progress; default CSS ease."),
  bodyKeys: z
    .array(bodyKeySchema)
    .max(1000)
    .optional()
    .describe("Body pose keys (crouch: z, lean: roll/pitch, shift: x/y), copied into the sequence's body track."),
});

export type GaitParams = z.input<typeof gaitParamsSchema>;

function fail(message: string, issues: SequenceIssue[]): never {
  throw new GaitInputError(message, issues);
}

/**
 * A gait sequence (format gaitloom.sequence/1) for the robot from a template:
 * per leg a lift-off key (contact "swing") at its phase and a touch-down key
 * (contact "stance") a swing time later; feet at the neutral stance, ahead by
 * half the body's travel during the stance at touch-down and behind by as much
 * at lift-off, on arcs when turning. That is DESIGN.md's "shifted by half a
 * stride" for the stride a foot makes against the body, β · strideMm (Song and
 * Waldron's stroke): strideMm is the body's travel per cycle, and a foot fixed
 * in the world for the stance can only sweep what the body travels meanwhile.
 * Throws GaitInputError for parameters that do not fit the robot.
 */
export function generateGait(robot: Robot, params: GaitParams): Sequence {
  const parsed = gaitParamsSchema.safeParse(params, { reportInput: true });
  if (!parsed.success) fail("gait parameters are not valid", formatSequenceIssues(parsed.error.issues));
  const p = parsed.data;
  const template = TEMPLATES[p.template];
  const layout = legLayout(robot);
  const refusal = template.unsuitable(layout);
  if (refusal) fail(`template ${p.template} does not suit robot "${robot.name}"`, [{ path: "template", message: refusal }]);

  const dutyFactor = p.dutyFactor ?? template.defaultDutyFactor(layout);
  if (dutyFactor === null) fail(`template ${p.template} needs a duty factor`, [{ path: "dutyFactor", message: "is required for a custom gait" }]);
  const phase = { ...template.phase(layout, dutyFactor), ...p.phase };
  const issues: SequenceIssue[] = [];
  for (const legId of layout.legIds) if (phase[legId] === undefined) issues.push({ path: `phase.${legId}`, message: "is required for a custom gait" });
  for (const legId of Object.keys(phase))
    if (!layout.legIds.includes(legId)) issues.push({ path: `phase.${legId}`, message: `names no leg of robot "${robot.name}"` });
  if (issues.length) fail(`template ${p.template} needs a phase for every leg`, issues);

  const bodyHeightMm = p.bodyHeightMm ?? robot.standHeight;
  const travel = createTravel(p.strideMm, p.directionDeg, p.turnDegPerCycle, bodyHeightMm);
  const neutral = neutralStance(robot, bodyHeightMm);
  const swingEase = p.swingEase ?? CSS_EASE;
  const legs: Record<string, { keys: LegKey[] }> = {};
  for (const legId of layout.legIds) {
    const liftOff = cycleFraction(phase[legId]);
    const touchDown = cycleFraction(liftOff + 1 - dutyFactor);
    const liftOffKey: LegKey = {
      t: liftOff,
      contact: "swing",
      foot: placeStanceFoot(travel, neutral[legId], dutyFactor, "lift-off"),
      ease: [...swingEase],
      apexMm: p.stepHeightMm,
    };
    const touchDownKey: LegKey = { t: touchDown, contact: "stance", foot: placeStanceFoot(travel, neutral[legId], dutyFactor, "touch-down") };
    legs[legId] = { keys: liftOff < touchDown ? [liftOffKey, touchDownKey] : [touchDownKey, liftOffKey] };
  }

  const sequence = {
    format: SEQUENCE_FORMAT,
    ...(p.name ? { name: p.name } : {}),
    cycleMs: p.cycleMs,
    fps: p.fps,
    loop: true,
    generator: {
      template: p.template,
      dutyFactor,
      phase: Object.fromEntries(layout.legIds.map((legId) => [legId, cycleFraction(phase[legId])])),
      strideMm: p.strideMm,
      directionDeg: p.directionDeg,
      turnDegPerCycle: p.turnDegPerCycle,
      stepHeightMm: p.stepHeightMm,
      bodyHeightMm,
    },
    legs,
    body: { keys: (p.bodyKeys ?? []).map((key) => ({ ...key, pose: { ...key.pose } })) },
  };
  // The result goes through the same validation as any sequence: a template can not write what a user could not.
  const checked = parseSequence(sequence);
  if (!checked.ok) fail("the generated sequence is not valid", checked.issues);
  return checked.sequence;
}
