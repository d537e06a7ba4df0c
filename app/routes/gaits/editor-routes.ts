// Gait pages (editor-routes), spread into app/routes.ts under the `gaits` prefix inside the shell.
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const editorPages: RouteConfigEntry[] = [
  // GET gaits.edit (robots and templates to start from); POST create / copy: gaits.edit
  route("new", "routes/gaits/new.tsx"),
  // GET gaits.read (read-only without gaits.edit); POST move-to-newest-robot: gaits.edit
  route(":gaitId/edit", "routes/gaits/editor.tsx"),
];
