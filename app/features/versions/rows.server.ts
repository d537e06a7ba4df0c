// How a stored version reaches its gait (whose workspaceId scopes it) and the
// gait's robot: the joins every query of versions starts from. A caller gives
// its own `select(…).from(gaitVersions).$dynamic()`, adds its own joins (the
// pinned robot revision, the author) and always its workspace condition.
import { eq } from "drizzle-orm";
import type { PgSelect } from "drizzle-orm/pg-core";
import { gaitVersions, gaits, robots } from "../../../db/schema";

/** The gait's and its robot's id and name, as a version's row carries them. */
export const gaitColumns = { gaitId: gaits.id, gaitName: gaits.name, robotId: robots.id, robotName: robots.name };

export function withGait<Query extends PgSelect>(query: Query) {
  return query.innerJoin(gaits, eq(gaits.id, gaitVersions.gaitId)).innerJoin(robots, eq(robots.id, gaits.robotId));
}
