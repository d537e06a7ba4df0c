// The firmware angle tables and the bring-up tables: files with ETags, audited downloads.
import { TABLE_FORMAT, TABLE_MEDIA_TYPES } from "../../../export/index";
import { NUMBER_PATTERN } from "../../../platform/params";
import { RELEASE_TABLE, benchQuerySchema, tableQuerySchema } from "../../tables/index.server";
import { MAX_SOLVE_LEG_FRAMES } from "../../solver/index.server";
import { BY_ID, errorsFor, etagResponses, ifNoneMatch, listOf, queryParameters, ref, uuidPath, type Json, type OpenApiPaths } from "./common";

const tableHeadersDoc = {
  ETag: {
    description:
      "The representation's tag: version content hash, format, units, rate, calibration profile and revision, override, exporter and solver versions.",
    schema: { type: "string" },
  },
  "Content-Disposition": {
    description:
      'attachment; filename="<gait>_v<version>_<units>_<rate>hz_<profile>.<csv|json|h>", where <profile> is profile-<name and revision> or no-profile, e.g. tripod_cruise_v1_deg10_50hz_profile-sn_0042_revision_2.csv.',
    schema: { type: "string" },
  },
  "Repr-Digest": { description: "RFC 9530: sha-256 of the bytes (a release record stores the same hash in hex).", schema: { type: "string" } },
  "Gaitloom-Gait": { description: "Gait name (percent-encoded), version and content hash, as the table's header gives them.", schema: { type: "string" } },
  "Gaitloom-Calibration": {
    description: "The calibration profile applied, with its revision (percent-encoded); absent when none was.",
    schema: { type: "string" },
  },
  "Gaitloom-Flags": { description: "errors=…; warnings=…; clamped=…", schema: { type: "string" } },
};

const tableContent = {
  "text/csv": {
    schema: {
      type: "string",
      description: [
        `${TABLE_MEDIA_TYPES.csv}, CRLF line ends. First a comment header: lines starting with "# " naming the robot and revision, gait and version, content hash, calibration profile, what the numbers are (plain degrees, radians or microseconds, never scaled), rate, flags, override reason, exporter and solver versions and the safety notice.`,
        "Then the header record frame,time_ms,<leg>.<joint>… in channel order and one record per frame.",
        'Readers skip the comment lines when told to: pandas read_csv(path, comment="#"), R read.csv(path, comment.char = "#"), readr read_csv(path, comment = "#"), papaparse { comments: "#" }; with Python\'s csv module or NumPy\'s loadtxt, leave out the lines starting with "#" first.',
      ].join(" "),
    },
  },
  "application/json": { schema: ref("AngleTable") },
  "text/x-c": {
    schema: {
      type: "string",
      description:
        "A C99 header: the frame count, frame period, channel map and a static const fixed-point array, with a comment block saying what a cell is (e.g. int16_t tenths of a degree: degrees = cell / 10) and naming robot, revision, gait version, content hash and calibration profile.",
    },
  },
};

export function benchTablePaths(): OpenApiPaths {
  return {
    "/api/v1/robots/{robotId}/bench-table": {
      get: {
        operationId: "getBenchTable",
        summary: "A bring-up table: every servo centred, or a slow sweep of one joint",
        description:
          "Made from the robot's newest revision for a robot on a stand with its legs free. The sweep is checked for joint speed like any gait; error flags or clamped pulses need `override`. Audited like every download.",
        tags: ["Tables"],
        parameters: [uuidPath("robotId", "The robot."), ...queryParameters(benchQuerySchema), ifNoneMatch],
        responses: {
          "200": { description: "The table as a file.", headers: tableHeadersDoc, content: tableContent },
          ...etagResponses("The table is"),
          ...errorsFor(...BY_ID, 409, 422, 503),
        },
      },
    },
  };
}

