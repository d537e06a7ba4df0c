// Angle tables of stored gait versions, for the download API, the export page
// and the release record: find the version, solve its sequence with the robot
// revision it pins (at the asked rate: a new solve, never an interpolation),
// apply a calibration profile, refuse error flags without an override reason,
// and name the representation with an ETag. The bytes come from app/export,
// so a released table can be made again byte for byte.
import { createHash } from "node:crypto";
import { and, desc, eq, isNotNull } from "drizzle-orm";
import { z } from "zod";
import { gaitVersions, gaits, releases, reviewEvents, robotRevisions, robots, type VersionState } from "../../../db/schema";
import type { Database } from "../../../db/client";
import {
  EXPORTER_VERSION,
  TABLE_FORMAT,
  TABLE_FORMATS,
  TABLE_MEDIA_TYPES,
  TABLE_UNITS,
  TableExportError,
  angleTableData,
  centreTable,
  formatAngleTable,
  solveForTable,
  sweepTable,
  tableFileName,
  type AngleTableData,
  type BenchTable,
  type CalibrationProfile,
  type TableFormat,
  type TableUnits,
} from "../../export/index";
import { GaitInputError, MAX_FPS, MAX_FRAMES, parseSequence, type Flag, type Sequence, type SolvedSequence } from "../../gait/index";
import { JOINT_NAMES, parseRobot, type JointName, type Robot } from "../../kinematics/index";
import { apiError } from "../../platform/api-errors.server";
import { recordAudit } from "../../platform/audit.server";
import { findProfileByName, type StoredProfile } from "../robots/calibration.server";
import { newestRevisionInWorkspace } from "../robots/robots.server";
import { canonicalJson } from "../versions/content-hash.server";
import { database } from "../../platform/db.server";
import { ServiceError, apiAction } from "../../platform/errors.server";

/**
 * The gait engine's version as written into tables and release records. The
 * engine has no version of its own yet: bump this whenever solveSequence could
 * give other angles for the same sequence and robot.
 */
export const SOLVER_VERSION = "1.0.0";

/** The canonical table of a release: degrees as CSV at the sequence's own rate, no calibration profile. */
export const RELEASE_TABLE = { format: "csv", units: "deg" } as const satisfies { format: TableFormat; units: TableUnits };

type Reader = Pick<Database, "select">;
type Writer = Pick<Database, "select" | "insert">;

// ---------------------------------------------------------------------------
// Refusals

/** A refusal with details for the API's `error.details` (the bad parameter, the flags to override). */
export class TableError extends ServiceError {
  constructor(
    status: 400 | 404 | 409 | 422,
    message: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(status, message, typeof details?.parameter === "string" ? details.parameter : undefined);
  }
}

const API_CODES = { 400: "bad_request", 404: "not_found", 409: "conflict", 422: "invalid" } as const;

