// What a table is asked for: format, units, rate, the names that go into its
// header, the calibration profile and the override reason. Validated with zod
// so a caller's mistake comes back as { path, message } issues.
import { z } from "zod";
import { MAX_FPS } from "../gait/index";
import { formatIssues } from "../kinematics/index";
import type { CalibrationProfile } from "./calibration";
import { TableExportError } from "./errors";

export const TABLE_FORMATS = ["csv", "json", "c"] as const;
export type TableFormat = (typeof TABLE_FORMATS)[number];

export const TABLE_UNITS = ["deg", "rad", "us"] as const;
export type TableUnits = (typeof TABLE_UNITS)[number];

const revision = z.union([z.number().int().min(0), z.string().trim().min(1).max(64)]);

export const tableMetaSchema = z.strictObject({
  robotName: z.string().trim().min(1).max(200).describe("The robot's name."),
  robotRevision: revision.describe("The robot revision the gait version was solved with."),
  gaitName: z.string().trim().min(1).max(200).describe("The gait's name; the C identifiers are made from it."),
  gaitVersion: revision.describe("The gait version's number (or a label such as a bench table's)."),
  contentHash: z.string().trim().min(1).max(200).describe("The gait version's content hash."),
  loop: z.boolean().optional().describe("Whether the table plays as a loop (frames 0..N−1) or once (0..N); buildAngleTable fills it in."),
  exportedAt: z.string().max(64).optional().describe("When the table was made; left out of the bytes when not given, so tables are reproducible."),
  solverVersion: z.string().trim().min(1).max(64).optional(),
  exporterVersion: z
    .string()
    .trim()
    .min(1)
    .max(64)
    .optional()
    .describe("If given, must equal EXPORTER_VERSION: reproducing a stored table with other code is refused."),
});

export type TableMetaInput = z.input<typeof tableMetaSchema>;

export type TableOptions = {
  units: TableUnits;
  /** Frames per second; another rate than the solved result's is refused here (buildAngleTable re-solves). */
  rateHz?: number;
  meta: TableMetaInput;
  /** A physical unit's calibration, applied at export and named in the header. */
  calibration?: CalibrationProfile;
  /** Required when the result has error-severity flags or clamped pulses; written into the header. */
  overrideReason?: string;
};

export type AngleTableOptions = TableOptions & { format: TableFormat };

const optionsSchema = z.object({
  units: z.enum(TABLE_UNITS),
  rateHz: z.number().positive().max(MAX_FPS).optional(),
  meta: tableMetaSchema,
  calibration: z.unknown().optional(),
  overrideReason: z.string().max(1000).optional(),
});

const formatSchema = z.object({ format: z.enum(TABLE_FORMATS) });

export type ParsedTableOptions = {
  units: TableUnits;
  rateHz: number | undefined;
  meta: z.output<typeof tableMetaSchema>;
  /** Trimmed; undefined when empty. */
  overrideReason: string | undefined;
};

/** Checks the options (not the calibration, which calibration.ts checks); throws TableExportError "invalid-options". */
export function parseTableOptions(options: TableOptions): ParsedTableOptions {
  const result = optionsSchema.safeParse(options, { reportInput: true });
  if (!result.success) throw new TableExportError("invalid-options", "the table options are not valid", formatIssues(result.error.issues));
  const reason = result.data.overrideReason?.trim();
  return { units: result.data.units, rateHz: result.data.rateHz, meta: result.data.meta, overrideReason: reason ? reason : undefined };
}

/** Checks a format name; throws TableExportError "invalid-options". */
export function parseTableFormat(format: unknown): TableFormat {
  const result = formatSchema.safeParse({ format }, { reportInput: true });
  if (!result.success) throw new TableExportError("invalid-options", "the table format is not valid", formatIssues(result.error.issues));
  return result.data.format;
}
