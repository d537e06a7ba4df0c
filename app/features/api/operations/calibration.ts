// /api/v1/robots/{robotId}/calibration-profiles: the names a table download's `profile=` takes.
import { BY_ID, answers, dateTime, listOf, person, ref, uuid, uuidPath, type Json, type OpenApiPaths } from "./common";

export function calibrationPaths(): OpenApiPaths {
  return {
    "/api/v1/robots/{robotId}/calibration-profiles": {
      get: {
        operationId: "listCalibrationProfiles",
        summary: "The robot's calibration profiles (one per physical unit)",
        description: "Names to give as `profile=` when downloading a table; each profile's revision goes up with every save.",
        tags: ["Robots"],
        parameters: [uuidPath("robotId", "The robot.")],
        responses: answers("The profiles by name.", "CalibrationProfiles", ...BY_ID),
      },
    },
  };
}

export function calibrationSchemas(): Record<string, Json> {
  return {
    CalibrationProfiles: {
      type: "object",
      properties: {
        robot: { type: "object", properties: { id: { type: "string" }, name: { type: "string" }, revision: { type: "integer" } } },
        profiles: listOf({
          id: uuid,
          name: { type: "string" },
          revision: { type: "integer", description: "Goes up with every save; the table header names it." },
          updatedAt: dateTime,
          updatedBy: person,
          profile: ref("CalibrationProfile"),
        }),
      },
    },
  };
}
