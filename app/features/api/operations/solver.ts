// /api/v1/solve and /api/v1/ik: the gait engine, stateless.
import { COLUMNS_ENCODING, COLUMNS_LAYOUT, FLAG_KINDS } from "../../../gait/index";
import { MAX_ANSWER_FLAGS, MAX_ANSWER_LEG_FRAMES, MAX_SOLVE_LEG_FRAMES, SOLVE_LAYOUTS } from "../../solver/index.server";
import { AUTH, answers, errorsFor, json, listOf, ref, type Json, type OpenApiPaths } from "./common";

export function solverPaths(): OpenApiPaths {
  return {
    "/api/v1/solve": {
      post: {
        operationId: "solveSequence",
        summary: "Solve a gait sequence for a robot",
        description: [
          "Every frame's foot positions, joint angles and pulses, the flags of every check, and a summary. Bodies up to 2 MiB; recent answers are cached (send `Cache-Control: no-cache` for a fresh solve).",
          `Limits, counted in leg-frames (frames × legs; frames = cycleMs · fps / 1000, one more for a one-shot move): one request solves at most ${MAX_SOLVE_LEG_FRAMES} (${MAX_SOLVE_LEG_FRAMES / 6} frames of a hexapod);`,
          `an answer carries at most ${MAX_ANSWER_LEG_FRAMES.frames} in the frames layout, ${MAX_ANSWER_LEG_FRAMES.columns} in the columns layout and ${MAX_ANSWER_LEG_FRAMES.checks} in the checks layout,`,
          `and at most ${MAX_ANSWER_FLAGS} flags. Over a limit: 422, \`details.reason\` too-many-frames (with \`limit\` and \`legFrames\`) or too-many-flags.`,
          "Solves run on a pool of worker threads; when the request would wait for one longer than the server allows: 503 with Retry-After.",
        ].join(" "),
        tags: ["Solver"],
        requestBody: { required: true, content: json(ref("SolveRequest")) },
        responses: {
          "200": {
            description: "The solved sequence in the layout asked for.",
            content: json({ oneOf: [ref("SolveResult"), ref("SolveColumns"), ref("SolveChecks")] }),
          },
          ...errorsFor(400, ...AUTH, 413, 422, 503),
        },
      },
    },
    "/api/v1/ik": {
      post: {
        operationId: "solveFeet",
        summary: "Inverse kinematics for foot targets",
        description: "Closed-form leg IK per foot, with reachability, limit violations and pulse widths. Bodies up to 256 KiB.",
        tags: ["Solver"],
        requestBody: { required: true, content: json(ref("IkRequest")) },
        responses: answers("Angles per leg.", "IkResult", 400, ...AUTH, 413, 422, 503),
      },
    },
  };
}

const vec3 = { type: "array", items: { type: "number" }, minItems: 3, maxItems: 3, description: "[x, y, z] in millimetres." };
const jointAngles = {
  type: "object",
  required: ["coxa", "femur", "tibia"],
  properties: { coxa: { type: "number" }, femur: { type: "number" }, tibia: { type: "number" } },
};
const bodyPose = {
  type: "object",
  additionalProperties: false,
  description: "Body pose offset: translation in mm, roll, pitch and yaw in degrees (R = Rz(yaw)·Ry(pitch)·Rx(roll)).",
  properties: Object.fromEntries(["x", "y", "z", "roll", "pitch", "yaw"].map((key) => [key, { type: "number", default: 0 }])),
};
const column = { type: "string", contentEncoding: "base64", description: "One float32 (little-endian) a frame." };
const columnsOf = (...names: string[]) => ({
  type: "object",
  required: names,
  properties: Object.fromEntries(names.map((name) => [name, column])),
});

