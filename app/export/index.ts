// Public surface of the exporter: per-frame angle tables as CSV, JSON or a C
// header, calibration profiles, and bench test tables. Re-exports only.
export { EXPORTER_VERSION, TABLE_FORMAT } from "./version";
export { TableExportError, type TableExportErrorCode, type TableExportIssue } from "./errors";
export {
  TABLE_FORMATS,
  TABLE_UNITS,
  tableMetaSchema,
  type AngleTableOptions,
  type TableFormat,
  type TableMetaInput,
  type TableOptions,
  type TableUnits,
} from "./options";
export { UNIT_ROUNDING, formatFixed, roundHalfAwayFromZero, toFixedPoint, type UnitRounding } from "./rounding";
export { SAFETY_NOTICE } from "./safety";
export {
  MAX_TRIM_DEG,
  calibrationIssuesForRobot,
  calibrationProfileJsonSchema,
  calibrationProfileSchema,
  parseCalibrationProfile,
  type CalibrationProfile,
  type JointCalibration,
  type ParseCalibrationResult,
  type ValidCalibrationProfile,
} from "./calibration";
export { tableChannels, type TableChannel, type TableChannels } from "./channels";
export { angleTableData, type AngleTableData, type ChannelInfo, type ClampedCell, type TableMetadata } from "./table";
export { CSV_FRAME_COLUMN, CSV_TIME_COLUMN, csvField, formatCsv } from "./csv";
export { formatJson } from "./json";
export { cCommentText, cIdentifier, formatCHeader } from "./c-header";
export { angleTable, angleTableMetadata, buildAngleTable, formatAngleTable, solveForTable } from "./angle-table";
export { TABLE_MEDIA_TYPES, tableFileName } from "./files";
export { solveStandFrames } from "./stand-frames";
export { centreTable, sweepTable, type BenchTable, type CentreTableOptions, type SweepTableOptions } from "./bench-tables";
