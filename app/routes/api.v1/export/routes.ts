// Export resource routes (angle tables, bench tables, calibration profiles,
// OpenAPI, schemas), spread into app/routes.ts under `api/v1` (outside the shell).
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const exportApi: RouteConfigEntry[] = [
  // a version's angle table (`released` for :number); ETag, 304, audit entry
  route("gaits/:gaitId/versions/:number/table", "routes/api.v1/export/table.ts"),
  // bring-up tables (centre, sweep of one joint) of the robot's newest revision
  route("robots/:robotId/bench-table", "routes/api.v1/export/bench-table.ts"),
  // the robot's calibration profiles
  route("robots/:robotId/calibration-profiles", "routes/api.v1/export/calibration-profiles.ts"),
  // this API's OpenAPI document
  route("openapi.json", "routes/api.v1/export/openapi.ts"),
  // the gait sequence's JSON Schema
  route("schema/sequence.json", "routes/api.v1/export/sequence-schema.ts"),
  // the calibration profile's JSON Schema
  route("schema/calibration.json", "routes/api.v1/export/calibration-schema.ts"),
];
