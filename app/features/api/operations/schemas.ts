// The public JSON Schemas (robot, sequence, calibration profile) and this
// document itself: generated from the zod schemas, readable without a token.
import { calibrationProfileJsonSchema } from "../../../export/index";
import { sequenceJsonSchema } from "../../../gait/index";
import { robotJsonSchema } from "../../../kinematics/index";
import { PUBLIC, embedded, etagResponses, json, ref, type Json, type OperationDescription, type OpenApiPaths } from "./common";

/** GET of one of the public JSON Schema documents. */
function schemaOperation(operationId: string, summary: string, schema: string): OperationDescription {
  return {
    operationId,
    summary,
    tags: ["Schemas"],
    security: PUBLIC,
    responses: {
      "200": { description: "JSON Schema (draft 2020-12).", content: { "application/schema+json": { schema: ref(schema) } } },
      ...etagResponses("The schema is"),
    },
  };
}

export function schemaPaths(): OpenApiPaths {
  return {
    "/api/v1/schema/robot.json": {
      get: schemaOperation("getRobotSchema", "The robot definition's JSON Schema", "Robot"),
    },
    "/api/v1/schema/sequence.json": {
      get: schemaOperation("getSequenceSchema", "The gait sequence's JSON Schema", "Sequence"),
    },
    "/api/v1/schema/calibration.json": {
      get: schemaOperation("getCalibrationSchema", "The calibration profile's JSON Schema", "CalibrationProfile"),
    },
  };
}

export function documentPaths(): OpenApiPaths {
  return {
    "/api/v1/openapi.json": {
      get: {
        operationId: "getOpenApi",
        summary: "This document",
        tags: ["Schemas"],
        security: PUBLIC,
        responses: { "200": { description: "OpenAPI 3.1.", content: json({ type: "object" }) }, ...etagResponses("The document is") },
      },
    },
  };
}

/** The generated schemas, each with the $id it is served under so its `#/$defs` refs resolve inside it. */
export function generatedSchemas(publicUrl: string): Record<string, Json> {
  const schemaUrl = (file: string) => `${publicUrl}/api/v1/schema/${file}`;
  return {
    Robot: embedded(robotJsonSchema(), schemaUrl("robot.json")),
    Sequence: embedded(sequenceJsonSchema(), schemaUrl("sequence.json")),
    CalibrationProfile: embedded(calibrationProfileJsonSchema(), schemaUrl("calibration.json")),
  };
}