/** Runs an API route's table work: TableError with its details, other ServiceErrors as usual. */
export function answerTableErrors(run: () => Promise<Response>): Promise<Response> {
  return apiAction(async () => {
    try {
      return await run();
    } catch (error) {
      if (error instanceof TableError) return apiError(error.status as 400 | 404 | 409 | 422, API_CODES[error.status as 400 | 404 | 409 | 422], error.message, error.details);
      throw error;
    }
  }) as Promise<Response>;
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

/** The exporter's refusals as API refusals: an override is a conflict (409), the rest do not fit (422). */
function refusalOf(error: TableExportError, solved: SolvedSequence | null): TableError {
  const summary = sentenceOf(error);
  if (error.code === "override-required") {
    return new TableError(409, `${summary}. To export it anyway, give the reason with the \`override\` parameter; it is written into the table's header.`, {
      parameter: "override",
      reason: "override-required",
      summary,
      errorFlags: solved ? describeFlags(solved.flags) : {},
      issues: error.issues,
    });
  }
  const parameter = error.code === "calibration-mismatch" || error.code === "duplicate-channel" ? "profile" : undefined;
  return new TableError(422, `The table cannot be made: ${error.message}.`, { ...(parameter ? { parameter } : {}), reason: error.code, summary, issues: error.issues });
}

// ---------------------------------------------------------------------------
// Query parameters

const number = (name: string, min: { value: number; inclusive: boolean }, max: number) => {
  const range = `${name} must lie in ${min.inclusive ? "[" : "("}${min.value}, ${max}]`;
  const base = z.coerce.number({ error: `${name} must be a number` });
  return (min.inclusive ? base.gte(min.value, { error: range }) : base.gt(min.value, { error: range })).max(max, { error: range });
};

const formatParameter = z
  .enum(TABLE_FORMATS, { error: `format must be one of ${TABLE_FORMATS.join(", ")}` })
  .default("csv")
  .describe("csv (RFC 4180, one header record), json (with metadata) or c (a C header with a static const array).");

const unitsParameter = z
  .enum(TABLE_UNITS, { error: `units must be one of ${TABLE_UNITS.join(", ")}` })
  .default("deg")
  .describe("deg (servo degrees, 0.1° steps), rad (0.0001 rad steps) or us (pulse widths in whole µs, reversal and clamping applied).");

const profileParameter = z
  .string()
  .trim()
  .min(1, "profile must name a calibration profile of the robot")
  .max(120, "profile must be at most 120 characters")
  .optional()
  .describe("The name of one of the robot's calibration profiles (a physical unit, e.g. its serial number); applied and named in the header.");

const overrideParameter = z
  .string()
  .trim()
  .min(1, "override must give a reason")
  .max(1000, "override must be at most 1000 characters")
  .optional()
  .describe("Why a table with error flags or clamped pulses is exported anyway; required then, and written into the table's header.");

/** GET …/versions/:number/table: the query, checked with zod (its JSON Schema goes into the OpenAPI document). */
export const tableQuerySchema = z.strictObject({
  format: formatParameter,
  units: unitsParameter,
  rate: number("rate", { value: 0, inclusive: false }, MAX_FPS)
    .optional()
    .describe("Frames per second; the sequence is solved again at this rate (default: its own fps). Never interpolated."),
  profile: profileParameter,
  override: overrideParameter,
});

export type TableQuery = z.output<typeof tableQuerySchema>;

/** GET /api/v1/robots/:robotId/bench-table: bring-up tables with the robot on a stand. */
export const benchQuerySchema = z.strictObject({
  kind: z
    .enum(["centre", "sweep"], { error: "kind must be centre or sweep" })
    .default("centre")
    .describe("centre: every servo at 0 servo degrees; sweep: one joint slowly through its range."),
  leg: z.string().trim().min(1, "leg must name a leg, e.g. LF").max(16, "leg must be at most 16 characters").optional().describe("The leg of the swept joint (sweep only), e.g. LF."),
  joint: z
    .enum(JOINT_NAMES, { error: `joint must be one of ${JOINT_NAMES.join(", ")}` })
    .optional()
    .describe("The swept joint (sweep only)."),
  speed: number("speed", { value: 0, inclusive: false }, 10)
    .default(0.25)
    .describe("The sweep's speed as a fraction of the joint's maxSpeedDegS; above 1 is flagged joint-speed."),
  dwell: number("dwell", { value: 0, inclusive: true }, 10_000).default(500).describe("Pause at each end of the sweep, ms."),
  seconds: number("seconds", { value: 0, inclusive: false }, 600).default(2).describe("How long the centre table holds the pose, s."),
  fps: number("fps", { value: 0, inclusive: false }, 1000).default(50).describe("Frames per second."),
  hold: z.enum(["stance", "centre"], { error: "hold must be stance or centre" }).default("stance").describe("What the other joints hold during a sweep: the neutral stance or 0 servo degrees."),
  format: formatParameter,
  units: unitsParameter,
  profile: profileParameter,
  override: overrideParameter,
});

export type BenchQuery = z.output<typeof benchQuerySchema>;

/** Route parameters of the table route: `:number` is a version number or `released`. */
export const tableParamsSchema = z.object({
  gaitId: z.guid({ error: (issue) => `gaitId must be a UUID (got ${JSON.stringify(issue.input)})` }),
  number: z.union([z.literal("released"), z.string().regex(/^[1-9][0-9]{0,8}$/).transform(Number)], {
    error: (issue) => `the version must be a number from 1 or "released" (got ${JSON.stringify(issue.input)})`,
  }),
});

export const robotParamsSchema = z.object({
  robotId: z.guid({ error: (issue) => `robotId must be a UUID (got ${JSON.stringify(issue.input)})` }),
});

/** Reads a query string with a zod schema: a parameter given twice, unknown or bad is a 400 naming it. */
export function parseQuery<S extends z.ZodType>(schema: S, search: URLSearchParams): z.output<S> {
  const raw: Record<string, string> = {};
  for (const key of new Set(search.keys())) {
    const values = search.getAll(key);
    if (values.length > 1) throw new TableError(400, `The parameter ${key} is given ${values.length} times; give it once.`, { parameter: key });
    raw[key] = values[0];
  }
  const parsed = schema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  if (issue.code === "unrecognized_keys") {
    const known = schema instanceof z.ZodObject ? Object.keys(schema.shape).join(", ") : "";
    const key = issue.keys[0];
    throw new TableError(400, `Unknown parameter ${key}${known ? ` (parameters: ${known})` : ""}.`, { parameter: key });
  }
  const parameter = String(issue.path[0] ?? "");
  const message = issue.message.startsWith(parameter) ? issue.message : `${parameter}: ${issue.message}`;
  throw new TableError(400, parameter in raw ? `${message} (got ${JSON.stringify(raw[parameter])}).` : `${message}.`, { parameter });
}

/** Route parameters, checked: a malformed id or number is a 400 naming it. */
export function parseParams<S extends z.ZodType>(schema: S, params: unknown): z.output<S> {
  const parsed = schema.safeParse(params);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new TableError(400, issue.message, { parameter: String(issue.path[0] ?? "") });
}

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
  gaitId: gaits.id,
  gaitName: gaits.name,
  workspaceId: gaits.workspaceId,
  robotId: robots.id,
  robotName: robots.name,
  robotRevision: robotRevisions.number,
  definition: robotRevisions.definition,
};

