// Archiving a robot (kept, hidden from the usual lists, restorable) and
// deleting an archived one that nothing references any more: no gait, archived
// or not, uses it (decision 012). Each step is in the audit log with the
// robot's name, so the log still names it once it is gone.
import { and, asc, count, eq } from "drizzle-orm";
import { gaits, robotRevisions, robots } from "../../../db/schema";
import { recordAudit } from "../../platform/audit.server";
import { database, type Tx } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";

export type Archivist = { userId: string; workspaceId: string };

export type ArchiveState = { id: string; name: string; archivedAt: Date | null };

const notFound = () => new ServiceError(404, "not-found", "There is no robot at this address in your workspace.");

async function lockedRobot(tx: Tx, actor: Archivist, robotId: string) {
  const [robot] = await tx
    .select({ id: robots.id, name: robots.name, archivedAt: robots.archivedAt })
    .from(robots)
    .where(and(eq(robots.id, robotId), eq(robots.workspaceId, actor.workspaceId)))
    .for("update");
  if (!robot) throw notFound();
  return robot;
}

async function setArchived(actor: Archivist, robotId: string, archived: boolean): Promise<ArchiveState> {
  return database().transaction(async (tx) => {
    const robot = await lockedRobot(tx, actor, robotId);
    // Archiving what is archived, or restoring what is not, changes nothing and logs nothing.
    if ((robot.archivedAt !== null) === archived) return robot;
    const [changed] = await tx
      .update(robots)
      .set(archived ? { archivedAt: new Date(), archivedById: actor.userId } : { archivedAt: null, archivedById: null })
      .where(eq(robots.id, robot.id))
      .returning({ id: robots.id, name: robots.name, archivedAt: robots.archivedAt });
    await recordAudit(
      {
        workspaceId: actor.workspaceId,
        actorId: actor.userId,
        action: archived ? "robot.archived" : "robot.restored",
        targetType: "robot",
        targetId: robot.id,
        details: { name: robot.name },
      },
      tx,
    );
    return changed;
  });
}

export const archiveRobot = (actor: Archivist, robotId: string) => setArchived(actor, robotId, true);

export const restoreRobot = (actor: Archivist, robotId: string) => setArchived(actor, robotId, false);

/** "A, B and C", or the first few and how many more. */
export function listNames(names: string[], most = 5): string {
  const shown = names.slice(0, most);
  const more = names.length - shown.length;
  if (more > 0) return `${shown.join(", ")} and ${more} more`;
  return shown.length <= 1 ? (shown[0] ?? "") : `${shown.slice(0, -1).join(", ")} and ${shown.at(-1)}`;
}

/**
 * Deletes an archived robot with its revisions and calibration profiles.
 * Refused (409) while it is not archived, or while any gait uses it: the
 * refusal names them, and `details.references` lists them.
 */
export async function deleteRobot(actor: Archivist, robotId: string): Promise<{ id: string; name: string }> {
  return database().transaction(async (tx) => {
    // The lock makes a gait being created on this robot wait, then fail: none slips in between the check and the delete.
    const robot = await lockedRobot(tx, actor, robotId);
    if (robot.archivedAt === null) {
      throw new ServiceError(
        409,
        "not-archived",
        `Archive ${robot.name} before deleting it: an archived robot can still be restored, a deleted one cannot. Nothing was deleted.`,
      );
    }
    const users = await tx
      .select({ id: gaits.id, name: gaits.name, archivedAt: gaits.archivedAt })
      .from(gaits)
      .where(eq(gaits.robotId, robot.id))
      .orderBy(asc(gaits.name));
    if (users.length > 0) {
      const one = users.length === 1;
      throw new ServiceError(
        409,
        "referenced",
        `${robot.name} cannot be deleted: ${users.length} gait${one ? "" : "s"} use${one ? "s" : ""} it (${listNames(users.map((gait) => gait.name))}). ` +
          `Delete ${one ? "that gait" : "those gaits"} first, or keep the robot archived. Nothing was deleted.`,
        { references: users.map((gait) => ({ kind: "gait", id: gait.id, name: gait.name, archived: gait.archivedAt !== null })) },
      );
    }
    const [{ revisions }] = await tx.select({ revisions: count() }).from(robotRevisions).where(eq(robotRevisions.robotId, robot.id));
    await tx.delete(robots).where(eq(robots.id, robot.id));
    await recordAudit(
      {
        workspaceId: actor.workspaceId,
        actorId: actor.userId,
        action: "robot.deleted",
        targetType: "robot",
        targetId: robot.id,
        details: { name: robot.name, revisions },
      },
      tx,
    );
    return { id: robot.id, name: robot.name };
  });
}
