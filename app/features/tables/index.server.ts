// What other features use of angle tables. All of it is server-side: query.ts
// has no database but hashes with node:crypto and throws ServiceError, so
// there is no browser-safe index.ts.
export { RELEASE_TABLE, benchQuerySchema, matchesIfNoneMatch, tableQuerySchema } from "./query";
export { checkReleaseTable, recordReleaseTable, type ReleaseTableCheck } from "./releases.server";
