// Export resource routes (angle tables, bench tables, calibration profiles,
// OpenAPI, schemas), spread into app/routes.ts under `api/v1` (outside the shell).
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const exportApi: RouteConfigEntry[] = [
  // tables.download: a version's angle table (`released` for :number); ETag, 304, audit entry
  route("gaits/:gaitId/versions/:number/table", "routes/api.v1/export/table.ts"),
  // tables.download: bring-up tables (centre, sweep of one joint) of the robot's newest revision
  route("robots/:robotId/bench-table", "routes/api.v1/export/bench-table.ts"),
  // robots.read: the robot's calibration profiles
  route("robots/:robotId/calibration-profiles", "routes/api.v1/export/calibration-profiles.ts"),
  // public
  route("openapi.json", "routes/api.v1/export/openapi.ts"),
  // public
  route("schema/sequence.json", "routes/api.v1/export/sequence-schema.ts"),
  // public
  route("schema/calibration.json", "routes/api.v1/export/calibration-schema.ts"),
];
