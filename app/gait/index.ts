// Public surface of the gait engine: the sequence format, templates,
// generators, the solve and its result types. Re-exports only.
export {
  CSS_EASE,
  GaitInputError,
  MAX_FPS,
  MAX_FRAMES,
  frameCount,
  parseSequence,
  sequenceIssuesForRobot,
  sequenceJsonSchema,
  type BodyKey,
  type BodyOffset,
  type Ease,
  type LegKey,
  type Sequence,
  type SequenceIssue,
} from "./sequence";
export { GAIT_DEFAULTS, generateGait, type GaitParams } from "./generate";
export { TEMPLATES, TEMPLATE_NAMES, legLayout, type TemplateName } from "./templates/index";
export { SOLVE_DEFAULTS, framesOf, runSolve, solveSequence } from "./solve";
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
export { bodyOffsetAt } from "./interpolate/body";
export { COLUMNS_ENCODING, COLUMNS_LAYOUT, columnsOf, decodeColumns, encodeColumns } from "./columns";
export { SOLVER_VERSION } from "./version";
