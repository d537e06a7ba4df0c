// Gait resource routes (editor-routes), spread into app/routes.ts under `api/v1` (outside the shell).
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const editorApi: RouteConfigEntry[] = [
  // GET the working draft; PUT saves it with { sequence, baseRevision }
  route("gaits/:gaitId/draft", "routes/api.v1/gaits/draft.ts"),
];
