// Gaits of a workspace, with their newest and released versions; optionally
// those of one robot only.
import { and, eq, isNotNull, isNull, sql } from "drizzle-orm";
import { gaitVersions, gaits, robots, type VersionState } from "../../../db/schema";
import { database } from "../../platform/db.server";

export type GaitListItem = {
  id: string;
  name: string;
  description: string;
  robotId: string;
  robotName: string;
  versionCount: number;
  latestVersion: number | null;
  latestState: VersionState | null;
  releasedVersion: number | null;
  /** Versions waiting in review. */
  inReview: number;
  archivedAt: Date | null;
  robotArchived: boolean;
};

/** The workspace's gaits (of one robot, when given): those in use, or (`archived`) the archived ones. */
export async function listGaits(workspaceId: string, filter: { robotId?: string; archived?: boolean } = {}): Promise<GaitListItem[]> {
  return database()
    .select({
      id: gaits.id,
      name: gaits.name,
      description: gaits.description,
      robotId: robots.id,
      robotName: robots.name,
      versionCount: sql<number>`count(${gaitVersions.id})`.mapWith(Number),
      latestVersion: sql<number | null>`max(${gaitVersions.number})`,
      latestState: sql<VersionState | null>`(array_agg(${gaitVersions.state} order by ${gaitVersions.number} desc) filter (where ${gaitVersions.id} is not null))[1]`,
      releasedVersion: sql<number | null>`max(${gaitVersions.number}) filter (where ${gaitVersions.state} = 'released')`,
      inReview: sql<number>`count(${gaitVersions.id}) filter (where ${gaitVersions.state} = 'in-review')`.mapWith(Number),
      archivedAt: gaits.archivedAt,
      robotArchived: sql<boolean>`${robots.archivedAt} is not null`,
    })
    .from(gaits)
    .innerJoin(robots, eq(robots.id, gaits.robotId))
    .leftJoin(gaitVersions, eq(gaitVersions.gaitId, gaits.id))
    .where(
      and(
        eq(gaits.workspaceId, workspaceId),
        filter.robotId ? eq(gaits.robotId, filter.robotId) : undefined,
        filter.archived ? isNotNull(gaits.archivedAt) : isNull(gaits.archivedAt),
      ),
    )
    .groupBy(gaits.id, robots.id, robots.name)
    .orderBy(robots.name, gaits.name);
}