function selectVersions(db: Reader) {
  return db
    .select(versionColumns)
    .from(gaitVersions)
    .innerJoin(gaits, eq(gaits.id, gaitVersions.gaitId))
    .innerJoin(robots, eq(robots.id, gaits.robotId))
    .innerJoin(robotRevisions, eq(robotRevisions.id, gaitVersions.robotRevisionId));
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
  const [gait] = await db.select({ name: gaits.name }).from(gaits).where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, workspaceId)));
  if (!gait) throw new TableError(404, `No gait ${gaitId} in this workspace.`);
  throw new TableError(404, number === "released" ? `Gait "${gait.name}" has no released version yet.` : `Gait "${gait.name}" has no version ${number}.`);
}

/** The versions of a gait for the export page's picker, newest first. */
export async function tableVersionsOf(workspaceId: string, gaitId: string): Promise<{ number: number; state: VersionState; message: string; errors: number; warnings: number }[]> {
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

function robotOf(version: Pick<TableVersion, "definition" | "robot" | "number">): Robot {
  const parsed = parseRobot(version.definition);
  if (!parsed.ok) throw new TableError(422, `Version ${version.number} pins robot revision ${version.robot.revision}, which no longer parses.`);
  return parsed.robot;
}

function sequenceOf(version: Pick<TableVersion, "sequenceJson" | "number">): Sequence {
  const parsed = parseSequence(version.sequenceJson);
  if (!parsed.ok) throw new TableError(422, `Version ${version.number} holds a sequence this engine cannot read.`, { issues: parsed.issues });
  return parsed.sequence;
}

// ---------------------------------------------------------------------------
// Preparing a table: everything the ETag needs, before the (costly) solve

type Calibration = { name: string; revision: number; profile: CalibrationProfile } | null;

export type PreparedTable = {
  version: TableVersion;
  robot: Robot;
  sequence: Sequence;
  format: TableFormat;
  units: TableUnits;
  rateHz: number;
  calibration: Calibration;
  overrideReason: string | null;
  etag: string;
};

/** The calibration as the table's header names it: the profile's name and the revision applied. */
const headerProfile = (stored: StoredProfile): CalibrationProfile => ({ ...(stored.profile as CalibrationProfile), name: `${stored.name} (revision ${stored.revision})` });

async function calibrationFor(robotId: string, name: string | undefined, db: Reader): Promise<Calibration> {
  if (name === undefined) return null;
  const found = await findProfileByName(robotId, name, db);
  if (!found.profile) {
    const known = found.names.length ? `; its profiles: ${found.names.join(", ")}` : "; it has none yet";
    throw new TableError(422, `The robot has no calibration profile "${name}"${known}.`, { parameter: "profile" });
  }
  return { name: found.profile.name, revision: found.profile.revision, profile: headerProfile(found.profile) };
}

/**
 * One representation's entity tag: everything the bytes depend on — the
 * version's content hash (sequence + robot definition), the names and numbers
 * in the header, format, units, rate, the calibration profile's name and
 * revision, the override reason, and the table format, exporter and solver
 * versions — hashed with SHA-256. The bytes never depend on the clock, so a
 * strong tag.
 */
export function tableEtag(parts: {
  contentHash: string;
  gaitName: string;
  version: number | string;
  robotName: string;
  robotRevision: number | string;
  format: TableFormat;
  units: TableUnits;
  rateHz: number;
  calibration: Calibration;
  overrideReason: string | null;
}): string {
  const recipe = canonicalJson({
    table: TABLE_FORMAT,
    exporter: EXPORTER_VERSION,
    solver: SOLVER_VERSION,
    contentHash: parts.contentHash,
    gait: parts.gaitName,
    version: parts.version,
    robot: parts.robotName,
    robotRevision: parts.robotRevision,
    format: parts.format,
    units: parts.units,
    rateHz: parts.rateHz,
    profile: parts.calibration ? { name: parts.calibration.name, revision: parts.calibration.revision } : null,
    override: parts.overrideReason,
  });
  return `"${createHash("sha256").update(recipe).digest("hex").slice(0, 40)}"`;
}

/** RFC 9110 §13.1.2: If-None-Match matches when any listed tag equals ours by weak comparison, or it is `*`. */
export function matchesIfNoneMatch(header: string | null, etag: string): boolean {
  if (!header) return false;
  const ours = etag.replace(/^W\//, "");
  return header.split(",").some((tag) => {
    const candidate = tag.trim();
    return candidate === "*" || candidate.replace(/^W\//, "") === ours;
  });
}

function checkRate(sequence: Sequence, rateHz: number): void {
  const frames = Math.round((sequence.cycleMs * rateHz) / 1000);
  if (frames < 1 || frames > MAX_FRAMES) {
    throw new TableError(400, `rate ${rateHz} Hz gives ${frames} frames for a ${sequence.cycleMs} ms cycle; 1 to ${MAX_FRAMES} allowed.`, { parameter: "rate" });
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
  return prepareFor(version, query, db);
}

async function prepareFor(version: TableVersion, query: Pick<TableQuery, "format" | "units" | "rate" | "profile" | "override">, db: Reader): Promise<PreparedTable> {
  const robot = robotOf(version);
  const sequence = sequenceOf(version);
  const rateHz = query.rate ?? sequence.fps;
  checkRate(sequence, rateHz);
  const calibration = await calibrationFor(version.robot.id, query.profile, db);
  const overrideReason = query.override ?? null;
  const etag = tableEtag({
    contentHash: version.contentHash,
    gaitName: version.gait.name,
    version: version.number,
    robotName: version.robot.name,
    robotRevision: version.robot.revision,
    format: query.format,
    units: query.units,
    rateHz,
    calibration,
    overrideReason,
  });
  return { version, robot, sequence, format: query.format, units: query.units, rateHz, calibration, overrideReason, etag };
}

// ---------------------------------------------------------------------------
// Making the bytes

export type RenderedTable = {
  data: AngleTableData;
  solved: SolvedSequence;
  body: string;
  sha256: string;
  fileName: string;
  mediaType: string;
};

function render(robot: Robot, solved: SolvedSequence, format: TableFormat, options: Parameters<typeof angleTableData>[2]): RenderedTable {
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

/** Solves the version at the table's rate (solveForTable: a fresh solve) and prints the table. */
export function renderVersionTable(prepared: PreparedTable): RenderedTable {
  let solved: SolvedSequence;
  try {
    solved = solveForTable(prepared.robot, prepared.sequence, prepared.rateHz);
  } catch (error) {
    if (error instanceof GaitInputError) throw new TableError(422, `Version ${prepared.version.number} cannot be solved: ${error.message}`, { issues: error.issues });
    throw error;
  }
  const { version } = prepared;
  return render(prepared.robot, solved, prepared.format, {
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
  });
}

/** Header values are ASCII: names and reasons go percent-encoded (RFC 3986), so any text survives. */
const headerText = (value: string) => encodeURIComponent(value).replace(/%20/g, " ");

/** The response headers of a table download: type, file name, tag, and the metadata a CSV cannot hold. */
export function tableHeaders(etag: string, rendered?: RenderedTable): Headers {
  const headers = new Headers({
    ETag: etag,
    // Private (it came with credentials), and checked with If-None-Match before every reuse.
    "Cache-Control": "private, no-cache",
    Vary: "Authorization, Cookie",
    "X-Content-Type-Options": "nosniff",
  });
  if (!rendered) return headers;
  const { meta } = rendered.data;
  headers.set("Content-Type", rendered.mediaType);
  headers.set("Content-Disposition", `attachment; filename="${rendered.fileName}"`);
  headers.set("Gaitloom-Table", `${TABLE_FORMAT}; exporter=${meta.exporterVersion}; solver=${meta.solverVersion ?? "none"}`);
  headers.set("Gaitloom-Gait", `${headerText(meta.gait.name)}; version=${headerText(String(meta.gait.version))}; content-hash=${meta.gait.contentHash}`);
  headers.set("Gaitloom-Robot", `${headerText(meta.robot.name)}; revision=${headerText(String(meta.robot.revision))}`);
  headers.set("Gaitloom-Frames", `${meta.frameCount}; channels=${meta.channelCount}; rate-hz=${meta.rateHz}; units=${meta.units}`);
  headers.set("Gaitloom-Flags", `errors=${meta.flags.errors}; warnings=${meta.flags.warnings}; clamped=${meta.clamped.length}`);
  if (meta.calibrationProfile) headers.set("Gaitloom-Calibration", headerText(meta.calibrationProfile));
  if (meta.overrideReason) headers.set("Gaitloom-Override", headerText(meta.overrideReason));
  // RFC 9530: the SHA-256 of the bytes, as a release record stores it (there in hex).
  headers.set("Repr-Digest", `sha-256=:${Buffer.from(rendered.sha256, "hex").toString("base64")}:`);
  return headers;
}

// ---------------------------------------------------------------------------
// The audit log

export type Downloader = { workspaceId: string; userId: string; tokenId: string | null };

export async function recordTableDownload(downloader: Downloader, prepared: PreparedTable, rendered: RenderedTable, requested: number | "released"): Promise<void> {
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

// ---------------------------------------------------------------------------
// Release records

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

/** The query string a release's canonical table is fetched with (the override only when one was needed). */
export function releaseTableQuery(overrideReason: string | null): string {
  const query = new URLSearchParams(RELEASE_TABLE);
  if (overrideReason) query.set("override", overrideReason);
  return query.toString();
}

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
export async function recordReleaseTable(tx: Writer, input: { versionId: string; releasedById: string | null; overrideReason?: string | null }): Promise<ReleaseRecord> {
  const [row] = await selectVersions(tx).where(eq(gaitVersions.id, input.versionId));
  if (!row) throw new ServiceError(404, `No version ${input.versionId} to record a release table for.`);
  const version = tableVersion(row);
  let overrideReason = input.overrideReason?.trim() || null;
  const make = (reason: string | null) => renderVersionTable({ ...releasePreparation(version), overrideReason: reason });
  let rendered: RenderedTable;
  try {
    rendered = make(overrideReason);
  } catch (error) {
    if (!(error instanceof TableError && error.details?.reason === "override-required")) throw error;
    const [event] = await tx
      .select({ reason: reviewEvents.overrideReason })
      .from(reviewEvents)
      .where(and(eq(reviewEvents.versionId, version.id), isNotNull(reviewEvents.overrideReason)))
      .orderBy(desc(reviewEvents.createdAt), desc(reviewEvents.id))
      .limit(1);
    if (!event?.reason) {
      throw new ServiceError(409, `Version ${version.number} of "${version.gait.name}" has error flags and no override reason in its review history; its release table cannot be made.`);
    }
    overrideReason = event.reason;
    rendered = make(overrideReason);
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

/** The preparation of a version's table with no database reads (no profile): the release record's. */
function releasePreparation(version: TableVersion): PreparedTable {
  const robot = robotOf(version);
  const sequence = sequenceOf(version);
  const base = { format: RELEASE_TABLE.format, units: RELEASE_TABLE.units, rateHz: sequence.fps, calibration: null, overrideReason: null };
  return {
    version,
    robot,
    sequence,
    ...base,
    etag: tableEtag({ contentHash: version.contentHash, gaitName: version.gait.name, version: version.number, robotName: version.robot.name, robotRevision: version.robot.revision, ...base }),
  };
}

/** The newest release record of a version, or null. */
export async function releaseRecordOf(versionId: string, db: Reader = database()): Promise<ReleaseRecord | null> {
  const [row] = await db.select().from(releases).where(eq(releases.versionId, versionId)).orderBy(desc(releases.createdAt)).limit(1);
  return row ?? null;
}

// ---------------------------------------------------------------------------
// Bench tables for bring-up

export type PreparedBench = {
  robot: Robot;
  robotRow: { id: string; name: string; revision: number };
  query: BenchQuery;
  calibration: Calibration;
  contentHash: string;
  etag: string;
};

export async function prepareBenchTable(workspaceId: string, robotId: string, query: BenchQuery, db: Reader = database()): Promise<PreparedBench> {
  const row = await newestRevisionInWorkspace(workspaceId, robotId, db);
  if (!row) throw new TableError(404, `No robot ${robotId} in this workspace.`);
  const parsed = parseRobot(row.definition);
  if (!parsed.ok) throw new TableError(422, `Robot revision ${row.revision} no longer parses.`);
  if (query.kind === "sweep") {
    if (!query.leg) throw new TableError(400, `leg is required for a sweep (legs: ${parsed.robot.legs.map((leg) => leg.id).join(", ")}).`, { parameter: "leg" });
    if (!parsed.robot.legs.some((leg) => leg.id === query.leg)) {
      throw new TableError(400, `leg ${query.leg} is not a leg of ${row.name} (legs: ${parsed.robot.legs.map((leg) => leg.id).join(", ")}).`, { parameter: "leg" });
    }
    if (!query.joint) throw new TableError(400, `joint is required for a sweep (${JOINT_NAMES.join(", ")}).`, { parameter: "joint" });
  }
  const calibration = await calibrationFor(robotId, query.profile, db);
  // What the frames are made of: the definition and the bench options (not the format, units or profile).
  const options =
    query.kind === "centre"
      ? { kind: "centre", seconds: query.seconds, fps: query.fps }
      : { kind: "sweep", leg: query.leg, joint: query.joint, speed: query.speed, dwell: query.dwell, fps: query.fps, hold: query.hold };
  const contentHash = createHash("sha256").update(canonicalJson({ format: "gaitloom.bench/1", robot: row.definition, options })).digest("hex");
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
  return { robot: parsed.robot, robotRow: { id: row.id, name: row.name, revision: row.revision }, query, calibration, contentHash, etag };
}

const benchName = (query: BenchQuery) => (query.kind === "centre" ? "centre" : `sweep-${query.leg}-${query.joint}`);

export function renderBenchTable(prepared: PreparedBench): RenderedTable & { bench: BenchTable } {
  const { query, robot } = prepared;
  let bench: BenchTable;
  try {
    bench =
      query.kind === "centre"
        ? centreTable(robot, { seconds: query.seconds, fps: query.fps })
        : sweepTable(robot, { legId: query.leg!, joint: query.joint as JointName, fps: query.fps, speedFraction: query.speed, dwellMs: query.dwell, hold: query.hold });
  } catch (error) {
    if (error instanceof TableExportError) {
      const parameter = { fps: "fps", seconds: "seconds", speedFraction: "speed", dwellMs: "dwell", legId: "leg", joint: "joint" }[error.issues[0]?.path ?? ""] ?? undefined;
      throw new TableError(400, `The bench table cannot be made: ${error.message}.`, { ...(parameter ? { parameter } : {}), issues: error.issues });
    }
    throw error;
  }
  const rendered = render(robot, bench, query.format, {
    units: query.units,
    meta: {
      robotName: prepared.robotRow.name,
      robotRevision: prepared.robotRow.revision,
      // The robot's name first, so that the file and the C identifiers say which robot the bench table is for.
      gaitName: `${prepared.robotRow.name} ${bench.name}`,
      gaitVersion: "bench",
      contentHash: prepared.contentHash,
      loop: bench.loop,
      solverVersion: SOLVER_VERSION,
      exporterVersion: EXPORTER_VERSION,
    },
    calibration: prepared.calibration?.profile,
    overrideReason: query.override,
  });
  return { ...rendered, bench };
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
