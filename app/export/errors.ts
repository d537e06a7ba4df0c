// The one error the exporter throws: a code for the caller to map (a route
// turns "override-required" into 409, the rest into 422) and the issues in the
// { path, message } shape of the robot's and the sequence's validation.

export type TableExportErrorCode =
  /** An option or the metadata is not valid. */
  | "invalid-options"
  /** The solved result has error-severity flags (or clamped pulses) and no override reason was given. */
  | "override-required"
  /** rateHz differs from the rate the result was solved at: re-solve, never interpolate. */
  | "rate-mismatch"
  /** The calibration profile is not valid or does not fit the robot. */
  | "calibration-mismatch"
  /** Two joints drive the same servo channel after the calibration's overrides. */
  | "duplicate-channel"
  /** The solved result does not fit the robot (a leg missing, no frames, a value not finite). */
  | "solved-mismatch"
  /** A value does not fit the table's integers: the C header's type, or 32 bits in any format. */
  | "value-out-of-range"
  /** The metadata asks for another exporter version than this code is. */
  | "exporter-version";

export type TableExportIssue = { path: string; message: string };

export class TableExportError extends Error {
  readonly code: TableExportErrorCode;
  readonly issues: TableExportIssue[];
  constructor(code: TableExportErrorCode, message: string, issues: TableExportIssue[] = []) {
    const details = issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join("; ");
    super(details ? `${message}: ${details}` : message);
    this.name = "TableExportError";
    this.code = code;
    this.issues = issues;
  }
}
