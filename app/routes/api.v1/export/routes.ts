// Export resource routes (angle tables, OpenAPI, sequence schema), spread into app/routes.ts under `api/v1`.
import type { RouteConfigEntry } from "@react-router/dev/routes";

export const exportApi: RouteConfigEntry[] = [];
