// /api/v1/robots: robot definitions and their revisions.
import { AUTH, errorsFor, json, person, ref, uuidPath, type Json, type OpenApiPaths } from "./common";

export function robotPaths(): OpenApiPaths {
  return {
    "/api/v1/robots": {
      get: {
        operationId: "listRobots",
        summary: "The workspace's robots",
        tags: ["Robots"],
        responses: { "200": { description: "Robots with their newest revision.", content: json(ref("RobotList")) }, ...errorsFor(...AUTH) },
      },
    },
    "/api/v1/robots/{robotId}": {
      get: {
        operationId: "getRobot",
        summary: "One robot: its newest definition and the list of revisions",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: { "200": { description: "The robot.", content: json(ref("RobotDetail")) }, ...errorsFor(400, ...AUTH, 404) },
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
        responses: { "200": { description: "The revision.", content: json(ref("RobotRevision")) }, ...errorsFor(400, ...AUTH, 404) },
      },
    },
  };
}

export function robotSchemas(): Record<string, Json> {
  return {
    RobotList: {
      type: "object",
      properties: {
        robots: {
          type: "array",
          items: {
            type: "object",
            properties: {
              id: { type: "string", format: "uuid" },
              name: { type: "string" },
              legCount: { type: "integer" },
              latestRevision: { type: "integer" },
              updatedAt: { type: "string", format: "date-time" },
              url: { type: "string" },
            },
          },
        },
      },
    },
    RevisionSummary: {
      type: "object",
      properties: { number: { type: "integer" }, message: { type: "string" }, author: person, createdAt: { type: "string", format: "date-time" } },
    },
    RobotDetail: {
      type: "object",
      properties: {
        id: { type: "string", format: "uuid" },
        name: { type: "string" },
        createdAt: { type: "string", format: "date-time" },
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
