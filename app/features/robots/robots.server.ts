// Robots of a workspace: lists, pages, revisions, and the writes that make new
// revisions. Every save is a new immutable robot_revisions row, written in one
// transaction with optimistic concurrency on the revision number it started from.
import { and, desc, eq, isNotNull, isNull, ne, sql } from "drizzle-orm";
import { robotRevisions, robots, users, type Role } from "../../../db/schema";
import { parseRobot, type DefinitionIssue, type Robot } from "~/kinematics";
import { recordAudit } from "../../platform/audit.server";
import { database, isUniqueViolation, type Reader } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { formatTime } from "../../platform/format";
import { runCoreTask } from "../../platform/worker-pool.server";
import { can, ROLE_LABELS } from "../../platform/permissions";
import { changedFields, describeChange, nonCalibrationChanges, summarizeChanges, type FieldChange } from "./changes";
import type { SaveRefusalDetails } from "./results";
import { starterRobot, type StarterLegCount } from "./starter";

export type RobotListItem = {
  id: string;
  name: string;
  legCount: number;
  latestRevision: number;
  updatedAt: Date;
  archivedAt: Date | null;
};

export type RevisionAuthor = { login: string; name: string } | null;

export type RevisionSummary = {
  number: number;
  message: string;
  author: RevisionAuthor;
  createdAt: Date;
};

export type RevisionDetail = RevisionSummary & { definition: Robot };

export type RobotDetail = {
  id: string;
  name: string;
  createdAt: Date;
  /** When the robot was archived; null while it is in use. */
  archivedAt: Date | null;
  latest: RevisionDetail;
  revisions: RevisionSummary[];
};

/** The workspace's robots by name: those in use, or (`archived`) the archived ones, or (`"any"`) both. */
export async function listRobots(workspaceId: string, { archived = false }: { archived?: boolean | "any" } = {}): Promise<RobotListItem[]> {
  const rows = await database()
    .selectDistinctOn([robots.id], {
      id: robots.id,
      name: robots.name,
      latestRevision: robotRevisions.number,
      updatedAt: robotRevisions.createdAt,
      legCount: sql<number>`coalesce(jsonb_array_length(${robotRevisions.definition} -> 'legs'), 0)`.mapWith(Number),
      archivedAt: robots.archivedAt,
    })
    .from(robots)
    .innerJoin(robotRevisions, eq(robotRevisions.robotId, robots.id))
    .where(and(eq(robots.workspaceId, workspaceId), archived === "any" ? undefined : archived ? isNotNull(robots.archivedAt) : isNull(robots.archivedAt)))
    .orderBy(robots.id, desc(robotRevisions.number));
  return rows.sort((a, b) => a.name.localeCompare(b.name));
}

const revisionColumns = {
  number: robotRevisions.number,
  message: robotRevisions.message,
  createdAt: robotRevisions.createdAt,
  authorLogin: users.login,
  authorName: users.name,
};

type RevisionRow = { number: number; message: string; createdAt: Date; authorLogin: string | null; authorName: string | null };

const summaryOf = (row: RevisionRow): RevisionSummary => ({
  number: row.number,
  message: row.message,
  createdAt: row.createdAt,
  author: row.authorLogin ? { login: row.authorLogin, name: row.authorName ?? row.authorLogin } : null,
});

async function robotInWorkspace(workspaceId: string, robotId: string) {
  const [robot] = await database()
    .select()
    .from(robots)
    .where(and(eq(robots.id, robotId), eq(robots.workspaceId, workspaceId)));
  return robot ?? null;
}

/** A robot of this workspace with its newest revision's definition; null when there is no such robot. */
export async function newestRevisionInWorkspace(workspaceId: string, robotId: string, db: Reader = database()) {
  const [row] = await db
    .select({ id: robots.id, name: robots.name, revisionId: robotRevisions.id, revision: robotRevisions.number, definition: robotRevisions.definition })
    .from(robots)
    .innerJoin(robotRevisions, eq(robotRevisions.robotId, robots.id))
    .where(and(eq(robots.id, robotId), eq(robots.workspaceId, workspaceId)))
    .orderBy(desc(robotRevisions.number))
    .limit(1);
  return row ?? null;
}

