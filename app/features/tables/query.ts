// The HTTP side of angle tables, with no database: the query parameters and
// route parameters (checked with zod; their JSON Schemas go into the OpenAPI
// document), the entity tag of a representation, the response headers, and
// the query a release's canonical table is fetched with.
import { createHash } from "node:crypto";
import { z } from "zod";
import { EXPORTER_VERSION, TABLE_FORMAT, TABLE_FORMATS, TABLE_UNITS, type CalibrationProfile, type TableFormat, type TableUnits } from "../../export/index";
import { MAX_FPS, SOLVER_VERSION } from "../../gait/index";
import { JOINT_NAMES } from "../../kinematics/index";
import { ServiceError } from "../../platform/errors.server";
import { decimal, idParam, versionOrReleased } from "../../platform/params";
import { canonicalJson } from "../versions/index.server";
import type { RenderedTable } from "./render.server";

/** The canonical table of a release: degrees as CSV at the sequence's own rate, no calibration profile. */
export const RELEASE_TABLE = { format: "csv", units: "deg" } as const satisfies { format: TableFormat; units: TableUnits };

/** The query string a release's canonical table is fetched with (the override only when one was needed). */
export function releaseTableQuery(overrideReason: string | null): string {
  const query = new URLSearchParams(RELEASE_TABLE);
  if (overrideReason) query.set("override", overrideReason);
  return query.toString();
}

// ---------------------------------------------------------------------------
// Query parameters

const number = (name: string, min: { value: number; inclusive: boolean }, max: number) => {
  const range = `${name} must lie in ${min.inclusive ? "[" : "("}${min.value}, ${max}]`;
  const base = z.number({ error: `${name} must be a decimal number` });
  return decimal((min.inclusive ? base.gte(min.value, { error: range }) : base.gt(min.value, { error: range })).max(max, { error: range }));
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
  leg: z
    .string()
    .trim()
    .min(1, "leg must name a leg, e.g. LF")
    .max(16, "leg must be at most 16 characters")
    .optional()
    .describe("The leg of the swept joint (sweep only), e.g. LF."),
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
  hold: z
    .enum(["stance", "centre"], { error: "hold must be stance or centre" })
    .default("stance")
    .describe("What the other joints hold during a sweep: the neutral stance or 0 servo degrees."),
  format: formatParameter,
  units: unitsParameter,
  profile: profileParameter,
  override: overrideParameter,
});

export type BenchQuery = z.output<typeof benchQuerySchema>;

/** Route parameters of the table route: `:number` is a version number or `released`. */
export const tableParamsSchema = z.object({
  gaitId: idParam("gaitId"),
  number: versionOrReleased((issue) => `the version must be a number from 1 or "released" (got ${JSON.stringify(issue.input)})`),
});

export const robotParamsSchema = z.object({
  robotId: idParam("robotId"),
});

const badParameter = (parameter: string, message: string) => new ServiceError(400, "bad-request", message, { parameter });

/** Reads a query string with a zod schema: a parameter given twice, unknown or bad is a 400 naming it. */
export function parseQuery<S extends z.ZodType>(schema: S, search: URLSearchParams): z.output<S> {
  const raw: Record<string, string> = {};
  for (const key of new Set(search.keys())) {
    const values = search.getAll(key);
    if (values.length > 1) throw badParameter(key, `The parameter ${key} is given ${values.length} times; give it once.`);
    raw[key] = values[0];
  }
  const parsed = schema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  if (issue.code === "unrecognized_keys") {
    const known = schema instanceof z.ZodObject ? Object.keys(schema.shape).join(", ") : "";
    const key = issue.keys[0];
    throw badParameter(key, `Unknown parameter ${key}${known ? ` (parameters: ${known})` : ""}.`);
  }
  const parameter = String(issue.path[0] ?? "");
  const message = issue.message.startsWith(parameter) ? issue.message : `${parameter}: ${issue.message}`;
  throw badParameter(parameter, parameter in raw ? `${message} (got ${JSON.stringify(raw[parameter])}).` : `${message}.`);
}

/** Route parameters, checked: a malformed id or number is a 400 naming it. */
export function parseParams<S extends z.ZodType>(schema: S, params: unknown): z.output<S> {
  const parsed = schema.safeParse(params);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw badParameter(String(issue.path[0] ?? ""), issue.message);
}

// ---------------------------------------------------------------------------
// Entity tags and headers

/** The calibration profile a table applies: its name and revision, and the profile as the header names it. */
export type TableCalibration = { name: string; revision: number; profile: CalibrationProfile } | null;

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
  calibration: TableCalibration;
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

/** Header values are ASCII: names and reasons go percent-encoded (RFC 3986), so any text survives. */
const headerText = (value: string) => encodeURIComponent(value).replace(/%20/g, " ");

/** The response headers of a table download: type, file name, tag, and the metadata a CSV cannot hold. */
export function tableHeaders(etag: string, rendered?: RenderedTable): Headers {
  const headers = new Headers({
    ETag: etag,
    // Private (it came with credentials), and checked with If-None-Match before every reuse.
    "Cache-Control": "private, no-cache",
    Vary: "Authorization, Cookie",
    // X-Content-Type-Options comes from server.js, on every answer: set here too, it went out twice.
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
