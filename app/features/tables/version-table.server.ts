// Angle tables of stored gait versions, for the download API and the export
// page: find the version, solve its sequence with the robot revision it pins
// (at the asked rate: a new solve, never an interpolation), apply a
// calibration profile, refuse error flags without an override reason, and
// name the representation with an ETag. The bytes come from app/export, so a
// released table can be made again byte for byte.
import { and, desc, eq } from "drizzle-orm";
import { gaitVersions, gaits, robotRevisions, type VersionState } from "../../../db/schema";
import { EXPORTER_VERSION, type TableFormat, type TableUnits } from "../../export/index";
import { MAX_FRAMES, SOLVER_VERSION, parseSequence, type Sequence } from "../../gait/index";
import type { Robot } from "../../kinematics/index";
import { recordAudit } from "../../platform/audit.server";
import { database, type Reader } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { runCoreTask } from "../../platform/worker-pool.server";
import { robotOfRevision } from "../robots/index.server";
import { MAX_SOLVE_LEG_FRAMES } from "../solver/index.server";
import { gaitColumns, withGait } from "../versions/index.server";
import { tableEtag, type TableCalibration, type TableQuery } from "./query";
import { tableCalibration, tableOrRefusal, type Downloader, type RenderedTable } from "./render.server";

// ---------------------------------------------------------------------------
// Finding a version

export type TableVersion = {
  id: string;
  number: number;
  state: VersionState;
  contentHash: string;
  gait: { id: string; name: string };
  robot: { id: string; name: string; revision: number };
  definition: unknown;
  sequenceJson: unknown;
};

const versionColumns = {
  id: gaitVersions.id,
  number: gaitVersions.number,
  state: gaitVersions.state,
  contentHash: gaitVersions.contentHash,
  sequenceJson: gaitVersions.sequence,
  ...gaitColumns,
  workspaceId: gaits.workspaceId,
  robotRevision: robotRevisions.number,
  definition: robotRevisions.definition,
};

function selectVersions(db: Reader) {
  return withGait(db.select(versionColumns).from(gaitVersions).$dynamic()).innerJoin(robotRevisions, eq(robotRevisions.id, gaitVersions.robotRevisionId));
}

type VersionRow = Awaited<ReturnType<ReturnType<typeof selectVersions>["where"]>>[number];

const tableVersion = (row: VersionRow): TableVersion => ({
  id: row.id,
  number: row.number,
  state: row.state,
  contentHash: row.contentHash,
  gait: { id: row.gaitId, name: row.gaitName },
  robot: { id: row.robotId, name: row.robotName, revision: row.robotRevision },
  definition: row.definition,
  sequenceJson: row.sequenceJson,
});

/** A version of a gait of this workspace by number, or its released one; 404 otherwise (another workspace's gait too). */
export async function findTableVersion(workspaceId: string, gaitId: string, number: number | "released", db: Reader = database()): Promise<TableVersion> {
  const which = number === "released" ? eq(gaitVersions.state, "released") : eq(gaitVersions.number, number);
  const [row] = await selectVersions(db).where(and(eq(gaits.workspaceId, workspaceId), eq(gaitVersions.gaitId, gaitId), which));
  if (row) return tableVersion(row);
  const [gait] = await db
    .select({ name: gaits.name })
    .from(gaits)
    .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, workspaceId)));
  if (!gait) throw new ServiceError(404, "not-found", `No gait ${gaitId} in this workspace.`);
  throw new ServiceError(
    404,
    "not-found",
    number === "released" ? `Gait "${gait.name}" has no released version yet.` : `Gait "${gait.name}" has no version ${number}.`,
  );
}

/** A version by id, whichever workspace it is in (the caller has checked); null when there is none. */
export async function tableVersionById(versionId: string, db: Reader): Promise<TableVersion | null> {
  const [row] = await selectVersions(db).where(eq(gaitVersions.id, versionId));
  return row ? tableVersion(row) : null;
}

/** The versions of a gait for the export page's picker, newest first. */
export async function tableVersionsOf(
  workspaceId: string,
  gaitId: string,
): Promise<{ number: number; state: VersionState; message: string; errors: number; warnings: number }[]> {
  const rows = await database()
    .select({ number: gaitVersions.number, state: gaitVersions.state, message: gaitVersions.message, summary: gaitVersions.summary })
    .from(gaitVersions)
    .innerJoin(gaits, eq(gaits.id, gaitVersions.gaitId))
    .where(and(eq(gaits.workspaceId, workspaceId), eq(gaitVersions.gaitId, gaitId)))
    .orderBy(desc(gaitVersions.number));
  return rows.map((row) => {
    const summary = (row.summary ?? {}) as { errors?: number; warnings?: number };
    return { number: row.number, state: row.state, message: row.message, errors: summary.errors ?? 0, warnings: summary.warnings ?? 0 };
  });
}

const robotOf = (version: Pick<TableVersion, "definition" | "robot" | "number">): Robot =>
  robotOfRevision({ number: version.robot.revision, definition: version.definition }, { version: version.number });

function sequenceOf(version: Pick<TableVersion, "sequenceJson" | "number">): Sequence {
  const parsed = parseSequence(version.sequenceJson);
  if (!parsed.ok) throw new ServiceError(422, "invalid", `Version ${version.number} holds a sequence this engine cannot read.`, { issues: parsed.issues });
  return parsed.sequence;
}

