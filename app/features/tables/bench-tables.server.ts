// Bench tables for bring-up, made from the robot's newest revision for a
// robot on a stand: every servo at its centre, or one joint swept slowly
// through its range and checked for speed. Named by an ETag like a version's
// table, and every download goes into the audit log.
import { createHash } from "node:crypto";
import { EXPORTER_VERSION } from "../../export/index";
import { SOLVER_VERSION } from "../../gait/index";
import { JOINT_NAMES, type JointName, type Robot } from "../../kinematics/index";
import { recordAudit } from "../../platform/audit.server";
import { database, type Reader } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { runCoreTask } from "../../platform/worker-pool.server";
import type { BenchChecks } from "../../workers/core-tasks";
import { newestRevisionInWorkspace, robotOfRevision } from "../robots/index.server";
import { canonicalJson } from "../versions/index.server";
import { tableEtag, type BenchQuery, type TableCalibration } from "./query";
import { tableCalibration, tableOrRefusal, type Downloader, type RenderedTable } from "./render.server";

export type PreparedBench = {
  robot: Robot;
  robotRow: { id: string; name: string; revision: number };
  query: BenchQuery;
  calibration: TableCalibration;
  contentHash: string;
  etag: string;
};

const badParameter = (parameter: string, message: string) => new ServiceError(400, "bad-request", message, { parameter });

export async function prepareBenchTable(workspaceId: string, robotId: string, query: BenchQuery, db: Reader = database()): Promise<PreparedBench> {
  const row = await newestRevisionInWorkspace(workspaceId, robotId, db);
  if (!row) throw new ServiceError(404, "not-found", `No robot ${robotId} in this workspace.`);
  const robot = robotOfRevision({ number: row.revision, definition: row.definition });
  if (query.kind === "sweep") {
    const legs = robot.legs.map((leg) => leg.id).join(", ");
    if (!query.leg) throw badParameter("leg", `leg is required for a sweep (legs: ${legs}).`);
    if (!robot.legs.some((leg) => leg.id === query.leg)) throw badParameter("leg", `leg ${query.leg} is not a leg of ${row.name} (legs: ${legs}).`);
    if (!query.joint) throw badParameter("joint", `joint is required for a sweep (${JOINT_NAMES.join(", ")}).`);
  }
  const calibration = await tableCalibration(robotId, query.profile, db);
  // What the frames are made of: the definition and the bench options (not the format, units or profile).
  const options =
    query.kind === "centre"
      ? { kind: "centre", seconds: query.seconds, fps: query.fps }
      : { kind: "sweep", leg: query.leg, joint: query.joint, speed: query.speed, dwell: query.dwell, fps: query.fps, hold: query.hold };
  const contentHash = createHash("sha256")
    .update(canonicalJson({ format: "gaitloom.bench/1", robot: row.definition, options }))
    .digest("hex");
  const etag = tableEtag({
    contentHash,
    gaitName: benchName(query),
    version: "bench",
    robotName: row.name,
    robotRevision: row.revision,
    format: query.format,
    units: query.units,
    rateHz: query.fps,
    calibration,
    overrideReason: query.override ?? null,
  });
  return { robot, robotRow: { id: row.id, name: row.name, revision: row.revision }, query, calibration, contentHash, etag };
}

const benchName = (query: BenchQuery) => (query.kind === "centre" ? "centre" : `sweep-${query.leg}-${query.joint}`);

export type { BenchChecks };

/**
 * Makes the bench table's frames and prints the table, on the worker pool:
 * the frames' checks, and the table or the refusal to print it (the
 * bring-up page shows the checks either way). Options the frames cannot be
 * made with are refused (400) naming the query parameter.
 */
export async function makeBenchTable(prepared: PreparedBench): Promise<{ checks: BenchChecks; table: RenderedTable | ServiceError }> {
  const { query, robot } = prepared;
  const made = await runCoreTask("benchTable", {
    robot,
    bench:
      query.kind === "centre"
        ? { kind: "centre", seconds: query.seconds, fps: query.fps }
        : {
            kind: "sweep",
            legId: query.leg!,
            joint: query.joint as JointName,
            fps: query.fps,
            speedFraction: query.speed,
            dwellMs: query.dwell,
            hold: query.hold,
          },
    format: query.format,
    table: {
      units: query.units,
      meta: {
        robotName: prepared.robotRow.name,
        robotRevision: prepared.robotRow.revision,
        // The robot's name first, so that the file and the C identifiers say which robot the bench table is for.
        gaitName: `${prepared.robotRow.name} ${benchName(query)}`,
        gaitVersion: "bench",
        contentHash: prepared.contentHash,
        solverVersion: SOLVER_VERSION,
        exporterVersion: EXPORTER_VERSION,
      },
      calibration: prepared.calibration?.profile,
      overrideReason: query.override,
    },
  });
  if (!made.ok) {
    const { refusal } = made;
    const parameter =
      { fps: "fps", seconds: "seconds", speedFraction: "speed", dwellMs: "dwell", legId: "leg", joint: "joint" }[refusal.issues[0]?.path ?? ""] ?? undefined;
    throw new ServiceError(400, "bad-request", `The bench table cannot be made: ${refusal.message}.`, {
      ...(parameter ? { parameter } : {}),
      issues: refusal.issues,
    });
  }
  return { checks: made.checks, table: tableOrRefusal(made.printed, "The bench table cannot be solved") };
}

/** The bench table's bytes with its checks; a refusal to print it is thrown. */
export async function renderBenchTable(prepared: PreparedBench): Promise<RenderedTable & { checks: BenchChecks }> {
  const { checks, table } = await makeBenchTable(prepared);
  if (table instanceof ServiceError) throw table;
  return { ...table, checks };
}

export async function recordBenchDownload(downloader: Downloader, prepared: PreparedBench, rendered: RenderedTable): Promise<void> {
  await recordAudit({
    workspaceId: downloader.workspaceId,
    actorId: downloader.userId,
    action: "bench-table.downloaded",
    targetType: "robot",
    targetId: prepared.robotRow.id,
    details: {
      robot: prepared.robotRow.name,
      revision: prepared.robotRow.revision,
      table: benchName(prepared.query),
      format: prepared.query.format,
      units: prepared.query.units,
      rateHz: prepared.query.fps,
      profile: prepared.calibration ? { name: prepared.calibration.name, revision: prepared.calibration.revision } : null,
      override: prepared.query.override ?? null,
      via: downloader.tokenId ? "token" : "session",
      tokenId: downloader.tokenId,
      sha256: rendered.sha256,
    },
  });
}
