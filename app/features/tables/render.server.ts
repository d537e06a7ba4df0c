// What a gait version's table and a bench table share: the calibration
// profile they apply, the bytes (printed by app/export on the worker pool)
// with their hash and file name, and the exporter's refusals as the API
// answers them.
import type { CalibrationProfile } from "../../export/index";
import type { FlagKind } from "../../gait/index";
import type { Reader } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import type { ExportRefusal, PrintedTable, TableTaskResult } from "../../workers/core-tasks";
import { findProfileByName, type StoredProfile } from "../robots/index.server";
import type { TableCalibration } from "./query";

/** The table's bytes (UTF-8), their SHA-256 in hex, its file name and media type, and its numbers for a preview. */
export type RenderedTable = PrintedTable;

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

type ExportError = Omit<ExportRefusal, "kind">;

/** The exporter's sentence without the issue list it appends (the issues go into `details`). */
function sentenceOf(error: ExportError): string {
  const details = error.issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join("; ");
  const text = details && error.message.endsWith(`: ${details}`) ? error.message.slice(0, -details.length - 2) : error.message;
  return `${text[0].toUpperCase()}${text.slice(1)}`;
}

/** The exporter's refusals, under its own codes: an override is a conflict (409), the rest do not fit (422). */
function refusalOf(error: ExportError, errorFlags: Partial<Record<FlagKind, number>>): ServiceError {
  const summary = sentenceOf(error);
  if (error.code === "override-required") {
    return new ServiceError(
      409,
      error.code,
      `${summary}. To export it anyway, give the reason with the \`override\` parameter; it is written into the table's header.`,
      {
        parameter: "override",
        summary,
        errorFlags,
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

/**
 * A table the worker pool printed, or the refusal to print it as a
 * ServiceError: the exporter's under its own codes, the gait engine's (the
 * sequence cannot be solved) as 422 with `cannotSolve` saying what.
 */
export function tableOrRefusal(result: TableTaskResult, cannotSolve: string): RenderedTable | ServiceError {
  if (result.ok) return result.table;
  const { refusal } = result;
  if (refusal.kind === "table-export") return refusalOf(refusal, result.errorFlags);
  return new ServiceError(422, "invalid", `${cannotSolve}: ${refusal.message}`, { issues: refusal.issues });
}
