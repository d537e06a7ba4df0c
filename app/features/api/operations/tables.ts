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
  "Content-Disposition": { description: 'attachment; filename="<gait>_v<version>_<units>_<rate>hz.<csv|json|h>"', schema: { type: "string" } },
  "Repr-Digest": { description: "RFC 9530: sha-256 of the bytes (a release record stores the same hash in hex).", schema: { type: "string" } },
  "Gaitloom-Gait": { description: "Gait name (percent-encoded), version and content hash: the metadata a CSV cannot hold.", schema: { type: "string" } },
  "Gaitloom-Flags": { description: "errors=…; warnings=…; clamped=…", schema: { type: "string" } },
};

const tableContent = {
  "text/csv": {
    schema: { type: "string", description: `${TABLE_MEDIA_TYPES.csv}: header record frame,time_ms,<leg>.<joint>… in channel order, CRLF line ends.` },
  },
  "application/json": { schema: ref("AngleTable") },
  "text/x-c": {
    schema: {
      type: "string",
      description:
        "A C99 header: the frame count, frame period, channel map and a static const fixed-point array, with a comment block naming robot, revision, gait version and content hash.",
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
          "A `profile` applies a calibration profile of the robot and is named, with its revision, in the header.",
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
      description: `The JSON table (${TABLE_FORMAT}): one integer per cell in fixed point, printed with meta.decimals decimals; channels in servo-channel order.`,
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
            units: { type: "string", enum: ["deg", "rad", "us"] },
            rateHz: { type: "number" },
            framePeriodMs: { type: "number" },
            frameCount: { type: "integer" },
            channelCount: { type: "integer" },
            calibrationProfile: { type: ["string", "null"] },
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