export function angleTablePaths(): OpenApiPaths {
  return {
    "/api/v1/gaits/{gaitId}/versions/{number}/table": {
      get: {
        operationId: "getAngleTable",
        summary: "A version's per-frame joint-angle table, for firmware",
        description: [
          "One row per frame, one column per joint in servo-channel order, as CSV, JSON or a C header, in degrees, radians or pulse widths.",
          "The version's sequence is solved with the robot revision it pins; another `rate` solves it again at that rate (never an interpolation).",
          "A `profile` applies a calibration profile of the robot and is named, with its revision, in the file name and the table's header (the CSV's comment lines, the JSON's meta, the C comment); a table without one says `no-profile` in its file name.",
          "A version with error flags, or pulses clamped to the servo range, is exported only with an `override` reason (409 without it), written into the header.",
          `Tables are reproducible byte for byte; a release stores the SHA-256 of its canonical table (format=${RELEASE_TABLE.format}&units=${RELEASE_TABLE.units}) with the solver and exporter versions.`,
          "Every download (not a 304) is recorded in the workspace's audit log.",
          `A table solves at most ${MAX_SOLVE_LEG_FRAMES} leg-frames (frames × legs; 422 too-many-frames naming \`rate\` beyond). Tables are made on a pool of worker threads; when the request would wait for one longer than the server allows: 503 with Retry-After.`,
        ].join(" "),
        tags: ["Tables"],
        parameters: [
          uuidPath("gaitId", "The gait."),
          {
            name: "number",
            in: "path",
            required: true,
            description: "The version number, or `released` for the gait's released version.",
            schema: { anyOf: [{ type: "string", pattern: NUMBER_PATTERN }, { const: "released" }] },
          },
          ...queryParameters(tableQuerySchema),
          ifNoneMatch,
        ],
        responses: {
          "200": { description: "The table as a file.", headers: tableHeadersDoc, content: tableContent },
          ...etagResponses("The table is"),
          ...errorsFor(...BY_ID, 409, 422, 503),
        },
      },
    },
  };
}

export function tableSchemas(): Record<string, Json> {
  return {
    AngleTable: {
      type: "object",
      description: `The JSON table (${TABLE_FORMAT}): one plain number per cell in meta.values.unit (degrees, radians or microseconds, never scaled), rounded to meta.values.step; channels in servo-channel order.`,
      required: ["format", "meta", "channels", "frames"],
      properties: {
        format: { const: TABLE_FORMAT },
        meta: {
          type: "object",
          properties: {
            exporterVersion: { type: "string" },
            solverVersion: { type: ["string", "null"] },
            robot: { type: "object", properties: { name: { type: "string" }, revision: { type: ["integer", "string"] } } },
            gait: {
              type: "object",
              properties: {
                name: { type: "string" },
                version: { type: ["integer", "string"] },
                contentHash: { type: "string" },
                loop: { type: ["boolean", "null"] },
              },
            },
            calibrationProfile: {
              type: ["string", "null"],
              description: "The calibration profile applied, with its revision; null: the robot's own servo settings.",
            },
            units: { type: "string", enum: ["deg", "rad", "us"] },
            values: {
              type: "object",
              description: "What the numbers in frames[].values are.",
              required: ["unit", "description", "step", "decimals"],
              properties: {
                unit: { type: "string", enum: ["deg", "rad", "us"], description: "Every value is in this unit itself: degrees, radians or microseconds." },
                description: { type: "string", description: "The values in a sentence, naming the calibration profile applied." },
                step: { type: "number", description: "The values are rounded to multiples of this: 0.1, 0.0001 or 1." },
                decimals: { type: "integer", description: "Decimals printed." },
              },
            },
            rateHz: { type: "number" },
            framePeriodMs: { type: "number" },
            frameCount: { type: "integer" },
            channelCount: { type: "integer" },
            overrideReason: { type: ["string", "null"] },
            flags: { type: "object" },
            clamped: { type: "array", items: { type: "object" } },
            safety: { type: "array", items: { type: "string" } },
          },
        },
        channels: listOf({
          column: { type: "integer" },
          channel: { type: "integer" },
          leg: { type: "string" },
          joint: { type: "string" },
          name: { type: "string" },
        }),
        frames: listOf({ index: { type: "integer" }, timeMs: { type: "number" }, values: { type: "array", items: { type: "number" } } }),
      },
    },
  };
}
