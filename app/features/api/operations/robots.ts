// /api/v1/robots: robot definitions and their revisions.
import { AUTH, BY_ID, answers, dateTime, listOf, person, ref, uuid, uuidPath, type Json, type OpenApiPaths } from "./common";

export function robotPaths(): OpenApiPaths {
  return {
    "/api/v1/robots": {
      get: {
        operationId: "listRobots",
        summary: "The workspace's robots",
        tags: ["Robots"],
        responses: answers("Robots with their newest revision.", "RobotList", ...AUTH),
      },
    },
    "/api/v1/robots/{robotId}": {
      get: {
        operationId: "getRobot",
        summary: "One robot: its newest definition and the list of revisions",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: answers("The robot.", "RobotDetail", ...BY_ID),
      },
    },
    "/api/v1/robots/{robotId}/revisions/{number}": {
      get: {
        operationId: "getRobotRevision",
        summary: "One revision's definition, for build scripts that pin one",
        tags: ["Robots"],
        parameters: [
          uuidPath("robotId", "The robot."),
          { name: "number", in: "path", required: true, description: "The revision number.", schema: { type: "integer", minimum: 1 } },
        ],
        responses: answers("The revision.", "RobotRevision", ...BY_ID),
      },
    },
  };
}

export function robotSchemas(): Record<string, Json> {
  return {
    RobotList: {
      type: "object",
      properties: {
        robots: listOf({
          id: uuid,
          name: { type: "string" },
          legCount: { type: "integer" },
          latestRevision: { type: "integer" },
          updatedAt: dateTime,
          url: { type: "string" },
        }),
      },
    },
    RevisionSummary: {
      type: "object",
      properties: { number: { type: "integer" }, message: { type: "string" }, author: person, createdAt: dateTime },
    },
    RobotDetail: {
      type: "object",
      properties: {
        id: uuid,
        name: { type: "string" },
        createdAt: dateTime,
        latest: { allOf: [ref("RevisionSummary"), { type: "object", properties: { definition: ref("Robot") } }] },
        revisions: { type: "array", items: ref("RevisionSummary") },
      },
    },
    RobotRevision: {
      type: "object",
      properties: {
        robot: { type: "object", properties: { id: { type: "string" }, name: { type: "string" } } },
        latestRevision: { type: "integer" },
        revision: { allOf: [ref("RevisionSummary"), { type: "object", properties: { definition: ref("Robot") } }] },
      },
    },
  };
}
