// Gait pages (version-routes), spread into app/routes.ts under the `gaits` prefix inside the shell.
import type { RouteConfigEntry } from "@react-router/dev/routes";

export const versionPages: RouteConfigEntry[] = [];
