// What a gait version's table and a bench table share: the calibration
// profile they apply, the bytes (from app/export) with their hash and file
// name, and the exporter's refusals as the API answers them.
import { createHash } from "node:crypto";
import {
  TABLE_MEDIA_TYPES,
  TableExportError,
  angleTableData,
  formatAngleTable,
  tableFileName,
  type AngleTableData,
  type CalibrationProfile,
  type TableFormat,
} from "../../export/index";
import type { Flag, SolvedSequence } from "../../gait/index";
import type { Robot } from "../../kinematics/index";
import type { Reader } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { findProfileByName, type StoredProfile } from "../robots/index.server";
import type { TableCalibration } from "./query";

export type RenderedTable = {
  data: AngleTableData;
  solved: SolvedSequence;
  body: string;
  sha256: string;
  fileName: string;
  mediaType: string;
};

/** Who downloaded a table, for the audit log. */
export type Downloader = { workspaceId: string; userId: string; tokenId: string | null };

/** The calibration as the table's header names it: the profile's name and the revision applied. */
const headerProfile = (stored: StoredProfile): CalibrationProfile => ({
  ...(stored.profile as CalibrationProfile),
  name: `${stored.name} (revision ${stored.revision})`,
});

/** The robot's profile called `name` (none asked: null); 422 naming the ones there are otherwise. */
export async function tableCalibration(robotId: string, name: string | undefined, db: Reader): Promise<TableCalibration> {
  if (name === undefined) return null;
  const found = await findProfileByName(robotId, name, db);
  if (!found.profile) {
    const known = found.names.length ? `; its profiles: ${found.names.join(", ")}` : "; it has none yet";
    throw new ServiceError(422, "invalid", `The robot has no calibration profile "${name}"${known}.`, { parameter: "profile" });
  }
  return { name: found.profile.name, revision: found.profile.revision, profile: headerProfile(found.profile) };
}

function describeFlags(flags: readonly Flag[]): Record<string, number> {
  const byKind: Record<string, number> = {};
  for (const flag of flags) if (flag.severity === "error") byKind[flag.kind] = (byKind[flag.kind] ?? 0) + 1;
  return byKind;
}

/** The exporter's sentence without the issue list it appends (the issues go into `details`). */
function sentenceOf(error: TableExportError): string {
  const details = error.issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join("; ");
  const text = details && error.message.endsWith(`: ${details}`) ? error.message.slice(0, -details.length - 2) : error.message;
  return `${text[0].toUpperCase()}${text.slice(1)}`;
}

/** The exporter's refusals, under its own codes: an override is a conflict (409), the rest do not fit (422). */
function refusalOf(error: TableExportError, solved: SolvedSequence | null): ServiceError {
  const summary = sentenceOf(error);
  if (error.code === "override-required") {
    return new ServiceError(
      409,
      error.code,
      `${summary}. To export it anyway, give the reason with the \`override\` parameter; it is written into the table's header.`,
      {
        parameter: "override",
        summary,
        errorFlags: solved ? describeFlags(solved.flags) : {},
        issues: error.issues,
      },
    );
  }
  const parameter = error.code === "calibration-mismatch" || error.code === "duplicate-channel" ? "profile" : undefined;
  return new ServiceError(422, error.code, `The table cannot be made: ${error.message}.`, {
    ...(parameter ? { parameter } : {}),
    summary,
    issues: error.issues,
  });
}

/** Prints a solved result as a table in `format`; the exporter's refusals become ServiceErrors. */
export function renderTable(robot: Robot, solved: SolvedSequence, format: TableFormat, options: Parameters<typeof angleTableData>[2]): RenderedTable {
  let data: AngleTableData;
  try {
    data = angleTableData(robot, solved, options);
  } catch (error) {
    if (error instanceof TableExportError) throw refusalOf(error, solved);
    throw error;
  }
  const body = formatAngleTable(data, format);
  return {
    data,
    solved,
    body,
    sha256: createHash("sha256").update(body, "utf8").digest("hex"),
    fileName: tableFileName(data.meta, format),
    mediaType: TABLE_MEDIA_TYPES[format],
  };
}
