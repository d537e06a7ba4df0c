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
