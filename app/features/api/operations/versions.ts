// /api/v1/gaits/{gaitId}/versions: a gait's committed versions.
import { VERSION_STATES } from "../../versions/index";
import { AUTH, errorsFor, json, person, ref, uuidPath, type Json, type OpenApiPaths } from "./common";

export function versionPaths(): OpenApiPaths {
  return {
    "/api/v1/gaits/{gaitId}/versions": {
      get: {
        operationId: "listVersions",
        summary: "A gait's committed versions",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: { "200": { description: "The versions, newest first.", content: json(ref("VersionList")) }, ...errorsFor(400, ...AUTH, 404) },
      },
    },
  };
}

export function versionSchemas(): Record<string, Json> {
  return {
    VersionList: {
      type: "object",
      properties: {
        gait: {
          type: "object",
          properties: {
            id: { type: "string", format: "uuid" },
            name: { type: "string" },
            robotId: { type: "string", format: "uuid" },
            robotName: { type: "string" },
            releasedVersion: { type: ["integer", "null"] },
          },
        },
        versions: {
          type: "array",
          items: {
            type: "object",
            properties: {
              id: { type: "string", format: "uuid" },
              number: { type: "integer" },
              state: { type: "string", enum: [...VERSION_STATES] },
              message: { type: "string" },
              author: person,
              createdAt: { type: "string", format: "date-time" },
              stateChangedAt: { type: "string", format: "date-time" },
              robotRevision: { type: "integer" },
              contentHash: { type: "string", description: "SHA-256 of the sequence and the robot definition it was solved with." },
              summary: { type: "object", description: "The solve's summary: frames, fps, flagsByKind, errors, warnings, worstMarginMm, …" },
            },
          },
        },
      },
    },
  };
}
