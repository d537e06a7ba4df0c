// The heavy work of the app as tasks for the worker pool
// (app/platform/worker-pool.server.ts): plain data in (robot, sequence,
// options), strings and bytes out. Only the pure core is called here, so a
// task runs the same on a worker thread as in the request's own thread, and
// the core's refusals come back as plain data (an Error loses its class and
// fields on the way between threads); the services turn them into
// ServiceErrors.
import { createHash } from "node:crypto";
import {
  TABLE_MEDIA_TYPES,
  TableExportError,
  angleTableData,
  centreTable,
  formatAngleTable,
  solveForTable,
  sweepTable,
  tableFileName,
  type AngleTableData,
  type BenchTable,
  type TableExportIssue,
  type TableFormat,
} from "../export/index";
import {
  GaitInputError,
  columnsOf,
  encodeColumns,
  framesOf,
  runSolve,
  solveSequence,
  type Flag,
  type FlagKind,
  type Sequence,
  type SequenceIssue,
  type SolveOptions,
  type SolveSummary,
  type SolvedSequence,
} from "../gait/index";
import { JOINT_NAMES, angleToPulse, importUrdf, solveLeg, type BodyPose, type JointAngles, type Robot, type Vec3 } from "../kinematics/index";

// ---------------------------------------------------------------------------
// Refusals as data

/** The gait engine's GaitInputError: the sequence does not fit the robot or the rate. */
export type GaitRefusal = { kind: "gait-input"; message: string; issues: SequenceIssue[] };
/** The exporter's TableExportError. */
export type ExportRefusal = { kind: "table-export"; code: TableExportError["code"]; message: string; issues: TableExportIssue[] };
/** A solve that raised more flags than an answer carries. */
export type FlagsRefusal = { kind: "too-many-flags"; flags: number; limit: number };

function refusalOf(error: unknown): GaitRefusal | ExportRefusal {
  if (error instanceof GaitInputError) return { kind: "gait-input", message: error.message, issues: error.issues };
  if (error instanceof TableExportError) return { kind: "table-export", code: error.code, message: error.message, issues: error.issues };
  throw error;
}

// ---------------------------------------------------------------------------
// POST /api/v1/solve and /api/v1/ik

/** frames: DESIGN.md's layout; columns: the compact one (app/gait/columns.ts); checks: flags and summary only (the editor's reference). */
export const SOLVE_LAYOUTS = ["frames", "columns", "checks"] as const;
export type SolveLayout = (typeof SOLVE_LAYOUTS)[number];

export type SolveTask = { robot: Robot; sequence: Sequence; options: SolveOptions; layout: SolveLayout; maxFlags: number };
export type SolveTaskResult = { ok: true; answer: Uint8Array<ArrayBuffer> } | { ok: false; refusal: GaitRefusal | FlagsRefusal };

const utf8 = new TextEncoder();
const base64 = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("base64");

/** The answer to a solve request as the UTF-8 bytes of its JSON, in the layout asked for. */
function solve({ robot, sequence, options, layout, maxFlags }: SolveTask): SolveTaskResult {
  let run;
  try {
    run = runSolve(robot, sequence, options);
  } catch (error) {
    return { ok: false, refusal: refusalOf(error) as GaitRefusal };
  }
  const { flags, summary } = run;
  // Flags are not bounded by the frame count alone (one a joint and check a frame at worst), so they are counted before they are printed.
  if (flags.length > maxFlags) return { ok: false, refusal: { kind: "too-many-flags", flags: flags.length, limit: maxFlags } };
  const answer =
    layout === "columns" ? encodeColumns(columnsOf(run), base64) : layout === "checks" ? { flags, summary } : { frames: framesOf(run), flags, summary };
  return { ok: true, answer: utf8.encode(JSON.stringify(answer)) };
}

export type IkTask = { robot: Robot; feet: Record<string, Vec3>; bodyPose?: BodyPose };
export type IkResult = Record<
  string,
  { reachable: boolean; reason?: string; angles: JointAngles; pulses: JointAngles; violations: ReturnType<typeof solveLeg>["violations"] }
>;

/** Each foot's leg solved, with its pulse widths; the legs are the robot's (the caller checked). */
function ik({ robot, feet, bodyPose }: IkTask): IkResult {
  const result: IkResult = {};
  for (const [legId, foot] of Object.entries(feet)) {
    const solved = solveLeg(robot, legId, foot, bodyPose);
    const leg = robot.legs.find((candidate) => candidate.id === legId)!;
    const pulses = Object.fromEntries(JOINT_NAMES.map((joint) => [joint, angleToPulse(leg.joints[joint], solved.angles[joint]).us])) as JointAngles;
    result[legId] = { ...solved, pulses };
  }
  return result;
}

// ---------------------------------------------------------------------------
// Angle tables

export type TableOptions = Parameters<typeof angleTableData>[2];

/** A table's bytes (UTF-8) with their SHA-256 (hex), file name and media type, and the numbers the pages preview. */
export type PrintedTable = { body: Uint8Array<ArrayBuffer>; sha256: string; fileName: string; mediaType: string; data: AngleTableData };

