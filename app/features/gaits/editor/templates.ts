// Which gait templates suit a robot, with their default duty factors, for the
// template pickers of the new-gait page and the editor's generator form.
import { GAIT_DEFAULTS, TEMPLATES, TEMPLATE_NAMES, legLayout, type GaitParams, type TemplateName } from "../../../gait/index";
import type { Robot } from "../../../kinematics/index";

export type TemplateChoice = {
  name: TemplateName;
  label: string;
  /** Default duty factor for this robot; null for custom (the parameters give it). */
  dutyFactor: number | null;
  dynamic: boolean;
};

/** Plain words for each trade name, shown beside it. */
const LABELS: Record<TemplateName, string> = {
  tripod: "Tripod — two sets of three legs",
  tetrapod: "Tetrapod — four legs down",
  ripple: "Ripple — overlapping waves",
  wave: "Wave — one leg at a time",
  trot: "Trot — diagonal pairs (dynamic)",
  "alternating-tetrapod": "Alternating tetrapod — two sets of four",
  custom: "Custom — your own phases",
};

/** The templates whose leg count and sides fit the robot, in the engine's order; custom is left out (it needs a phase per leg). */
export function suitableTemplates(robot: Robot): TemplateChoice[] {
  const layout = legLayout(robot);
  return TEMPLATE_NAMES.filter((name) => name !== "custom" && TEMPLATES[name].unsuitable(layout) === null).map((name) => ({
    name,
    label: LABELS[name],
    dutyFactor: TEMPLATES[name].defaultDutyFactor(layout),
    dynamic: TEMPLATES[name].dynamic,
  }));
}

export const templateLabel = (name: TemplateName) => LABELS[name];

/** The generator fields of a sequence as the flat parameters generateGait takes (plus cycleMs and fps). */
export function paramsOfSequence(sequence: {
  cycleMs: number;
  fps: number;
  name?: string;
  generator: {
    template?: TemplateName;
    dutyFactor?: number;
    phase?: Record<string, number>;
    strideMm: number;
    directionDeg: number;
    turnDegPerCycle: number;
    stepHeightMm: number;
    bodyHeightMm?: number;
  };
}): GaitParams | null {
  const g = sequence.generator;
  if (!g.template) return null;
  return {
    template: g.template,
    cycleMs: sequence.cycleMs,
    fps: sequence.fps,
    dutyFactor: g.dutyFactor,
    phase: g.template === "custom" ? g.phase : undefined,
    strideMm: g.strideMm,
    directionDeg: g.directionDeg,
    turnDegPerCycle: g.turnDegPerCycle,
    stepHeightMm: g.stepHeightMm,
    bodyHeightMm: g.bodyHeightMm,
  };
}

export const DEFAULT_PARAMS = GAIT_DEFAULTS;