// ---------------------------------------------------------------------------
// Preparing a table: everything the ETag needs, before the (costly) solve

export type PreparedTable = {
  version: TableVersion;
  robot: Robot;
  sequence: Sequence;
  format: TableFormat;
  units: TableUnits;
  rateHz: number;
  calibration: TableCalibration;
  overrideReason: string | null;
  etag: string;
};

function checkRate(robot: Robot, sequence: Sequence, rateHz: number): void {
  const frames = Math.round((sequence.cycleMs * rateHz) / 1000);
  if (frames < 1 || frames > MAX_FRAMES) {
    throw new ServiceError(400, "bad-request", `rate ${rateHz} Hz gives ${frames} frames for a ${sequence.cycleMs} ms cycle; 1 to ${MAX_FRAMES} allowed.`, {
      parameter: "rate",
    });
  }
  // The table is a fresh solve, held to the solve API's limit.
  const legFrames = frames * robot.legs.length;
  if (legFrames > MAX_SOLVE_LEG_FRAMES) {
    throw new ServiceError(
      422,
      "too-many-frames",
      `rate ${rateHz} Hz gives ${frames} frames × ${robot.legs.length} legs = ${legFrames} leg-frames to solve; at most ${MAX_SOLVE_LEG_FRAMES} are solved for one table.`,
      { parameter: "rate", limit: MAX_SOLVE_LEG_FRAMES, legFrames },
    );
  }
}

/** Finds the version and the profile and names the representation, without solving. */
export async function prepareVersionTable(
  workspaceId: string,
  gaitId: string,
  number: number | "released",
  query: TableQuery,
  db: Reader = database(),
): Promise<PreparedTable> {
  const version = await findTableVersion(workspaceId, gaitId, number, db);
  const robot = robotOf(version);
  const sequence = sequenceOf(version);
  const rateHz = query.rate ?? sequence.fps;
  checkRate(robot, sequence, rateHz);
  const calibration = await tableCalibration(version.robot.id, query.profile, db);
  const overrideReason = query.override ?? null;
  return {
    version,
    robot,
    sequence,
    format: query.format,
    units: query.units,
    rateHz,
    calibration,
    overrideReason,
    etag: versionTableEtag(version, { format: query.format, units: query.units, rateHz, calibration, overrideReason }),
  };
}

/** A version's table with the release's settings (no profile, no database read): the release record's. */
export function prepareReleaseTable(version: TableVersion, format: TableFormat, units: TableUnits, overrideReason: string | null): PreparedTable {
  const robot = robotOf(version);
  const sequence = sequenceOf(version);
  const settings = { format, units, rateHz: sequence.fps, calibration: null, overrideReason };
  return { version, robot, sequence, ...settings, etag: versionTableEtag(version, settings) };
}

function versionTableEtag(version: TableVersion, settings: Pick<PreparedTable, "format" | "units" | "rateHz" | "calibration" | "overrideReason">): string {
  return tableEtag({
    contentHash: version.contentHash,
    gaitName: version.gait.name,
    version: version.number,
    robotName: version.robot.name,
    robotRevision: version.robot.revision,
    ...settings,
  });
}

// ---------------------------------------------------------------------------
// Making the bytes, and the audit log

/** Solves the version at the table's rate (a fresh solve) and prints the table, on the worker pool. */
export async function renderVersionTable(prepared: PreparedTable): Promise<RenderedTable> {
  const { version } = prepared;
  const printed = await runCoreTask("versionTable", {
    robot: prepared.robot,
    sequence: prepared.sequence,
    rateHz: prepared.rateHz,
    format: prepared.format,
    table: {
      units: prepared.units,
      meta: {
        robotName: version.robot.name,
        robotRevision: version.robot.revision,
        gaitName: version.gait.name,
        gaitVersion: version.number,
        contentHash: version.contentHash,
        loop: prepared.sequence.loop,
        solverVersion: SOLVER_VERSION,
        exporterVersion: EXPORTER_VERSION,
      },
      calibration: prepared.calibration?.profile,
      overrideReason: prepared.overrideReason ?? undefined,
    },
  });
  const table = tableOrRefusal(printed, `Version ${version.number} cannot be solved`);
  if (table instanceof ServiceError) throw table;
  return table;
}

export async function recordTableDownload(
  downloader: Downloader,
  prepared: PreparedTable,
  rendered: RenderedTable,
  requested: number | "released",
): Promise<void> {
  const { version } = prepared;
  await recordAudit({
    workspaceId: downloader.workspaceId,
    actorId: downloader.userId,
    action: "table.downloaded",
    targetType: "gait_version",
    targetId: version.id,
    details: {
      gaitId: version.gait.id,
      gait: version.gait.name,
      number: version.number,
      requested,
      state: version.state,
      format: prepared.format,
      units: prepared.units,
      rateHz: prepared.rateHz,
      profile: prepared.calibration ? { name: prepared.calibration.name, revision: prepared.calibration.revision } : null,
      override: prepared.overrideReason,
      via: downloader.tokenId ? "token" : "session",
      tokenId: downloader.tokenId,
      sha256: rendered.sha256,
      bytes: Buffer.byteLength(rendered.body, "utf8"),
    },
  });
}
