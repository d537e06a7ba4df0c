// Gait pages (editor-routes), spread into app/routes.ts under the `gaits` prefix inside the shell.
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const editorPages: RouteConfigEntry[] = [
  // robots and templates to start from; POST create / copy
  route("new", "routes/gaits/new.tsx"),
  // the editor on the working draft (read-only for who may not edit it); POST move-to-newest-robot
  route(":gaitId/edit", "routes/gaits/editor.tsx"),
];
