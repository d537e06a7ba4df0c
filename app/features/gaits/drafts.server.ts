// A gait's working draft: read it (made from the newest version, or from a
// template, the first time), save it with optimistic concurrency on
// draft_revision, and move it to the robot's newest revision on request.
// The draft is not a version; commitDraft (versions.server.ts) turns it into one.
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import { z } from "zod";
import { gaitVersions, gaits, robotRevisions, robots, users } from "../../../db/schema";
import type { Database } from "../../../db/client";
import { parseSequence, sequenceIssuesForRobot, type Sequence, type SequenceIssue } from "../../gait/index";
import type { Robot } from "../../kinematics/index";
import { recordAudit } from "../../platform/audit.server";
import { database, type Reader } from "../../platform/db.server";
import { robotOfRevision } from "../robots/index.server";
import { starterSequence } from "./editor/starter-sequence";
import { ServiceError } from "../../platform/errors.server";
import { formatTime } from "../../platform/format";

/** A draft is keys, not frames: a megabyte holds tens of thousands of keys. */
export const DRAFT_BODY_LIMIT_BYTES = 1024 * 1024;

export type DraftAuthor = { login: string; name: string } | null;

export type Draft = {
  gaitId: string;
  sequence: Sequence;
  /** Bumped by every save; a save names the revision it started from. */
  revision: number;
  updatedAt: string;
  updatedBy: DraftAuthor;
  robotRevision: { id: string; number: number };
};

export type DraftContext = Draft & {
  gait: { id: string; name: string; description: string; robotId: string; robotName: string };
  /** The robot definition of the pinned revision. */
  robot: Robot;
  newestRobotRevision: { id: string; number: number };
};

export type DraftActor = { userId: string; workspaceId: string };

/** What a `draft-conflict` refusal (a save that started from an older revision than the stored one) carries. */
export type DraftConflictDetails = { baseRevision: number; currentRevision: number; updatedAt: string; updatedBy: DraftAuthor };

/** A sequence that does not parse or does not fit the robot: 422 with the issues as details; nothing is saved. */
const invalidDraft = (message: string, issues: SequenceIssue[]) => new ServiceError(422, "invalid", message, issues);

export const draftSaveBody = z.strictObject({
  sequence: z.unknown().refine((value) => value !== undefined, "is required: the gait sequence (gaitloom.sequence/1)"),
  baseRevision: z.number({ error: "must be the draft revision the edits started from (a whole number)" }).int().min(0),
});

async function authorOf(db: Reader, userId: string | null): Promise<DraftAuthor> {
  if (!userId) return null;
  const [user] = await db.select({ login: users.login, name: users.name }).from(users).where(eq(users.id, userId));
  return user ?? null;
}

async function gaitRow(db: Reader, workspaceId: string, gaitId: string) {
  const [row] = await db
    .select({ gait: gaits, robotName: robots.name })
    .from(gaits)
    .innerJoin(robots, eq(robots.id, gaits.robotId))
    .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, workspaceId)));
  if (!row) throw new ServiceError(404, "not-found", "No such gait in this workspace.");
  return row;
}

async function newestRevision(db: Reader, robotId: string) {
  const [row] = await db.select().from(robotRevisions).where(eq(robotRevisions.robotId, robotId)).orderBy(desc(robotRevisions.number)).limit(1);
  if (!row) throw new ServiceError(409, "conflict", "The gait's robot has no revision to solve with.");
  return row;
}

const robotOf = (revision: typeof robotRevisions.$inferSelect): Robot => robotOfRevision(revision, { remedy: "move the draft to a newer revision" });