/** A printed table, or the refusal with the error flags by kind (an override refusal names them). */
export type TableTaskResult =
  { ok: true; table: PrintedTable } | { ok: false; refusal: GaitRefusal | ExportRefusal; errorFlags: Partial<Record<FlagKind, number>> };

function errorFlagsOf(flags: readonly Flag[]): Partial<Record<FlagKind, number>> {
  const byKind: Partial<Record<FlagKind, number>> = {};
  for (const flag of flags) if (flag.severity === "error") byKind[flag.kind] = (byKind[flag.kind] ?? 0) + 1;
  return byKind;
}

function printTable(robot: Robot, solved: SolvedSequence, format: TableFormat, options: TableOptions): TableTaskResult {
  let data: AngleTableData;
  try {
    data = angleTableData(robot, solved, options);
  } catch (error) {
    return { ok: false, refusal: refusalOf(error), errorFlags: errorFlagsOf(solved.flags) };
  }
  const body = utf8.encode(formatAngleTable(data, format));
  return {
    ok: true,
    table: {
      body,
      sha256: createHash("sha256").update(body).digest("hex"),
      fileName: tableFileName(data.meta, format),
      mediaType: TABLE_MEDIA_TYPES[format],
      data,
    },
  };
}

export type VersionTableTask = { robot: Robot; sequence: Sequence; rateHz: number; format: TableFormat; table: TableOptions };

/** A gait version's table: a fresh solve at the table's rate, printed. */
function versionTable({ robot, sequence, rateHz, format, table }: VersionTableTask): TableTaskResult {
  let solved: SolvedSequence;
  try {
    solved = solveForTable(robot, sequence, rateHz);
  } catch (error) {
    return { ok: false, refusal: refusalOf(error), errorFlags: {} };
  }
  return printTable(robot, solved, format, table);
}

export type BenchSpec = ({ kind: "centre" } & Parameters<typeof centreTable>[1]) | ({ kind: "sweep" } & Parameters<typeof sweepTable>[1]);
export type BenchTableTask = { robot: Robot; bench: BenchSpec; format: TableFormat; table: TableOptions };
/** What the bring-up page shows of a bench table's frames: its checks, even when the table itself is refused. */
export type BenchChecks = { name: string; frameCount: number; flags: Flag[]; summary: SolveSummary };
export type BenchTableResult = { ok: true; checks: BenchChecks; printed: TableTaskResult } | { ok: false; refusal: ExportRefusal };

/** A bench table for a robot on a stand: its frames' checks and the table printed (or why not). */
function benchTable({ robot, bench, format, table }: BenchTableTask): BenchTableResult {
  let frames: BenchTable;
  try {
    const { kind, ...options } = bench;
    frames =
      kind === "centre" ? centreTable(robot, options as Parameters<typeof centreTable>[1]) : sweepTable(robot, options as Parameters<typeof sweepTable>[1]);
  } catch (error) {
    return { ok: false, refusal: refusalOf(error) as ExportRefusal };
  }
  const checks = { name: frames.name, frameCount: frames.frames.length, flags: frames.flags, summary: frames.summary };
  return { ok: true, checks, printed: printTable(robot, frames, format, { ...table, meta: { ...table.meta, loop: frames.loop } }) };
}

// ---------------------------------------------------------------------------
// Stored versions: the commit's summary, and what the version and compare pages play back

export type SummaryTask = { robot: Robot; sequence: Sequence };
export type SummaryResult = { ok: true; summary: SolveSummary } | { ok: false; refusal: GaitRefusal };

function summary({ robot, sequence }: SummaryTask): SummaryResult {
  try {
    return { ok: true, summary: runSolve(robot, sequence).summary };
  } catch (error) {
    return { ok: false, refusal: refusalOf(error) as GaitRefusal };
  }
}

export type PlaybackTask = { robot: Robot; sequence: Sequence; displayFrameLimit: number };
/** The flags and summary of the version's own solve, and frames for playback: the same solve, or at a lower rate for a long move. */
export type PlaybackResult = { flags: Flag[]; summary: SolveSummary; display: SolvedSequence };

function playback({ robot, sequence, displayFrameLimit }: PlaybackTask): PlaybackResult {
  const run = runSolve(robot, sequence);
  const { flags, summary } = run;
  const display =
    run.state.frameCount <= displayFrameLimit
      ? { frames: framesOf(run), flags, summary }
      : solveSequence(robot, sequence, { fps: Math.max(1, Math.floor((displayFrameLimit * 1000) / sequence.cycleMs)) });
  return { flags, summary, display };
}

// ---------------------------------------------------------------------------
// Robot import

export type UrdfTask = { xml: string; options: Parameters<typeof importUrdf>[1] };

const urdf = ({ xml, options }: UrdfTask) => importUrdf(xml, options);

/** Every task by name: the worker entry (core-worker.ts) serves these, and the pool calls them in-process when it is switched off. */
export const CORE_TASKS = { solve, ik, versionTable, benchTable, summary, playback, urdf };

export type CoreTasks = typeof CORE_TASKS;
export type CoreTaskName = keyof CoreTasks;
export type CoreTaskInput<Name extends CoreTaskName> = Parameters<CoreTasks[Name]>[0];
export type CoreTaskOutput<Name extends CoreTaskName> = ReturnType<CoreTasks[Name]>;
