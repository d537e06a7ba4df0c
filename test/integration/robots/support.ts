// Helpers of the robot integration tests: reading revisions and counts back.
import { asc, count, eq } from "drizzle-orm";
import { robotRevisions, robots } from "../../../db/schema";
import { database } from "~/platform/db.server";

export async function revisionsOf(robotId: string) {
  return database().select().from(robotRevisions).where(eq(robotRevisions.robotId, robotId)).orderBy(asc(robotRevisions.number));
}

export async function robotCount(): Promise<number> {
  const [row] = await database().select({ n: count() }).from(robots);
  return row.n;
}

export async function revisionCount(): Promise<number> {
  const [row] = await database().select({ n: count() }).from(robotRevisions);
  return row.n;
}