/** The first draft of a gait without one: its newest version, else the starter template for the robot. */
async function initialDraft(db: Reader, gait: typeof gaits.$inferSelect): Promise<{ sequence: unknown; robotRevisionId: string }> {
  const [version] = await db
    .select({ sequence: gaitVersions.sequence, robotRevisionId: gaitVersions.robotRevisionId })
    .from(gaitVersions)
    .where(eq(gaitVersions.gaitId, gait.id))
    .orderBy(desc(gaitVersions.number))
    .limit(1);
  if (version) return version;
  const revision = gait.draftRobotRevisionId
    ? (await db.select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId)))[0]
    : await newestRevision(db, gait.robotId);
  return { sequence: starterSequence(robotOf(revision), gait.name), robotRevisionId: revision.id };
}

/** The gait's draft with its pinned robot; made and stored the first time it is read. */
export async function readDraft(workspaceId: string, gaitId: string, db: Database = database()): Promise<DraftContext> {
  let { gait, robotName } = await gaitRow(db, workspaceId, gaitId);
  if (gait.draftSequence === null || gait.draftRobotRevisionId === null) {
    const initial = await initialDraft(db, gait);
    // Two first readers race harmlessly: only the one that finds the draft empty writes it.
    await db
      .update(gaits)
      .set({ draftSequence: initial.sequence, draftRobotRevisionId: gait.draftRobotRevisionId ?? initial.robotRevisionId })
      .where(and(eq(gaits.id, gait.id), isNull(gaits.draftSequence)));
    if (gait.draftRobotRevisionId === null && gait.draftSequence !== null) {
      await db
        .update(gaits)
        .set({ draftRobotRevisionId: initial.robotRevisionId })
        .where(and(eq(gaits.id, gait.id), isNull(gaits.draftRobotRevisionId)));
    }
    ({ gait, robotName } = await gaitRow(db, workspaceId, gaitId));
  }
  const [pinned] = await db.select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId!));
  const newest = await newestRevision(db, gait.robotId);
  const parsed = parseSequence(gait.draftSequence);
  if (!parsed.ok)
    throw new ServiceError(409, "conflict", `The stored draft is not a valid sequence: ${parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`);
  return {
    gaitId: gait.id,
    sequence: parsed.sequence,
    revision: gait.draftRevision,
    updatedAt: gait.draftUpdatedAt.toISOString(),
    updatedBy: await authorOf(db, gait.draftUpdatedById),
    robotRevision: { id: pinned.id, number: pinned.number },
    gait: { id: gait.id, name: gait.name, description: gait.description, robotId: gait.robotId, robotName },
    robot: robotOf(pinned),
    newestRobotRevision: { id: newest.id, number: newest.number },
  };
}

/** Parses an untrusted sequence for a robot; issues carry `sequence.`-prefixed paths. */
export function checkSequenceFor(robot: Robot, json: unknown): Sequence {
  const parsed = parseSequence(json);
  const prefix = (issues: SequenceIssue[]) => issues.map((issue) => ({ path: issue.path ? `sequence.${issue.path}` : "sequence", message: issue.message }));
  if (!parsed.ok) {
    throw invalidDraft(
      `The sequence is invalid (${parsed.issues.length} problem${parsed.issues.length === 1 ? "" : "s"}); nothing was saved.`,
      prefix(parsed.issues),
    );
  }
  const fit = sequenceIssuesForRobot(robot, parsed.sequence);
  if (fit.length > 0) throw invalidDraft(`The sequence does not fit robot "${robot.name}"; nothing was saved.`, prefix(fit));
  return parsed.sequence;
}

async function conflict(db: Reader, gaitId: string, baseRevision: number): Promise<never> {
  const [row] = await db
    .select({ revision: gaits.draftRevision, updatedAt: gaits.draftUpdatedAt, updatedById: gaits.draftUpdatedById })
    .from(gaits)
    .where(eq(gaits.id, gaitId));
  const updatedBy = await authorOf(db, row.updatedById);
  const details: DraftConflictDetails = { baseRevision, currentRevision: row.revision, updatedAt: row.updatedAt.toISOString(), updatedBy };
  throw new ServiceError(
    409,
    "draft-conflict",
    `Revision ${row.revision} of the draft was saved by ${updatedBy?.name ?? "someone"} at ${formatTime(row.updatedAt)} while you were editing revision ${baseRevision}. Nothing was saved.`,
    details,
  );
}

