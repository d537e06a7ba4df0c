// What a download is called and what it is: file names and media types of
// the three formats, for the API's Content-Type and Content-Disposition.
import { cIdentifier } from "./c-header";
import type { TableFormat, TableUnits } from "./options";
import { UNIT_ROUNDING } from "./rounding";
import type { TableMetadata } from "./table";

/** text/csv is RFC 4180's registration (header=present: the first record names the columns). */
export const TABLE_MEDIA_TYPES: Readonly<Record<TableFormat, string>> = {
  csv: "text/csv; charset=utf-8; header=present",
  json: "application/json; charset=utf-8",
  c: "text/x-c; charset=utf-8",
};

const EXTENSIONS: Readonly<Record<TableFormat, string>> = { csv: "csv", json: "json", c: "h" };

/**
 * `<gait>_v<version>_<units>_<rate>hz.<ext>`, e.g. `tripod_walk_v3_deg10_50hz.h`:
 * ASCII only, the same stem as the C identifiers.
 */
export function tableFileName(meta: Pick<TableMetadata, "gait" | "units" | "rateHz">, format: TableFormat): string {
  const units: TableUnits = meta.units;
  const version = cIdentifier(String(meta.gait.version));
  const rate = String(meta.rateHz).replace(".", "_");
  return `${cIdentifier(meta.gait.name)}_v${version}_${UNIT_ROUNDING[units].cSuffix}_${rate}hz.${EXTENSIONS[format]}`;
}
