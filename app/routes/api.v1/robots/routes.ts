// Robot resource routes under /api/v1, wired into app/routes.ts outside the shell.
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const robotApi: RouteConfigEntry[] = [
  // the workspace's robots
  route("robots", "routes/api.v1/robots/list.ts"),
  // one robot: its newest definition and its revisions; DELETE deletes an archived one
  route("robots/:robotId", "routes/api.v1/robots/robot.ts"),
  // POST archives the robot, DELETE restores it
  route("robots/:robotId/archive", "routes/api.v1/robots/archive.ts"),
  // one revision's definition
  route("robots/:robotId/revisions/:number", "routes/api.v1/robots/revision.ts"),
  // the robot definition's JSON Schema
  route("schema/robot.json", "routes/api.v1/robots/schema.ts"),
];
