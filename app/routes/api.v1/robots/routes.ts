// Robot resource routes under /api/v1, wired into app/routes.ts outside the shell.
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const robotApi: RouteConfigEntry[] = [
  // robots.read
  route("robots", "routes/api.v1/robots/list.ts"),
  // robots.read
  route("robots/:robotId", "routes/api.v1/robots/robot.ts"),
  // robots.read
  route("robots/:robotId/revisions/:number", "routes/api.v1/robots/revision.ts"),
  // public
  route("schema/robot.json", "routes/api.v1/robots/schema.ts"),
];
