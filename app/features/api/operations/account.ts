// /api/v1/workspace: who the caller is.
import { AUTH, answers, uuid, type Json, type OpenApiPaths } from "./common";

export function accountPaths(): OpenApiPaths {
  return {
    "/api/v1/workspace": {
      get: {
        operationId: "getWorkspace",
        summary: "Which workspace and role a token or session acts with",
        description: "Build scripts call it first to check their token.",
        tags: ["Account"],
        responses: answers("The workspace, role and person.", "Workspace", ...AUTH),
      },
    },
  };
}

export function accountSchemas(): Record<string, Json> {
  return {
    Workspace: {
      type: "object",
      required: ["workspace", "role", "user", "via"],
      properties: {
        workspace: { type: "object", properties: { id: uuid, slug: { type: "string" }, name: { type: "string" } } },
        role: { type: "string", enum: ["owner", "lead", "animator", "firmware", "viewer"] },
        user: { type: "object", properties: { login: { type: "string" }, name: { type: "string" } } },
        via: { type: "string", enum: ["token", "session"] },
      },
    },
  };
}