/** The robot with its newest definition and every revision, newest first; null when not in this workspace. */
export async function getRobot(workspaceId: string, robotId: string): Promise<RobotDetail | null> {
  const robot = await robotInWorkspace(workspaceId, robotId);
  if (!robot) return null;
  const rows = await database()
    .select({ ...revisionColumns, definition: robotRevisions.definition })
    .from(robotRevisions)
    .leftJoin(users, eq(users.id, robotRevisions.authorId))
    .where(eq(robotRevisions.robotId, robotId))
    .orderBy(desc(robotRevisions.number));
  if (rows.length === 0) return null;
  return {
    id: robot.id,
    name: robot.name,
    createdAt: robot.createdAt,
    archivedAt: robot.archivedAt,
    latest: { ...summaryOf(rows[0]), definition: rows[0].definition as Robot },
    revisions: rows.map(summaryOf),
  };
}

/** One revision of a robot with its definition; null when the robot or the number is not there. */
export async function getRevision(
  workspaceId: string,
  robotId: string,
  number: number,
): Promise<{ robot: { id: string; name: string }; revision: RevisionDetail; latestNumber: number } | null> {
  const robot = await robotInWorkspace(workspaceId, robotId);
  if (!robot) return null;
  const db = database();
  const [row] = await db
    .select({ ...revisionColumns, definition: robotRevisions.definition })
    .from(robotRevisions)
    .leftJoin(users, eq(users.id, robotRevisions.authorId))
    .where(and(eq(robotRevisions.robotId, robotId), eq(robotRevisions.number, number)));
  if (!row) return null;
  const [latest] = await db
    .select({ number: robotRevisions.number })
    .from(robotRevisions)
    .where(eq(robotRevisions.robotId, robotId))
    .orderBy(desc(robotRevisions.number))
    .limit(1);
  return {
    robot: { id: robot.id, name: robot.name },
    revision: { ...summaryOf(row), definition: row.definition as Robot },
    latestNumber: latest.number,
  };
}

// ---------------------------------------------------------------------------
// Refusals of the writes: nothing is saved on any of them

const invalidDefinition = (issues: DefinitionIssue[]) =>
  new ServiceError(422, "invalid", `The definition has ${issues.length === 1 ? "1 problem" : `${issues.length} problems`}. Nothing was saved.`, { issues });

/** The URDF importer's report goes with a refusal too, so the person sees what was mapped. */
const nameTakenError = (name: string, report?: string[]) =>
  new ServiceError(
    409,
    "name-taken",
    `Another robot in this workspace is already called "${name}": give this one another name. Nothing was saved.`,
    report ? { report } : undefined,
  );

function staleError(baseRevision: number, latest: RevisionSummary): ServiceError {
  const details: SaveRefusalDetails = {
    baseRevision,
    latest: { number: latest.number, authorName: latest.author?.name ?? null, createdAt: latest.createdAt.toISOString(), message: latest.message },
  };
  return new ServiceError(
    409,
    "stale",
    `Revision ${latest.number} was saved by ${latest.author?.name ?? "someone"} at ${formatTime(latest.createdAt)} while you were editing revision ${baseRevision}. Nothing was saved.`,
    details,
  );
}

function calibrationOnlyError(role: Role, changes: FieldChange[]): ServiceError {
  const [first, ...others] = changes;
  const more =
    others.length === 0
      ? ""
      : ` and ${others.length} more field${others.length === 1 ? "" : "s"} (${others
          .slice(0, 3)
          .map((change) => change.path)
          .join(", ")}${others.length > 3 ? ", …" : ""})`;
  return new ServiceError(
    403,
    "forbidden",
    `${ROLE_LABELS[role]} can change only zero offsets and servo mapping; this save also changes ${describeChange(first)}${more}. Nothing was saved.`,
  );
}

