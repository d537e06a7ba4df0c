// Gait resource routes (version-routes), spread into app/routes.ts under `api/v1` (outside the shell).
import type { RouteConfigEntry } from "@react-router/dev/routes";

export const versionApi: RouteConfigEntry[] = [];
