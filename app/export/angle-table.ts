// The exporter's entry points (DESIGN.md, "Core module contracts" → app/export).
//
// Two ways in, one rule: a table is always made from a result solved at the
// table's own rate, never by interpolating another one.
// - angleTable(robot, solved, options): a result already solved; options.rateHz,
//   if given, must be the rate it was solved at (else "rate-mismatch").
// - buildAngleTable(robot, sequence, options): solves the sequence at
//   options.rateHz (default the sequence's fps) with solveSequence, then
//   angleTable. This is the one to call for "another rate".
import { solveSequence, type Sequence, type SolvedSequence } from "../gait/index";
import type { Robot } from "../kinematics/index";
import { formatCHeader } from "./c-header";
import { formatCsv } from "./csv";
import { formatJson } from "./json";
import { parseTableFormat, type AngleTableOptions, type TableFormat, type TableOptions } from "./options";
import { angleTableData, type AngleTableData, type TableMetadata } from "./table";

/** Prints a table in one format. */
export function formatAngleTable(table: AngleTableData, format: TableFormat): string {
  switch (parseTableFormat(format)) {
    case "csv":
      return formatCsv(table);
    case "json":
      return formatJson(table);
    case "c":
      return formatCHeader(table);
  }
}

/** The table of an already-solved result, as CSV, JSON or a C header; throws TableExportError (see angleTableData). */
export function angleTable(robot: Robot, solved: SolvedSequence, options: AngleTableOptions): string {
  const format = parseTableFormat(options.format);
  return formatAngleTable(angleTableData(robot, solved, options), format);
}

/** The solve a table of `sequence` at `rateHz` is made from: solveSequence at that rate. */
export function solveForTable(robot: Robot, sequence: Sequence, rateHz?: number): SolvedSequence {
  return solveSequence(robot, sequence, { fps: rateHz ?? sequence.fps });
}

/**
 * The table of a sequence at options.rateHz (default its own fps): the sequence
 * is solved at that rate, so the frame count is round(cycleMs · rate / 1000)
 * (+1 for a one-shot move) and every value is a fresh solve. meta.loop defaults
 * to the sequence's.
 */
export function buildAngleTable(robot: Robot, sequence: Sequence, options: AngleTableOptions): string {
  const solved = solveForTable(robot, sequence, options.rateHz);
  return angleTable(robot, solved, { ...options, meta: { ...options.meta, loop: options.meta.loop ?? sequence.loop } });
}

/**
 * The metadata every table carries (the CSV in its comment header), for a
 * download's HTTP headers: the same object as the JSON's `meta`.
 */
export function angleTableMetadata(robot: Robot, solved: SolvedSequence, options: TableOptions): TableMetadata {
  return angleTableData(robot, solved, options).meta;
}