// ---------------------------------------------------------------------------
// Creating robots

export type CreatedRobot = { robotId: string; name: string };

type Creation = { workspaceId: string; authorId: string; message: string; source: string; report?: string[] };

async function nameTaken(db: Reader, workspaceId: string, name: string, exceptRobotId?: string): Promise<boolean> {
  const rows = await db
    .select({ id: robots.id })
    .from(robots)
    .where(and(eq(robots.workspaceId, workspaceId), sql`lower(${robots.name}) = lower(${name})`, exceptRobotId ? ne(robots.id, exceptRobotId) : undefined));
  return rows.length > 0;
}

/** A new robot with `definition` (already valid) as revision 1. */
async function insertRobot(definition: Robot, creation: Creation): Promise<CreatedRobot> {
  try {
    return await database().transaction(async (tx) => {
      if (await nameTaken(tx, creation.workspaceId, definition.name)) throw nameTakenError(definition.name, creation.report);
      const [robot] = await tx
        .insert(robots)
        .values({ workspaceId: creation.workspaceId, name: definition.name, createdById: creation.authorId })
        .returning({ id: robots.id });
      await tx.insert(robotRevisions).values({
        robotId: robot.id,
        number: 1,
        definition,
        message: creation.message,
        authorId: creation.authorId,
      });
      await recordAudit(
        {
          workspaceId: creation.workspaceId,
          actorId: creation.authorId,
          action: "robot.create",
          targetType: "robot",
          targetId: robot.id,
          details: { name: definition.name, source: creation.source },
        },
        tx,
      );
      return { robotId: robot.id, name: definition.name };
    });
  } catch (error) {
    if (isUniqueViolation(error, "robots_workspace_name")) throw nameTakenError(definition.name, creation.report);
    throw error;
  }
}

/** Validates an uploaded definition (a name given here replaces the file's) and creates the robot. */
export async function createRobotFromDefinition(
  json: unknown,
  options: { workspaceId: string; authorId: string; fileName: string; name?: string },
): Promise<CreatedRobot> {
  const renamed = options.name && json !== null && typeof json === "object" && !Array.isArray(json) ? { ...json, name: options.name } : json;
  const parsed = parseRobot(renamed);
  if (!parsed.ok) throw invalidDefinition(parsed.issues);
  return insertRobot(parsed.robot, {
    workspaceId: options.workspaceId,
    authorId: options.authorId,
    message: `Uploaded from ${options.fileName}`,
    source: "upload",
  });
}

/** Imports a URDF file and, when it maps, creates the robot; the report says what was mapped. */
export async function createRobotFromUrdf(
  xml: string,
  options: { workspaceId: string; authorId: string; fileName: string; name?: string },
): Promise<CreatedRobot & { report: string[] }> {
  // Parsing up to a megabyte of XML takes a while: on the worker pool.
  const imported = await runCoreTask("urdf", { xml, options: options.name ? { name: options.name } : {} });
  if (!imported.ok) throw new ServiceError(422, "invalid", `${options.fileName} cannot be imported. Nothing was saved.`, { issues: imported.issues });
  const created = await insertRobot(imported.robot, {
    workspaceId: options.workspaceId,
    authorId: options.authorId,
    message: `Imported from URDF ${options.fileName}`,
    source: "urdf",
    report: imported.report,
  });
  return { ...created, report: imported.report };
}

export type NewRobotSource = { kind: "robot"; robotId: string } | { kind: "starter"; legCount: StarterLegCount };

/** A new robot from a copy of another robot's newest definition, or from the starter template. */
export async function createRobotFrom(source: NewRobotSource, options: { workspaceId: string; authorId: string; name: string }): Promise<CreatedRobot> {
  if (source.kind === "starter") {
    return insertRobot(starterRobot(options.name, source.legCount), {
      ...options,
      message: `Started from the ${source.legCount}-leg template`,
      source: "starter",
    });
  }
  const original = await getRobot(options.workspaceId, source.robotId);
  if (!original) throw new ServiceError(404, "not-found", "The robot to copy is not in this workspace (it may have been removed).");
  const parsed = parseRobot({ ...original.latest.definition, name: options.name });
  if (!parsed.ok) throw invalidDefinition(parsed.issues);
  return insertRobot(parsed.robot, {
    ...options,
    message: `Copied from ${original.name}, revision ${original.latest.number}`,
    source: "copy",
  });
}

