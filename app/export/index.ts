// Public surface of the exporter: per-frame angle tables as CSV, JSON or a C
// header, calibration profiles, and bench test tables. Re-exports only.
export { EXPORTER_VERSION, TABLE_FORMAT } from "./version";
export { TableExportError, type TableExportIssue } from "./errors";
export { TABLE_FORMATS, TABLE_UNITS, type AngleTableOptions, type TableFormat, type TableUnits } from "./options";
export { formatFixed, tableUnitLabel } from "./rounding";
export { SAFETY_NOTICE } from "./safety";
export {
  calibrationIssuesForRobot,
  calibrationProfileJsonSchema,
  parseCalibrationProfile,
  type CalibrationProfile,
  type ValidCalibrationProfile,
} from "./calibration";
export { tableChannels } from "./channels";
export { angleTableData, type AngleTableData, type TableMetadata, type TableValues } from "./table";
export { angleTable, angleTableMetadata, buildAngleTable, formatAngleTable, solveForTable } from "./angle-table";
export { TABLE_MEDIA_TYPES, tableFileName } from "./files";
export { centreTable, sweepTable, type BenchTable } from "./bench-tables";
