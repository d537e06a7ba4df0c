// /api/v1/gaits/{gaitId}/versions: a gait's committed versions.
import { VERSION_STATES } from "../../versions/index";
import { BY_ID, answers, dateTime, listOf, person, uuid, uuidPath, type Json, type OpenApiPaths } from "./common";

export function versionPaths(): OpenApiPaths {
  return {
    "/api/v1/gaits/{gaitId}/versions": {
      get: {
        operationId: "listVersions",
        summary: "A gait's committed versions",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: answers("The versions, newest first.", "VersionList", ...BY_ID),
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
            id: uuid,
            name: { type: "string" },
            robotId: uuid,
            robotName: { type: "string" },
            releasedVersion: { type: ["integer", "null"] },
          },
        },
        versions: listOf({
          id: uuid,
          number: { type: "integer" },
          state: { type: "string", enum: [...VERSION_STATES] },
          message: { type: "string" },
          author: person,
          createdAt: dateTime,
          stateChangedAt: dateTime,
          robotRevision: { type: "integer" },
          contentHash: { type: "string", description: "SHA-256 of the sequence and the robot definition it was solved with." },
          summary: { type: "object", description: "The solve's summary: frames, fps, flagsByKind, errors, warnings, worstMarginMm, …" },
        }),
      },
    },
  };
}
