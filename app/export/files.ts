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

const MAX_PROFILE_PART = 100;

const EXTENSIONS: Readonly<Record<TableFormat, string>> = { csv: "csv", json: "json", c: "h" };

/**
 * `<gait>_v<version>_<units>_<rate>hz_<profile>.<ext>`, ASCII only, the same
 * stem as the C identifiers, where `<profile>` is `profile-<name>` (a stored
 * profile's name carries its revision) or `no-profile`: a calibrated and an
 * uncalibrated table never share a name, e.g.
 * `tripod_walk_v3_deg10_50hz_profile-sn_0042_revision_2.h` and
 * `tripod_walk_v3_deg10_50hz_no-profile.h`.
 */
export function tableFileName(meta: Pick<TableMetadata, "gait" | "units" | "rateHz" | "calibrationProfile">, format: TableFormat): string {
  const units: TableUnits = meta.units;
  const version = cIdentifier(String(meta.gait.version));
  const rate = String(meta.rateHz).replace(".", "_");
  // Longer than a C name's part, so that a long profile name keeps its revision.
  const profile = meta.calibrationProfile === null ? "no-profile" : `profile-${cIdentifier(meta.calibrationProfile, "unnamed", MAX_PROFILE_PART)}`;
  return `${cIdentifier(meta.gait.name)}_v${version}_${UNIT_ROUNDING[units].cSuffix}_${rate}hz_${profile}.${EXTENSIONS[format]}`;
}
