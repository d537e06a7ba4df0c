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
