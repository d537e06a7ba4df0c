// Public surface of the gait engine: the sequence format, templates,
// generators, the solve and its result types. Re-exports only.
export {
  CSS_EASE,
  CSS_EASE_IN_OUT,
  DEFAULT_STEP_HEIGHT_MM,
  GaitInputError,
  MAX_CYCLE_MS,
  MAX_FPS,
  MAX_FRAMES,
  SEQUENCE_FORMAT,
  frameCount,
  parseSequence,
  sequenceIssuesForRobot,
  sequenceJsonSchema,
  sequenceSchema,
  type BodyKey,
  type BodyOffset,
  type Contact,
  type Ease,
  type Generator,
  type LegKey,
  type ParseSequenceResult,
  type Sequence,
  type SequenceInput,
  type SequenceIssue,
} from "./sequence";
export { GAIT_DEFAULTS, gaitParamsSchema, generateGait, type GaitParams } from "./generate";
export { MOVE_DEFAULTS, generateEntryMove, generateExitMove, type MoveOptions } from "./moves";
export { TEMPLATES, TEMPLATE_NAMES, legLayout, type GaitTemplate, type LegLayout, type TemplateName } from "./templates/index";
export { SOLVE_DEFAULTS, framesOf, runSolve, solveSequence, type SolveRun, type WorldTrack } from "./solve";
export { checkAngleFrames } from "./angle-frames";
export {
  FLAG_KINDS,
  type Flag,
  type FlagKind,
  type Severity,
  type SolveOptions,
  type SolveSummary,
  type SolvedFrame,
  type SolvedLeg,
  type SolvedSequence,
} from "./solved";
export { CHECKS, type Check, type CheckContext } from "./checks/index";
export { bodyOffsetAt } from "./interpolate/body";
export { COLUMNS_ENCODING, COLUMNS_LAYOUT, columnsOf, decodeColumns, encodeColumns, mapColumns, type SolveColumns } from "./columns";
export { easingFor, type EasingFunction } from "./interpolate/easing";
export { swingLift } from "./interpolate/swing";
export { convexHullInto, stabilityMargin } from "./support";
export { SOLVER_VERSION } from "./version";
