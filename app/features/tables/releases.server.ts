// Release records: the canonical table of a released version, made inside the
// release's transaction, with its SHA-256 and the solver and exporter
// versions, so the API can make the same bytes again from `tableFormat`.
import { and, desc, eq, isNotNull } from "drizzle-orm";
import { releases, reviewEvents } from "../../../db/schema";
import { EXPORTER_VERSION } from "../../export/index";
import { SOLVER_VERSION } from "../../gait/index";
import { database, type Reader, type Writer } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { RELEASE_TABLE, releaseTableQuery } from "./query";
import type { RenderedTable } from "./render.server";
import { prepareReleaseTable, renderVersionTable, tableVersionById } from "./version-table.server";

export type ReleaseRecord = {
  id: string;
  versionId: string;
  tableSha256: string;
  /** The table query that makes the bytes again, e.g. `format=csv&units=deg`. */
  tableFormat: string;
  solverVersion: string;
  exporterVersion: string;
  createdAt: Date;
};

/**
 * Builds the release's canonical table (degrees, CSV, at the sequence's own
 * rate, no calibration profile) inside the release's transaction and stores
 * its SHA-256 with the solver and exporter versions, so the table can be made
 * again byte for byte through the API with the query in `tableFormat`.
 *
 * A version with error flags needs an override reason for its table: the one
 * given, else the newest override reason of its review history (its approval
 * over the flags); none at all refuses the release (409).
 */
export async function recordReleaseTable(
  tx: Writer,
  input: { versionId: string; releasedById: string | null; overrideReason?: string | null },
): Promise<ReleaseRecord> {
  const version = await tableVersionById(input.versionId, tx);
  if (!version) throw new ServiceError(404, "not-found", `No version ${input.versionId} to record a release table for.`);
  let overrideReason = input.overrideReason?.trim() || null;
  const make = (reason: string | null) => renderVersionTable(prepareReleaseTable(version, RELEASE_TABLE.format, RELEASE_TABLE.units, reason));
  let rendered: RenderedTable;
  try {
    rendered = await make(overrideReason);
  } catch (error) {
    if (!(error instanceof ServiceError && error.code === "override-required")) throw error;
    const [event] = await tx
      .select({ reason: reviewEvents.overrideReason })
      .from(reviewEvents)
      .where(and(eq(reviewEvents.versionId, version.id), isNotNull(reviewEvents.overrideReason)))
      .orderBy(desc(reviewEvents.createdAt), desc(reviewEvents.id))
      .limit(1);
    if (!event?.reason) {
      throw new ServiceError(
        409,
        "conflict",
        `Version ${version.number} of "${version.gait.name}" has error flags and no override reason in its review history; its release table cannot be made.`,
      );
    }
    overrideReason = event.reason;
    rendered = await make(overrideReason);
  }
  const [release] = await tx
    .insert(releases)
    .values({
      versionId: version.id,
      releasedById: input.releasedById,
      tableSha256: rendered.sha256,
      tableFormat: releaseTableQuery(overrideReason),
      solverVersion: SOLVER_VERSION,
      exporterVersion: EXPORTER_VERSION,
    })
    .returning();
  return release;
}

/** The newest release record of a version, or null. */
export async function releaseRecordOf(versionId: string, db: Reader = database()): Promise<ReleaseRecord | null> {
  const [row] = await db.select().from(releases).where(eq(releases.versionId, versionId)).orderBy(desc(releases.createdAt)).limit(1);
  return row ?? null;
}

/** A release record beside today's table made from its recorded query: the version page's check. */
export type ReleaseTableCheck = {
  recorded: { sha256: string; exporterVersion: string; solverVersion: string; tableFormat: string; createdAt: Date };
  /** Today's table from the recorded query; `sha256` null when it cannot be made today (`problem` says why). */
  today: { sha256: string | null; exporterVersion: string; solverVersion: string; problem: string | null };
  matches: boolean;
  /** What changed since the release, in words ("the exporter changed from 1.0.0 to 2.0.0"); empty when neither version did. */
  reasons: string[];
};

/**
 * Makes the release's canonical table again with today's code (the recorded
 * query: format, units, override) and compares its SHA-256 with the recorded
 * one. Null when the version has no release record. A solve on the worker
 * pool, as a download is.
 */
export async function checkReleaseTable(versionId: string, db: Reader = database()): Promise<ReleaseTableCheck | null> {
  const record = await releaseRecordOf(versionId, db);
  if (!record) return null;
  // A version and its release record never change, so today's hash of a record is worked out once per process.
  const cached = todaysHashes.get(record.id);
  const today = cached ?? (await todaysReleaseTable(versionId, record, db));
  if (!today) return null;
  if (!cached) remember(record.id, today);
  return {
    recorded: {
      sha256: record.tableSha256,
      exporterVersion: record.exporterVersion,
      solverVersion: record.solverVersion,
      tableFormat: record.tableFormat,
      createdAt: record.createdAt,
    },
    today,
    matches: today.sha256 === record.tableSha256,
    reasons: [
      ...(record.exporterVersion !== EXPORTER_VERSION ? [`the exporter changed from ${record.exporterVersion} to ${EXPORTER_VERSION}`] : []),
      ...(record.solverVersion !== SOLVER_VERSION ? [`the solver changed from ${record.solverVersion} to ${SOLVER_VERSION}`] : []),
    ],
  };
}

const TODAYS_HASHES_KEPT = 500;
const todaysHashes = new Map<string, ReleaseTableCheck["today"]>();

function remember(recordId: string, today: ReleaseTableCheck["today"]): void {
  if (todaysHashes.size >= TODAYS_HASHES_KEPT) todaysHashes.delete(todaysHashes.keys().next().value!);
  todaysHashes.set(recordId, today);
}

/** The release's canonical table made again with today's code from the recorded query, and its SHA-256 (null with the reason when it cannot be made). */
async function todaysReleaseTable(versionId: string, record: ReleaseRecord, db: Reader): Promise<ReleaseTableCheck["today"] | null> {
  const version = await tableVersionById(versionId, db);
  if (!version) return null;
  const recorded = new URLSearchParams(record.tableFormat);
  let sha256: string | null = null;
  let problem: string | null = null;
  try {
    const format = recorded.get("format") === RELEASE_TABLE.format ? RELEASE_TABLE.format : null;
    const units = recorded.get("units") === RELEASE_TABLE.units ? RELEASE_TABLE.units : null;
    if (!format || !units) throw new ServiceError(422, "invalid", `The recorded query "${record.tableFormat}" is not one this exporter makes.`);
    sha256 = (await renderVersionTable(prepareReleaseTable(version, format, units, recorded.get("override")))).sha256;
  } catch (error) {
    if (!(error instanceof ServiceError)) throw error;
    problem = error.message;
  }
  return { sha256, exporterVersion: EXPORTER_VERSION, solverVersion: SOLVER_VERSION, problem };
}
