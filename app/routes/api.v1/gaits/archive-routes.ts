// Archiving and deleting gaits under /api/v1, spread into app/routes.ts (outside the shell).
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const gaitArchiveApi: RouteConfigEntry[] = [
  // DELETE deletes an archived gait that was never released
  route("gaits/:gaitId", "routes/api.v1/gaits/gait.ts"),
  // POST archives the gait, DELETE restores it
  route("gaits/:gaitId/archive", "routes/api.v1/gaits/archive.ts"),
];
