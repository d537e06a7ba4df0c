// A robot's stored revisions as the database tests need them: the newest, and
// a newer one saved on top of it (the same definition unless given another).
import { desc, eq } from "drizzle-orm";
import type { Database } from "../../db/client";
import { robotRevisions } from "../../db/schema";

export async function newestRobotRevision(db: Database, robotId: string) {
  const [latest] = await db.select().from(robotRevisions).where(eq(robotRevisions.robotId, robotId)).orderBy(desc(robotRevisions.number)).limit(1);
  return latest;
}

/** Saves the robot's next revision; returns it and the one it follows. */
export async function addRobotRevision(db: Database, robotId: string, change: { definition?: unknown; message?: string } = {}) {
  const latest = await newestRobotRevision(db, robotId);
  const [newer] = await db
    .insert(robotRevisions)
    .values({
      robotId,
      number: latest.number + 1,
      definition: change.definition ?? latest.definition,
      ...(change.message === undefined ? {} : { message: change.message }),
    })
    .returning();
  return { latest, newer };
}