export type SavedDraft = { revision: number; updatedAt: string };

/**
 * Saves the draft if nobody saved since `baseRevision`: one conditional UPDATE, so two saves can never both win.
 * Autosaves are not written to the audit log (they come every few seconds); commits and moves are.
 */
export async function saveDraft(actor: DraftActor, gaitId: string, body: unknown, db: Database = database()): Promise<SavedDraft> {
  const input = draftSaveBody.safeParse(body);
  if (!input.success) {
    throw invalidDraft(
      "The body must be { sequence, baseRevision }.",
      input.error.issues.map((issue) => ({ path: issue.path.join(".") || "(body)", message: issue.message })),
    );
  }
  const { gait } = await gaitRow(db, actor.workspaceId, gaitId);
  if (!gait.draftRobotRevisionId) throw new ServiceError(409, "conflict", "Open the draft once before saving it: it is not pinned to a robot revision yet.");
  const [pinned] = await db.select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId));
  const sequence = checkSequenceFor(robotOf(pinned), input.data.sequence);
  const [saved] = await db
    .update(gaits)
    .set({ draftSequence: sequence, draftRevision: sql`${gaits.draftRevision} + 1`, draftUpdatedAt: sql`now()`, draftUpdatedById: actor.userId })
    .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, actor.workspaceId), eq(gaits.draftRevision, input.data.baseRevision)))
    .returning({ revision: gaits.draftRevision, updatedAt: gaits.draftUpdatedAt });
  if (!saved) return conflict(db, gaitId, input.data.baseRevision);
  return { revision: saved.revision, updatedAt: saved.updatedAt.toISOString() };
}

export type MovedDraft = SavedDraft & { from: number; to: number };

/** Pins the draft to the robot's newest revision (an explicit step: the solve may change). */
export async function moveDraftToNewestRobot(actor: DraftActor, gaitId: string, baseRevision: number, db: Database = database()): Promise<MovedDraft> {
  const { gait } = await gaitRow(db, actor.workspaceId, gaitId);
  const newest = await newestRevision(db, gait.robotId);
  const [pinned] = gait.draftRobotRevisionId ? await db.select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId)) : [];
  if (pinned && pinned.id === newest.id) throw new ServiceError(409, "conflict", `The draft already uses robot revision ${newest.number}, the newest.`);
  const parsed = parseSequence(gait.draftSequence);
  if (!parsed.ok) throw new ServiceError(409, "conflict", "Open the draft once before moving it: there is no stored draft yet.");
  const fit = sequenceIssuesForRobot(robotOf(newest), parsed.sequence);
  if (fit.length > 0) {
    throw invalidDraft(
      `The draft does not fit robot revision ${newest.number}: ${fit.map((issue) => `${issue.path} ${issue.message}`).join("; ")}. It stays on revision ${pinned?.number ?? "?"}.`,
      fit,
    );
  }
  return db.transaction(async (tx) => {
    const [saved] = await tx
      .update(gaits)
      .set({ draftRobotRevisionId: newest.id, draftRevision: sql`${gaits.draftRevision} + 1`, draftUpdatedAt: sql`now()`, draftUpdatedById: actor.userId })
      .where(and(eq(gaits.id, gaitId), eq(gaits.draftRevision, baseRevision)))
      .returning({ revision: gaits.draftRevision, updatedAt: gaits.draftUpdatedAt });
    if (!saved) return conflict(tx, gaitId, baseRevision);
    await recordAudit(
      {
        workspaceId: actor.workspaceId,
        actorId: actor.userId,
        action: "gait.draft.robot-moved",
        targetType: "gait",
        targetId: gaitId,
        details: { fromRobotRevision: pinned?.number ?? null, toRobotRevision: newest.number },
      },
      tx,
    );
    return { revision: saved.revision, updatedAt: saved.updatedAt.toISOString(), from: pinned?.number ?? 0, to: newest.number };
  });
}
