// /api/v1/gaits/{gaitId}/draft: a gait's working draft, read and saved.
import { z } from "zod";
import { draftSaveBody } from "../../gaits/index.server";
import { BY_ID, answers, json, person, ref, uuid, uuidPath, type Json, type OpenApiPaths } from "./common";

export function draftPaths(): OpenApiPaths {
  const draftSave = z.toJSONSchema(draftSaveBody, { io: "input", target: "draft-2020-12" }) as Json & { properties: Json };
  const { $schema: _dialect, ...draftSaveSchema } = draftSave;
  return {
    "/api/v1/gaits/{gaitId}/draft": {
      get: {
        operationId: "getDraft",
        summary: "The gait's working draft and its revision",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: answers("The draft.", "Draft", ...BY_ID),
      },
      put: {
        operationId: "saveDraft",
        summary: "Save the working draft",
        description:
          "Refused with 409 when someone saved since `baseRevision`, and with 422 (issues in details) when the sequence is invalid or does not fit the robot; nothing is saved on either refusal.",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        requestBody: { required: true, content: json({ ...draftSaveSchema, properties: { ...draftSave.properties, sequence: ref("Sequence") } }) },
        responses: answers("The new draft revision.", "DraftSaved", ...BY_ID, 409, 413, 422),
      },
    },
  };
}

/** Archiving, restoring and deleting a gait (the ArchiveState and Deleted schemas are the robots'). */
export function gaitArchivePaths(): OpenApiPaths {
  return {
    "/api/v1/gaits/{gaitId}": {
      delete: {
        operationId: "deleteGait",
        summary: "Delete an archived gait none of whose versions was released",
        description:
          "Deletes the gait with its draft, versions and review history, for good. Refused with 409 while the gait is not archived (`details.reason` not-archived), " +
          "or when any version of it was released, now or before a later release retired it (`details.reason` referenced; `details.references` lists those versions): " +
          "firmware builds may still fetch them.",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: answers("The gait is deleted.", "Deleted", ...BY_ID, 409),
      },
    },
    "/api/v1/gaits/{gaitId}/archive": {
      post: {
        operationId: "archiveGait",
        summary: "Archive a gait: kept, out of the usual lists, restorable",
        description: "Archiving an archived gait changes nothing. Its versions and tables stay readable.",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: answers("The gait, archived.", "ArchiveState", ...BY_ID),
      },
      delete: {
        operationId: "restoreGait",
        summary: "Restore an archived gait to the usual lists",
        description: "Restoring a gait that is not archived changes nothing.",
        tags: ["Gaits"],
        parameters: [uuidPath("gaitId", "The gait.")],
        responses: answers("The gait, restored (archivedAt null).", "ArchiveState", ...BY_ID),
      },
    },
  };
}

export function draftSchemas(): Record<string, Json> {
  return {
    Draft: {
      type: "object",
      properties: {
        gaitId: uuid,
        name: { type: "string" },
        revision: { type: "integer", description: "Send it back as baseRevision when saving." },
        updatedAt: { type: "string" },
        updatedBy: person,
        robot: {
          type: "object",
          properties: { id: { type: "string" }, name: { type: "string" }, revision: { type: "integer" }, newestRevision: { type: "integer" } },
        },
        sequence: ref("Sequence"),
      },
    },
    DraftSaved: { type: "object", properties: { revision: { type: "integer" }, updatedAt: { type: "string" } } },
  };
}
