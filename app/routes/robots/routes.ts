// Robot pages, wired into app/routes.ts under /robots inside the shell.
import { index, route, type RouteConfigEntry } from "@react-router/dev/routes";

export const robotPages: RouteConfigEntry[] = [
  // GET robots.read; POST (create, upload, import-urdf) robots.edit
  index("routes/robots/list.tsx"),
  // GET robots.read; POST save: robots.calibrate, and robots.edit for anything beyond calibration
  route(":robotId", "routes/robots/robot.tsx"),
  // GET robots.read; POST restore: as save
  route(":robotId/revisions/:number", "routes/robots/revision.tsx"),
  // GET robots.read: the revision's JSON as a file
  route(":robotId/revisions/:number/download", "routes/robots/download.ts"),
];
