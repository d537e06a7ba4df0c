// Robot pages, wired into app/routes.ts under /robots inside the shell.
import { index, route, type RouteConfigEntry } from "@react-router/dev/routes";

export const robotPages: RouteConfigEntry[] = [
  // the robots; POST adds one (create, upload, import-urdf)
  index("routes/robots/list.tsx"),
  // one robot's definition; POST save
  route(":robotId", "routes/robots/robot.tsx"),
  // POST archive, restore or delete the robot (a GET goes to its page)
  route(":robotId/archive", "routes/robots/archive.ts"),
  // an old revision; POST restore
  route(":robotId/revisions/:number", "routes/robots/revision.tsx"),
  // the revision's JSON as a file
  route(":robotId/revisions/:number/download", "routes/robots/download.ts"),
];
