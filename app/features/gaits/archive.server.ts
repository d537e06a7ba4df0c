// Archiving a gait (kept, hidden from the usual lists, restorable) and
// deleting an archived one that nothing references: no version of it was ever
// released, since a firmware build may still fetch a released or retired
// version by its number (decision 012). Each step is in the audit log with
// the gait's name, so the log still names it once it is gone.
import { and, asc, count, eq, inArray } from "drizzle-orm";
import { gaitVersions, gaits, robots } from "../../../db/schema";
import { recordAudit } from "../../platform/audit.server";
import { database, type Tx } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";

export type Archivist = { userId: string; workspaceId: string };

export type ArchiveState = { id: string; name: string; archivedAt: Date | null };

const notFound = () => new ServiceError(404, "not-found", "There is no gait at this address in your workspace.");

async function lockedGait(tx: Tx, actor: Archivist, gaitId: string) {
  const [gait] = await tx
    .select({ id: gaits.id, name: gaits.name, archivedAt: gaits.archivedAt, robot: robots.name })
    .from(gaits)
    .innerJoin(robots, eq(robots.id, gaits.robotId))
    .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, actor.workspaceId)))
    .for("update", { of: gaits });
  if (!gait) throw notFound();
  return gait;
}

async function setArchived(actor: Archivist, gaitId: string, archived: boolean): Promise<ArchiveState> {
  return database().transaction(async (tx) => {
    const gait = await lockedGait(tx, actor, gaitId);
    // Archiving what is archived, or restoring what is not, changes nothing and logs nothing.
    if ((gait.archivedAt !== null) === archived) return { id: gait.id, name: gait.name, archivedAt: gait.archivedAt };
    const [changed] = await tx
      .update(gaits)
      .set(archived ? { archivedAt: new Date(), archivedById: actor.userId } : { archivedAt: null, archivedById: null })
      .where(eq(gaits.id, gait.id))
      .returning({ id: gaits.id, name: gaits.name, archivedAt: gaits.archivedAt });
    await recordAudit(
      {
        workspaceId: actor.workspaceId,
        actorId: actor.userId,
        action: archived ? "gait.archived" : "gait.restored",
        targetType: "gait",
        targetId: gait.id,
        details: { name: gait.name, robot: gait.robot },
      },
      tx,
    );
    return changed;
  });
}

export const archiveGait = (actor: Archivist, gaitId: string) => setArchived(actor, gaitId, true);

export const restoreGait = (actor: Archivist, gaitId: string) => setArchived(actor, gaitId, false);

const numbers = (list: number[]) => (list.length === 1 ? `version ${list[0]}` : `versions ${list.slice(0, -1).join(", ")} and ${list.at(-1)}`);

/**
 * Deletes an archived gait with its draft, versions and review history.
 * Refused (409) while it is not archived, or when any version of it was
 * released (released now, or retired by a later release): the refusal names
 * them, and `details.references` lists them.
 */
export async function deleteGait(actor: Archivist, gaitId: string): Promise<{ id: string; name: string }> {
  return database().transaction(async (tx) => {
    // The lock queues a commit or a release of this gait behind the delete (both lock the gait's row too).
    const gait = await lockedGait(tx, actor, gaitId);
    if (gait.archivedAt === null) {
      throw new ServiceError(
        409,
        "not-archived",
        `Archive ${gait.name} before deleting it: an archived gait can still be restored, a deleted one cannot. Nothing was deleted.`,
      );
    }
    const shipped = await tx
      .select({ id: gaitVersions.id, number: gaitVersions.number, state: gaitVersions.state })
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gait.id), inArray(gaitVersions.state, ["released", "retired"])))
      .orderBy(asc(gaitVersions.number));
    if (shipped.length > 0) {
      const one = shipped.length === 1;
      throw new ServiceError(
        409,
        "referenced",
        `${gait.name} cannot be deleted: ${numbers(shipped.map((version) => version.number))} ${one ? "was" : "were"} released, and firmware builds may still fetch ${one ? "it" : "them"}. ` +
          "Keep the gait archived instead. Nothing was deleted.",
        { references: shipped.map((version) => ({ kind: "version", id: version.id, number: version.number, state: version.state })) },
      );
    }
    const [{ versions }] = await tx.select({ versions: count() }).from(gaitVersions).where(eq(gaitVersions.gaitId, gait.id));
    await tx.delete(gaits).where(eq(gaits.id, gait.id));
    await recordAudit(
      {
        workspaceId: actor.workspaceId,
        actorId: actor.userId,
        action: "gait.deleted",
        targetType: "gait",
        targetId: gait.id,
        details: { name: gait.name, robot: gait.robot, versions },
      },
      tx,
    );
    return { id: gait.id, name: gait.name };
  });
}
