// Gaits of a workspace, with their newest and released versions.
import { eq, sql } from "drizzle-orm";
import { gaitVersions, gaits, robots } from "../../db/schema";
import { database } from "./db.server";

export type GaitListItem = {
  id: string;
  name: string;
  robotName: string;
  versionCount: number;
  latestVersion: number | null;
  releasedVersion: number | null;
};

export async function listGaits(workspaceId: string): Promise<GaitListItem[]> {
  return database()
    .select({
      id: gaits.id,
      name: gaits.name,
      robotName: robots.name,
      versionCount: sql<number>`count(${gaitVersions.id})`.mapWith(Number),
      latestVersion: sql<number | null>`max(${gaitVersions.number})`,
      releasedVersion: sql<number | null>`max(${gaitVersions.number}) filter (where ${gaitVersions.state} = 'released')`,
    })
    .from(gaits)
    .innerJoin(robots, eq(robots.id, gaits.robotId))
    .leftJoin(gaitVersions, eq(gaitVersions.gaitId, gaits.id))
    .where(eq(gaits.workspaceId, workspaceId))
    .groupBy(gaits.id, robots.name)
    .orderBy(robots.name, gaits.name);
}
