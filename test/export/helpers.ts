// Shared by the export tests: realistic gaits on the demo robots, the JSON
// table read back, the CSV read back with papaparse (an outside RFC 4180
// parser), and gcc (the outside C toolchain) compiling a header into a
// program that prints the table.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Papa from "papaparse";
import { generateGait, solveSequence, type GaitParams, type Sequence, type SolvedSequence } from "~/gait/index";
import { parseRobot, type Robot } from "~/kinematics/index";
import { TableExportError, type TableUnits } from "~/export/index";
import { cIdentifier } from "~/export/c-header";
import { UNIT_ROUNDING } from "~/export/rounding";
import type { TableMetaInput } from "~/export/options";
import { loadDemoRobot, type DemoRobotFile } from "../support/robots";

/** The code of the TableExportError that `run` throws, or undefined when it throws none. */
export function codeOf(run: () => unknown): string | undefined {
  try {
    run();
  } catch (error) {
    if (error instanceof TableExportError) return error.code;
    throw error;
  }
  return undefined;
}

/** A robot definition changed and validated again (for servo settings the demo robots lack). */
export function modifiedRobot(robot: Robot, change: (json: Robot) => void): Robot {
  const json = structuredClone(robot);
  change(json);
  const parsed = parseRobot(json);
  if (!parsed.ok) throw new Error(parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; "));
  return parsed.robot;
}

export type DemoGait = { label: string; robot: Robot; params: GaitParams; sequence: Sequence; solved: SolvedSequence };

export function demoGait(file: DemoRobotFile, params: GaitParams): DemoGait {
  const robot = loadDemoRobot(file);
  const sequence = generateGait(robot, params);
  return { label: `${file} ${params.template} stride ${params.strideMm ?? "default"} mm`, robot, params, sequence, solved: solveSequence(robot, sequence) };
}

/** Realistic input: a clean walk per demo robot, and a too-long stride that is unreachable, too fast and clamped. */
export function demoGaits(): DemoGait[] {
  return [
    demoGait("pier-crawler", { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 60, name: "Tripod walk" }),
    demoGait("quay-walker", { template: "trot", cycleMs: 1000, fps: 40, strideMm: 50, name: "Trot" }),
    demoGait("hull-climber", { template: "wave", cycleMs: 1600, fps: 50, strideMm: 40, name: "Wave climb" }),
    demoGait("pier-crawler", { template: "wave", cycleMs: 1200, fps: 50, strideMm: 200, stepHeightMm: 60, name: "Long wave" }),
  ];
}

export function metaFor(gait: { robot: Robot; params?: GaitParams }, extra: Partial<TableMetaInput> = {}): TableMetaInput {
  return {
    robotName: gait.robot.name,
    robotRevision: 3,
    gaitName: gait.params?.name ?? "bench",
    gaitVersion: 2,
    contentHash: "sha256:5d41402abc4b2a76b9719d911017c592",
    ...extra,
  };
}

export const OVERRIDE = "Bench run on the stand, speed flags reviewed by the lead";

export { readJsonTable, type JsonTable } from "../support/tables";

/** The records of a CSV file as papaparse reads it (RFC 4180, the "#" comment header skipped), no type conversion. */
export function readCsv(text: string): string[][] {
  const result = Papa.parse<string[]>(text, { header: false, dynamicTyping: false, skipEmptyLines: false, comments: "#" });
  if (result.errors.length) throw new Error(`papaparse: ${result.errors.map((error) => error.message).join("; ")}`);
  const rows = result.data;
  // RFC 4180 allows a line break after the last record; papaparse then yields one empty record.
  if (rows.length && rows[rows.length - 1].length === 1 && rows[rows.length - 1][0] === "") rows.pop();
  return rows;
}

const GCC_FLAGS = ["-std=c99", "-Wall", "-Wextra", "-Werror", "-pedantic"];

/** gcc from PATH, or a clear failure: the C tests are never skipped. */
export function requireGcc(): string {
  const probe = spawnSync("gcc", ["--version"], { encoding: "utf8" });
  if (probe.error || probe.status !== 0) {
    throw new Error("gcc was not found on PATH: the C header tests need it (npm test installs Debian's gcc and libc6-dev; or apt-get install gcc libc6-dev)");
  }
  return probe.stdout.split("\n")[0];
}

/** Writes the files to a fresh temp dir, compiles main.c with gcc -std=c99 -Wall -Wextra -Werror -pedantic, runs it, returns its output. */
export function compileAndRun(files: Record<string, string>, extraFlags: string[] = []): string {
  const dir = mkdtempSync(join(tmpdir(), "gaitloom-export-"));
  try {
    for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
    const binary = join(dir, "table");
    const compile = spawnSync("gcc", [...GCC_FLAGS, "-o", binary, join(dir, "main.c"), ...extraFlags], { encoding: "utf8" });
    if (compile.status !== 0) throw new Error(`gcc ${GCC_FLAGS.join(" ")} failed:\n${compile.stderr}`);
    if (compile.stderr.trim()) throw new Error(`gcc warned:\n${compile.stderr}`);
    return execFileSync(binary, { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The C names of a table: gaitloom_<gait>_<unit> and its macro prefix. */
export function cNames(gaitName: string, units: TableUnits): { array: string; macro: string } {
  const array = `gaitloom_${cIdentifier(gaitName)}_${UNIT_ROUNDING[units].cSuffix}`;
  return { array, macro: array.toUpperCase() };
}

/**
 * A C program that prints, line by line: frames channels period_us; the
 * channel map; then each frame's cells — all as plain integers.
 */
export function printingProgram(header: string, gaitName: string, units: TableUnits): string {
  const { array, macro } = cNames(gaitName, units);
  return `#include <stdio.h>
#include "${header}"

int main(void) {
  int frame;
  int column;
  printf("%d %d %ld\\n", ${macro}_FRAMES, ${macro}_CHANNELS, (long)${macro}_FRAME_PERIOD_US);
  for (column = 0; column < ${macro}_CHANNELS; column += 1) printf(column ? " %u" : "%u", (unsigned)${array}_channel[column]);
  printf("\\n");
  for (frame = 0; frame < ${macro}_FRAMES; frame += 1) {
    for (column = 0; column < ${macro}_CHANNELS; column += 1) printf(column ? " %ld" : "%ld", (long)${array}[frame][column]);
    printf("\\n");
  }
  return 0;
}
`;
}

/** The printed integers of printingProgram. */
export function readPrinted(output: string): { frames: number; channels: number; periodUs: number; channelMap: number[]; rows: number[][] } {
  const lines = output.trimEnd().split("\n");
  const [frames, channels, periodUs] = lines[0].split(" ").map(Number);
  return { frames, channels, periodUs, channelMap: lines[1].split(" ").map(Number), rows: lines.slice(2).map((line) => line.split(" ").map(Number)) };
}