// ---------------------------------------------------------------------------
// Saving a revision

export type SavedRevision = { number: number; message: string };

export type SaveRequest = {
  workspaceId: string;
  robotId: string;
  author: { id: string; role: Role };
  baseRevision: number;
  definition: unknown;
  message: string;
};

/**
 * Saves `definition` as the robot's next revision if `baseRevision` is still the
 * newest one. A role that may only calibrate (firmware) may change zero offsets
 * and servo mappings and nothing else, compared with the newest definition.
 */
export async function saveRevision(save: SaveRequest): Promise<SavedRevision> {
  const parsed = parseRobot(save.definition);
  if (!parsed.ok) throw invalidDefinition(parsed.issues);
  const definition = parsed.robot;
  const notFound = () => new ServiceError(404, "not-found", "There is no robot at this address in your workspace.");
  try {
    return await database().transaction(async (tx) => {
      // The row lock makes concurrent saves of one robot take turns, so exactly
      // one of two saves from the same base wins and the other sees it.
      const [robot] = await tx
        .select()
        .from(robots)
        .where(and(eq(robots.id, save.robotId), eq(robots.workspaceId, save.workspaceId)))
        .for("update");
      if (!robot) throw notFound();
      const [latest] = await tx
        .select({ ...revisionColumns, definition: robotRevisions.definition })
        .from(robotRevisions)
        .leftJoin(users, eq(users.id, robotRevisions.authorId))
        .where(eq(robotRevisions.robotId, robot.id))
        .orderBy(desc(robotRevisions.number))
        .limit(1);
      if (!latest) throw notFound();
      if (latest.number !== save.baseRevision) throw staleError(save.baseRevision, summaryOf(latest));

      if (!can(save.author.role, "robots.edit")) {
        const forbidden = nonCalibrationChanges(latest.definition, definition);
        if (forbidden.length > 0) throw calibrationOnlyError(save.author.role, forbidden);
      }
      const changes = changedFields(latest.definition, definition);
      if (changes.length === 0) throw new ServiceError(422, "unchanged", `Nothing changed since revision ${latest.number}, so nothing was saved.`);
      if (definition.name !== robot.name && (await nameTaken(tx, save.workspaceId, definition.name, robot.id))) throw nameTakenError(definition.name);

      const number = latest.number + 1;
      const message = save.message.trim() || summarizeChanges(changes);
      await tx.insert(robotRevisions).values({ robotId: robot.id, number, definition, message, authorId: save.author.id });
      if (definition.name !== robot.name) await tx.update(robots).set({ name: definition.name }).where(eq(robots.id, robot.id));
      await recordAudit(
        {
          workspaceId: save.workspaceId,
          actorId: save.author.id,
          action: "robot.save",
          targetType: "robot",
          targetId: robot.id,
          // The name as saved, so the entry names the robot even after a later rename or deletion.
          details: {
            name: definition.name,
            ...(definition.name !== robot.name ? { renamedFrom: robot.name } : {}),
            revision: number,
            changedFields: changes.length,
          },
        },
        tx,
      );
      return { number, message };
    });
  } catch (error) {
    if (isUniqueViolation(error, "robots_workspace_name")) throw nameTakenError(definition.name);
    if (isUniqueViolation(error, "robot_revisions_robot_number")) {
      // Only reachable if a writer skipped the row lock; the number it took is the newest now.
      const current = await getRobot(save.workspaceId, save.robotId);
      if (current) throw staleError(save.baseRevision, current.revisions[0]);
    }
    throw error;
  }
}
