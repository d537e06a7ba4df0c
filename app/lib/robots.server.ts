// Robots of a workspace, as lists and pages need them.
import { desc, eq, sql } from "drizzle-orm";
import { robotRevisions, robots } from "../../db/schema";
import { database } from "./db.server";

export type RobotListItem = {
  id: string;
  name: string;
  legCount: number;
  latestRevision: number;
  updatedAt: Date;
};

export async function listRobots(workspaceId: string): Promise<RobotListItem[]> {
  const rows = await database()
    .selectDistinctOn([robots.id], {
      id: robots.id,
      name: robots.name,
      latestRevision: robotRevisions.number,
      updatedAt: robotRevisions.createdAt,
      legCount: sql<number>`coalesce(jsonb_array_length(${robotRevisions.definition} -> 'legs'), 0)`.mapWith(Number),
    })
    .from(robots)
    .innerJoin(robotRevisions, eq(robotRevisions.robotId, robots.id))
    .where(eq(robots.workspaceId, workspaceId))
    .orderBy(robots.id, desc(robotRevisions.number));
  return rows.sort((a, b) => a.name.localeCompare(b.name));
}
