// Committing a gait's working draft as an immutable, numbered version.
import { and, eq, max } from "drizzle-orm";
import { gaitVersions, gaits, robotRevisions } from "../../db/schema";
import { parseSequence, solveSequence, type SolveSummary } from "../gait/index";
import { parseRobot } from "../kinematics/index";
import type { Database } from "../../db/client";
import { recordAudit } from "./audit.server";
import { versionContentHash } from "./content-hash.server";
import { database } from "./db.server";
import { ServiceError } from "./errors.server";

/** What a version keeps of its solve: enough for tables, lists and comparisons without solving again. */
export type VersionSummary = SolveSummary & { cycleMs: number; loop: boolean };

type Committer = { userId: string; workspaceId: string };

export async function commitDraft(
  committer: Committer,
  gaitId: string,
  message: string,
  db: Database = database(),
): Promise<{ id: string; number: number; contentHash: string }> {
  const text = message.trim();
  if (text.length < 1 || text.length > 500) throw new ServiceError(422, "Describe the version in 1 to 500 characters.", "message");
  return db.transaction(async (tx) => {
    // The gait row lock makes concurrent commits take turns: distinct numbers, none lost.
    const [gait] = await tx
      .select()
      .from(gaits)
      .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, committer.workspaceId)))
      .for("update");
    if (!gait) throw new ServiceError(404, "No such gait in this workspace.");
    if (!gait.draftSequence || !gait.draftRobotRevisionId) throw new ServiceError(409, "This gait has no working draft to commit.");
    const [revision] = await tx.select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId));
    const robot = parseRobot(revision.definition);
    if (!robot.ok) throw new ServiceError(409, `Robot revision ${revision.number} no longer parses; move the draft to a newer revision.`);
    const sequence = parseSequence(gait.draftSequence);
    if (!sequence.ok) {
      throw new ServiceError(422, `The draft is invalid: ${sequence.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`);
    }
    const solved = solveSequence(robot.robot, sequence.sequence);
    const summary: VersionSummary = { ...solved.summary, cycleMs: sequence.sequence.cycleMs, loop: sequence.sequence.loop };
    const [{ latest }] = await tx.select({ latest: max(gaitVersions.number) }).from(gaitVersions).where(eq(gaitVersions.gaitId, gaitId));
    const number = (latest ?? 0) + 1;
    const contentHash = versionContentHash(sequence.sequence, revision.definition);
    const [row] = await tx
      .insert(gaitVersions)
      .values({
        gaitId,
        number,
        message: text,
        authorId: committer.userId,
        robotRevisionId: revision.id,
        sequence: sequence.sequence,
        summary,
        contentHash,
      })
      .returning({ id: gaitVersions.id });
    await recordAudit(
      {
        workspaceId: committer.workspaceId,
        actorId: committer.userId,
        action: "version.committed",
        targetType: "gait",
        targetId: gaitId,
        details: { number, contentHash, errors: summary.errors, warnings: summary.warnings },
      },
      tx,
    );
    return { id: row.id, number, contentHash };
  });
}
