// Gait resource routes (version-routes), spread into app/routes.ts under `api/v1` (outside the shell).
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const versionApi: RouteConfigEntry[] = [
  // the gait's versions, newest first
  route("gaits/:gaitId/versions", "routes/api.v1/gaits/versions.ts"),
];
