// Export pages (tables, calibration profiles, bring-up tables, API docs), spread into app/routes.ts inside the shell.
import type { RouteConfigEntry } from "@react-router/dev/routes";

export const exportPages: RouteConfigEntry[] = [];