export function solverSchemas(): Record<string, Json> {
  return {
    IkRequest: {
      type: "object",
      required: ["robot", "feet"],
      additionalProperties: false,
      properties: {
        robot: ref("Robot"),
        feet: { type: "object", additionalProperties: vec3, description: "Per leg id, the foot target in the neutral body frame." },
        bodyPose,
      },
    },
    IkResult: {
      type: "object",
      required: ["legs"],
      properties: {
        legs: {
          type: "object",
          additionalProperties: {
            type: "object",
            required: ["reachable", "angles", "pulses", "violations"],
            properties: {
              reachable: { type: "boolean" },
              reason: { type: "string", description: "Why the target is unreachable." },
              angles: { ...jointAngles, description: "Servo degrees (zero offsets applied)." },
              pulses: { ...jointAngles, description: "Pulse widths, µs." },
              violations: { type: "array", items: { type: "object" }, description: "Joint limits the solution breaks." },
            },
          },
        },
      },
    },
    SolveRequest: {
      type: "object",
      required: ["robot", "sequence"],
      additionalProperties: false,
      properties: {
        robot: ref("Robot"),
        sequence: ref("Sequence"),
        options: {
          type: "object",
          additionalProperties: false,
          properties: {
            marginThresholdMm: { type: "number", minimum: 0, maximum: 1000 },
            slipToleranceMm: { type: "number", minimum: 0, maximum: 1000 },
            clearanceMm: { type: "number", minimum: 0, maximum: 1000 },
            fps: { type: "integer", minimum: 1, maximum: 1000, description: "Solve at another frame rate than the sequence's." },
            layout: {
              type: "string",
              enum: [...SOLVE_LAYOUTS],
              default: "frames",
              description: "frames: one object a frame; columns: the compact column layout; checks: flags and summary only.",
            },
          },
        },
      },
    },
    Flag: {
      type: "object",
      required: ["frame", "kind", "value", "limit", "severity", "message"],
      properties: {
        frame: { type: "integer" },
        leg: { type: "string" },
        joint: { type: "string", enum: ["coxa", "femur", "tibia"] },
        kind: { type: "string", enum: [...FLAG_KINDS] },
        value: { type: "number" },
        limit: { type: "number" },
        severity: { type: "string", enum: ["error", "warning"] },
        message: { type: "string" },
      },
    },
    SolveResult: {
      type: "object",
      description: 'options.layout "frames" (the default).',
      required: ["frames", "flags", "summary"],
      properties: {
        frames: listOf({
          index: { type: "integer" },
          timeMs: { type: "number" },
          body: bodyPose,
          legs: {
            type: "object",
            additionalProperties: {
              type: "object",
              properties: {
                contact: { type: "string", enum: ["stance", "swing"] },
                foot: vec3,
                reachable: { type: "boolean" },
                angles: jointAngles,
                pulses: jointAngles,
              },
            },
          },
          support: { type: "array", items: { type: "array", items: { type: "number" } } },
          com: { type: "array", items: { type: "number" } },
          marginMm: { type: ["number", "null"] },
        }),
        flags: { type: "array", items: ref("Flag") },
        summary: ref("SolveSummary"),
      },
    },
    SolveSummary: {
      type: "object",
      description: "frames, fps, flagsByKind, errors, warnings, worstMarginMm, peakSpeedDegS, dutyFactor, strideMm, bodySpeedMmS, …",
    },
    SolveColumns: {
      type: "object",
      description: `options.layout "columns": every per-frame quantity as one column, the base64 of ${COLUMNS_ENCODING} values (one a frame; marginMm is NaN where fewer than three feet are down).`,
      required: [
        "layout",
        "encoding",
        "frames",
        "fps",
        "legs",
        "joints",
        "body",
        "leg",
        "supportPolygons",
        "supportIndex",
        "com",
        "marginMm",
        "flags",
        "summary",
      ],
      properties: {
        layout: { const: COLUMNS_LAYOUT },
        encoding: { const: COLUMNS_ENCODING },
        frames: { type: "integer" },
        fps: { type: "number" },
        legs: { type: "array", items: { type: "string" } },
        joints: { type: "array", items: { type: "string" } },
        body: columnsOf("x", "y", "z", "roll", "pitch", "yaw"),
        leg: {
          type: "object",
          additionalProperties: {
            type: "object",
            properties: {
              contact: { type: "string", description: "One character a frame: s stance, w swing." },
              foot: columnsOf("x", "y", "z"),
              unreachableFrames: { type: "array", items: { type: "integer" } },
              angles: columnsOf("coxa", "femur", "tibia"),
              pulses: columnsOf("coxa", "femur", "tibia"),
            },
          },
        },
        supportPolygons: { type: "array", items: { type: "array", items: { type: "number" } }, description: "Distinct polygons as flat [x0, y0, x1, y1, …]." },
        supportIndex: { type: "array", items: { type: "integer" }, description: "Per frame, which of supportPolygons." },
        com: columnsOf("x", "y"),
        marginMm: column,
        flags: { type: "array", items: ref("Flag") },
        summary: ref("SolveSummary"),
      },
    },
    SolveChecks: {
      type: "object",
      description: 'options.layout "checks": the flags and summary without the frames.',
      required: ["flags", "summary"],
      properties: { flags: { type: "array", items: ref("Flag") }, summary: ref("SolveSummary") },
    },
  };
}
