// Export pages (tables, calibration profiles, bring-up tables, API docs), spread into app/routes.ts inside the shell.
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const exportPages: RouteConfigEntry[] = [
  // choose a version, format, units, rate, profile; preview; download; the build script's command
  route("export", "routes/export/page.tsx"),
  // the robots and their calibration profiles
  route("export/calibration", "routes/export/calibration-list.tsx"),
  // a robot's calibration profiles; POST create, import, update, delete
  route("export/calibration/:robotId", "routes/export/calibration.tsx"),
  // centre and sweep tables for a robot on a stand
  route("export/bring-up", "routes/export/bring-up.tsx"),
  // the OpenAPI document, readable
  route("api-docs", "routes/export/api-docs.tsx"),
];
