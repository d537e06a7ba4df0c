// /api/v1/robots: robot definitions and their revisions.
import { AUTH, BY_ID, answers, dateTime, listOf, person, ref, uuid, uuidPath, type Json, type OpenApiPaths } from "./common";

export function robotPaths(): OpenApiPaths {
  return {
    "/api/v1/robots": {
      get: {
        operationId: "listRobots",
        summary: "The workspace's robots",
        tags: ["Robots"],
        parameters: [
          {
            name: "archived",
            in: "query",
            required: false,
            description: "true: the archived robots instead of those in use.",
            schema: { type: "string", enum: ["true", "false"], default: "false" },
          },
        ],
        responses: answers("Robots with their newest revision.", "RobotList", 400, ...AUTH),
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
      delete: {
        operationId: "deleteRobot",
        summary: "Delete an archived robot that no gait uses",
        description:
          "Deletes the robot with its revisions and calibration profiles, for good. Refused with 409 while the robot is not archived (`details.reason` not-archived), " +
          "or while any gait, archived or not, uses it (`details.reason` referenced; `details.references` lists the gaits and the message names them).",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: answers("The robot is deleted.", "Deleted", ...BY_ID, 409),
      },
    },
    "/api/v1/robots/{robotId}/archive": {
      post: {
        operationId: "archiveRobot",
        summary: "Archive a robot: kept, out of the usual lists, restorable",
        description: "Archiving an archived robot changes nothing. GET /api/v1/robots?archived=true lists the archived robots.",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: answers("The robot, archived.", "ArchiveState", ...BY_ID),
      },
      delete: {
        operationId: "restoreRobot",
        summary: "Restore an archived robot to the usual lists",
        description: "Restoring a robot that is not archived changes nothing.",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: answers("The robot, restored (archivedAt null).", "ArchiveState", ...BY_ID),
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
          archivedAt: { ...dateTime, type: ["string", "null"], description: "When the robot was archived; null while in use." },
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
        archivedAt: { ...dateTime, type: ["string", "null"], description: "When the robot was archived; null while in use." },
        latest: { allOf: [ref("RevisionSummary"), { type: "object", properties: { definition: ref("Robot") } }] },
        revisions: { type: "array", items: ref("RevisionSummary") },
      },
    },
    ArchiveState: {
      type: "object",
      description: "A robot or a gait after archiving or restoring it.",
      properties: { id: uuid, name: { type: "string" }, archivedAt: { ...dateTime, type: ["string", "null"], description: "null: in use." } },
    },
    Deleted: {
      type: "object",
      description: "A robot or a gait that was deleted.",
      properties: { id: uuid, name: { type: "string" }, deleted: { const: true } },
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
