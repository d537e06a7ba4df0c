// Gait versions: committing the working draft as an immutable, numbered
// version; starting a new draft from any version; the version table of a
// gait; one version with its review history; and the comparison of two.
// Content never changes after the insert (a trigger refuses it); review state
// moves in app/features/versions/review.server.ts.
import { and, asc, desc, eq, ilike, max, sql, type SQL } from "drizzle-orm";
import { alias, type PgSelect } from "drizzle-orm/pg-core";
import { gaitVersions, gaits, reviewEvents, robotRevisions, robots, users, type VersionState } from "../../../db/schema";
import { parseSequence, sequenceIssuesForRobot, type Flag, type Sequence, type SolveSummary, type SolvedSequence } from "../../gait/index";
import type { Robot } from "../../kinematics/index";
import type { Database } from "../../../db/client";
import { recordAudit } from "../../platform/audit.server";
import {
  diffSequences,
  groupFlags,
  jointOverlays,
  metricDeltas,
  playbackOf,
  robotRevisionDiff,
  type AngleFrames,
  type FlagGroup,
  type JointOverlay,
  type MetricRow,
  type Playback,
  type RobotRevisionDiff,
  type SequenceDiff,
} from "../compare/index";
import { versionContentHash } from "./content-hash.server";
import { gaitColumns, withGait } from "./rows.server";
import { database } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { runCoreTask } from "../../platform/worker-pool.server";
import { robotOfRevision } from "../robots/index.server";

/** What a version keeps of its solve: enough for tables, lists and comparisons without solving again. */
export type VersionSummary = SolveSummary & { cycleMs: number; loop: boolean };

export type Person = { id: string; login: string; name: string } | null;

/** Who commits or restores: a person in a workspace. */
export type Committer = { userId: string; workspaceId: string };

const MESSAGE_LIMIT = 500;

function issuesText(issues: readonly { path: string; message: string }[]): string {
  const shown = issues.slice(0, 5).map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message));
  return shown.join("; ") + (issues.length > 5 ? `; and ${issues.length - 5} more` : "");
}

/**
 * Commits the gait's working draft as the next numbered version: the message,
 * the author, the pinned robot revision, the full sequence, its solved summary
 * and the content hash. The gait row is locked for the transaction, so
 * concurrent commits take turns: distinct numbers, none lost. With
 * `draftRevision`, the commit is refused (409) when the draft has moved on
 * since the committer saw it.
 */
export async function commitDraft(
  committer: Committer,
  gaitId: string,
  message: string,
  db: Database = database(),
  options: { draftRevision?: number } = {},
): Promise<{ id: string; number: number; contentHash: string }> {
  const text = message.trim();
  if (text.length < 1 || text.length > MESSAGE_LIMIT) {
    throw new ServiceError(422, "invalid", `Describe the version in 1 to ${MESSAGE_LIMIT} characters.`, { field: "message" });
  }
  return db.transaction(async (tx) => {
    const [gait] = await tx
      .select()
      .from(gaits)
      .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, committer.workspaceId)))
      .for("update");
    if (!gait) throw new ServiceError(404, "not-found", "No such gait in this workspace.");
    if (!gait.draftSequence || !gait.draftRobotRevisionId) throw new ServiceError(409, "conflict", "This gait has no working draft to commit.");
    if (options.draftRevision !== undefined && options.draftRevision !== gait.draftRevision) {
      throw new ServiceError(
        409,
        "stale",
        `The draft changed since you opened it (draft revision ${options.draftRevision}, now ${gait.draftRevision}); reload to see it before committing.`,
      );
    }
    const [revision] = await tx.select().from(robotRevisions).where(eq(robotRevisions.id, gait.draftRobotRevisionId));
    if (!revision || revision.robotId !== gait.robotId)
      throw new ServiceError(409, "conflict", "The draft pins a revision of another robot; pin one of this gait's robot.");
    const robot = robotOfRevision(revision, { remedy: "move the draft to a newer revision" });
    const sequence = parseSequence(gait.draftSequence);
    if (!sequence.ok) throw new ServiceError(422, "invalid", `The draft is invalid: ${issuesText(sequence.issues)}`);
    const misfits = sequenceIssuesForRobot(robot, sequence.sequence);
    if (misfits.length > 0) throw new ServiceError(422, "invalid", `The draft does not fit robot revision ${revision.number}: ${issuesText(misfits)}`);
    // The gait's row is held (for update) from the start, so racing commits of
    // one gait come here one at a time, each seeing the version the one before made.
    const contentHash = versionContentHash(sequence.sequence, revision.definition);
    const [newest] = await tx
      .select({ id: gaitVersions.id, number: gaitVersions.number, contentHash: gaitVersions.contentHash })
      .from(gaitVersions)
      .where(eq(gaitVersions.gaitId, gaitId))
      .orderBy(desc(gaitVersions.number))
      .limit(1);
    if (newest?.contentHash === contentHash) {
      throw new ServiceError(
        409,
        "unchanged",
        `Nothing to commit: the draft is version ${newest.number} as it stands (the same sequence on the same robot revision). Change the draft first.`,
        { versionId: newest.id, number: newest.number },
      );
    }
    const solved = await runCoreTask("summary", { robot, sequence: sequence.sequence });
    if (!solved.ok) throw new ServiceError(422, "invalid", `The draft cannot be solved: ${issuesText(solved.refusal.issues)}`);
    const summary: VersionSummary = { ...solved.summary, cycleMs: sequence.sequence.cycleMs, loop: sequence.sequence.loop };
    const number = (newest?.number ?? 0) + 1;
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
        state: "committed",
      })
      .returning({ id: gaitVersions.id });
    await tx.insert(reviewEvents).values({ versionId: row.id, actorId: committer.userId, fromState: null, toState: "committed" });
    await recordAudit(
      {
        workspaceId: committer.workspaceId,
        actorId: committer.userId,
        action: "version.committed",
        targetType: "gait",
        targetId: gaitId,
        details: {
          versionId: row.id,
          number,
          contentHash,
          robotRevision: revision.number,
          draftRevision: gait.draftRevision,
          errors: summary.errors,
          warnings: summary.warnings,
        },
      },
      tx,
    );
    return { id: row.id, number, contentHash };
  });
}

/**
 * Starts the working draft over from a version (restore, or branch from an
 * older one): its sequence and its robot revision are copied into the draft.
 * Optimistic concurrency as for every draft save: refused (409) unless the
 * draft is still at `draftRevision`; the draft revision goes up by one.
 */
export async function restoreDraft(
  member: Committer,
  gaitId: string,
  versionId: string,
  draftRevision: number,
  db: Database = database(),
): Promise<{ draftRevision: number; number: number }> {
  return db.transaction(async (tx) => {
    const [version] = await tx
      .select({ id: gaitVersions.id, number: gaitVersions.number, sequence: gaitVersions.sequence, robotRevisionId: gaitVersions.robotRevisionId })
      .from(gaitVersions)
      .innerJoin(gaits, eq(gaits.id, gaitVersions.gaitId))
      .where(and(eq(gaitVersions.id, versionId), eq(gaitVersions.gaitId, gaitId), eq(gaits.workspaceId, member.workspaceId)));
    if (!version) throw new ServiceError(404, "not-found", "No such version of this gait.");
    const updated = await tx
      .update(gaits)
      .set({
        draftSequence: version.sequence,
        draftRobotRevisionId: version.robotRevisionId,
        draftRevision: sql`${gaits.draftRevision} + 1`,
        draftUpdatedAt: new Date(),
        draftUpdatedById: member.userId,
      })
      .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, member.workspaceId), eq(gaits.draftRevision, draftRevision)))
      .returning({ draftRevision: gaits.draftRevision });
    if (updated.length === 0) {
      const [current] = await tx.select({ draftRevision: gaits.draftRevision }).from(gaits).where(eq(gaits.id, gaitId));
      throw new ServiceError(
        409,
        "stale",
        `The draft changed since you loaded this page (draft revision ${draftRevision}, now ${current?.draftRevision ?? "gone"}); reload and try again, so no one's edits are lost.`,
      );
    }
    await recordAudit(
      {
        workspaceId: member.workspaceId,
        actorId: member.userId,
        action: "draft.restored",
        targetType: "gait",
        targetId: gaitId,
        details: { fromVersion: version.number, versionId: version.id, draftRevision: updated[0].draftRevision },
      },
      tx,
    );
    return { draftRevision: updated[0].draftRevision, number: version.number };
  });
}

// ---------------------------------------------------------------------------
// Reading

const authors = alias(users, "author");
const reviewers = alias(users, "reviewer");

const person = (id: string | null, login: string | null, name: string | null): Person => (id && login ? { id, login, name: name ?? login } : null);

export type GaitDetail = {
  id: string;
  name: string;
  description: string;
  robot: { id: string; name: string; latestRevision: number };
  draft: {
    revision: number;
    updatedAt: Date;
    updatedBy: Person;
    hasSequence: boolean;
    robotRevision: number | null;
    /** The version whose content the draft equals, if any (committing it would repeat that version). */
    sameAsVersion: number | null;
  };
  versionCount: number;
  latestVersion: number | null;
  releasedVersion: number | null;
  /** When the gait was archived; null while it is in use. */
  archivedAt: Date | null;
};

export async function getGait(workspaceId: string, gaitId: string): Promise<GaitDetail | null> {
  const db = database();
  const draftAuthors = alias(users, "draft_author");
  const [row] = await db
    .select({
      gait: gaits,
      robotName: robots.name,
      draftAuthorId: draftAuthors.id,
      draftAuthorLogin: draftAuthors.login,
      draftAuthorName: draftAuthors.name,
      draftRevisionNumber: robotRevisions.number,
      draftDefinition: robotRevisions.definition,
    })
    .from(gaits)
    .innerJoin(robots, eq(robots.id, gaits.robotId))
    .leftJoin(draftAuthors, eq(draftAuthors.id, gaits.draftUpdatedById))
    .leftJoin(robotRevisions, eq(robotRevisions.id, gaits.draftRobotRevisionId))
    .where(and(eq(gaits.id, gaitId), eq(gaits.workspaceId, workspaceId)));
  if (!row) return null;
  const [[latestRobot], [counts]] = await Promise.all([
    db
      .select({ number: max(robotRevisions.number) })
      .from(robotRevisions)
      .where(eq(robotRevisions.robotId, row.gait.robotId)),
    db
      .select({
        versionCount: sql<number>`count(*)`.mapWith(Number),
        latestVersion: max(gaitVersions.number),
        releasedVersion: sql<number | null>`max(${gaitVersions.number}) filter (where ${gaitVersions.state} = 'released')`,
      })
      .from(gaitVersions)
      .where(eq(gaitVersions.gaitId, gaitId)),
  ]);
  let sameAsVersion: number | null = null;
  if (row.gait.draftSequence && row.draftDefinition) {
    const parsed = parseSequence(row.gait.draftSequence);
    if (parsed.ok) {
      const hash = versionContentHash(parsed.sequence, row.draftDefinition);
      const [same] = await db
        .select({ number: gaitVersions.number })
        .from(gaitVersions)
        .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.contentHash, hash)))
        .orderBy(desc(gaitVersions.number))
        .limit(1);
      sameAsVersion = same?.number ?? null;
    }
  }
  return {
    id: row.gait.id,
    name: row.gait.name,
    archivedAt: row.gait.archivedAt,
    description: row.gait.description,
    robot: { id: row.gait.robotId, name: row.robotName, latestRevision: latestRobot?.number ?? 0 },
    draft: {
      revision: row.gait.draftRevision,
      updatedAt: row.gait.draftUpdatedAt,
      updatedBy: person(row.draftAuthorId, row.draftAuthorLogin, row.draftAuthorName),
      hasSequence: row.gait.draftSequence !== null,
      robotRevision: row.draftRevisionNumber,
      sameAsVersion,
    },
    versionCount: counts?.versionCount ?? 0,
    latestVersion: counts?.latestVersion ?? null,
    releasedVersion: counts?.releasedVersion ?? null,
  };
}

/** The gait page's query string parses into this (app/components/versions/version-query.ts). */
export type VersionSort = "number" | "date" | "author" | "state" | "flags" | "margin";
export type FlagFilter = "errors" | "warnings" | "clean";

export type VersionQuery = {
  sort: VersionSort;
  dir: "asc" | "desc";
  state?: VersionState;
  /** An author's login. */
  author?: string;
  /** Words in the message. */
  q?: string;
  flags?: FlagFilter;
};

export type VersionRow = {
  id: string;
  number: number;
  message: string;
  author: Person;
  reviewer: Person;
  createdAt: Date;
  state: VersionState;
  stateChangedAt: Date;
  robotRevision: number;
  contentHash: string;
  errors: number;
  warnings: number;
  flagsByKind: VersionSummary["flagsByKind"];
  worstMarginMm: number | null;
  summary: Partial<VersionSummary>;
};

const errorsOf = sql<number>`coalesce((${gaitVersions.summary} ->> 'errors')::int, 0)`;
const warningsOf = sql<number>`coalesce((${gaitVersions.summary} ->> 'warnings')::int, 0)`;
const marginOf = sql<number | null>`(${gaitVersions.summary} ->> 'worstMarginMm')::float8`;

const versionColumns = {
  id: gaitVersions.id,
  number: gaitVersions.number,
  message: gaitVersions.message,
  createdAt: gaitVersions.createdAt,
  state: gaitVersions.state,
  stateChangedAt: gaitVersions.stateChangedAt,
  contentHash: gaitVersions.contentHash,
  summary: gaitVersions.summary,
  robotRevision: robotRevisions.number,
  authorId: authors.id,
  authorLogin: authors.login,
  authorName: authors.name,
  reviewerId: reviewers.id,
  reviewerLogin: reviewers.login,
  reviewerName: reviewers.name,
};

type VersionSelect = {
  id: string;
  number: number;
  message: string;
  createdAt: Date;
  state: VersionState;
  stateChangedAt: Date;
  contentHash: string;
  summary: unknown;
  robotRevision: number;
  authorId: string | null;
  authorLogin: string | null;
  authorName: string | null;
  reviewerId: string | null;
  reviewerLogin: string | null;
  reviewerName: string | null;
};

function versionRow(row: VersionSelect): VersionRow {
  const summary = (row.summary ?? {}) as Partial<VersionSummary>;
  return {
    id: row.id,
    number: row.number,
    message: row.message,
    author: person(row.authorId, row.authorLogin, row.authorName),
    reviewer: person(row.reviewerId, row.reviewerLogin, row.reviewerName),
    createdAt: row.createdAt,
    state: row.state,
    stateChangedAt: row.stateChangedAt,
    robotRevision: row.robotRevision,
    contentHash: row.contentHash,
    errors: summary.errors ?? 0,
    warnings: summary.warnings ?? 0,
    flagsByKind: summary.flagsByKind ?? {},
    worstMarginMm: summary.worstMarginMm ?? null,
    summary,
  };
}

/** A query of versions that reads versionColumns: with the gait, the pinned robot revision, the author and the reviewer. */
function withVersionColumns<Query extends PgSelect>(query: Query) {
  return withGait(query)
    .innerJoin(robotRevisions, eq(robotRevisions.id, gaitVersions.robotRevisionId))
    .leftJoin(authors, eq(authors.id, gaitVersions.authorId))
    .leftJoin(reviewers, eq(reviewers.id, gaitVersions.reviewerId));
}

const SORT_COLUMNS: Record<VersionSort, SQL | typeof gaitVersions.number> = {
  number: sql`${gaitVersions.number}`,
  date: sql`${gaitVersions.createdAt}`,
  author: sql`lower(${authors.name})`,
  state: sql`${gaitVersions.state}`,
  flags: sql`(${errorsOf}, ${warningsOf})`,
  margin: marginOf,
};

/** The versions of a gait, filtered and sorted as the gait page's query string asks; ties by number, newest first. */
export async function listVersions(workspaceId: string, gaitId: string, query: VersionQuery = { sort: "number", dir: "desc" }): Promise<VersionRow[]> {
  const db = database();
  const filters: (SQL | undefined)[] = [eq(gaits.workspaceId, workspaceId), eq(gaitVersions.gaitId, gaitId)];
  if (query.state) filters.push(eq(gaitVersions.state, query.state));
  if (query.author) filters.push(eq(authors.login, query.author));
  if (query.q) filters.push(ilike(gaitVersions.message, `%${query.q.replace(/[\\%_]/g, (character) => `\\${character}`)}%`));
  if (query.flags === "errors") filters.push(sql`${errorsOf} > 0`);
  if (query.flags === "warnings") filters.push(sql`${errorsOf} = 0 and ${warningsOf} > 0`);
  if (query.flags === "clean") filters.push(sql`${errorsOf} = 0 and ${warningsOf} = 0`);
  const column = SORT_COLUMNS[query.sort];
  const order = query.dir === "asc" ? sql`${column} asc nulls last` : sql`${column} desc nulls last`;
  const rows = await withVersionColumns(db.select(versionColumns).from(gaitVersions).$dynamic())
    .where(and(...filters))
    .orderBy(order, desc(gaitVersions.number));
  return rows.map(versionRow);
}

/** Everyone who authored a version of the gait, for the author filter. */
export async function versionAuthors(workspaceId: string, gaitId: string): Promise<{ login: string; name: string }[]> {
  return database()
    .selectDistinct({ login: users.login, name: users.name })
    .from(gaitVersions)
    .innerJoin(gaits, eq(gaits.id, gaitVersions.gaitId))
    .innerJoin(users, eq(users.id, gaitVersions.authorId))
    .where(and(eq(gaits.workspaceId, workspaceId), eq(gaitVersions.gaitId, gaitId)))
    .orderBy(asc(users.name));
}

export type ReviewEvent = {
  id: number;
  fromState: VersionState | null;
  toState: VersionState;
  comment: string;
  overrideReason: string | null;
  actor: Person;
  createdAt: Date;
};

export type VersionDetail = VersionRow & {
  gait: { id: string; name: string; robotId: string; robotName: string };
  sequence: Sequence;
  robotRevisionId: string;
  events: ReviewEvent[];
};

async function versionEvents(versionId: string): Promise<ReviewEvent[]> {
  const rows = await database()
    .select({ event: reviewEvents, actorId: users.id, actorLogin: users.login, actorName: users.name })
    .from(reviewEvents)
    .leftJoin(users, eq(users.id, reviewEvents.actorId))
    .where(eq(reviewEvents.versionId, versionId))
    .orderBy(asc(reviewEvents.createdAt), asc(reviewEvents.id));
  return rows.map(({ event, actorId, actorLogin, actorName }) => ({
    id: event.id,
    fromState: event.fromState,
    toState: event.toState,
    comment: event.comment,
    overrideReason: event.overrideReason,
    actor: person(actorId, actorLogin, actorName),
    createdAt: event.createdAt,
  }));
}

async function versionDetail(where: SQL): Promise<VersionDetail | null> {
  const query = database()
    .select({
      ...versionColumns,
      sequence: gaitVersions.sequence,
      robotRevisionId: gaitVersions.robotRevisionId,
      ...gaitColumns,
    })
    .from(gaitVersions)
    .$dynamic();
  const [row] = await withVersionColumns(query).where(where);
  if (!row) return null;
  return {
    ...versionRow(row),
    gait: { id: row.gaitId, name: row.gaitName, robotId: row.robotId, robotName: row.robotName },
    sequence: row.sequence as Sequence,
    robotRevisionId: row.robotRevisionId,
    events: await versionEvents(row.id),
  };
}

/** A version by its gait and number, with its review history; null when not in this workspace. */
export function getVersion(workspaceId: string, gaitId: string, number: number): Promise<VersionDetail | null> {
  return versionDetail(and(eq(gaits.workspaceId, workspaceId), eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, number))!);
}

/** A version by its id; null when not in this workspace. */
export function getVersionById(workspaceId: string, versionId: string): Promise<VersionDetail | null> {
  return versionDetail(and(eq(gaits.workspaceId, workspaceId), eq(gaitVersions.id, versionId))!);
}

/** Every version in the workspace, grouped as robot › gait › number, for the comparison picker. */
export async function listComparableVersions(
  workspaceId: string,
): Promise<{ id: string; number: number; message: string; state: VersionState; gaitId: string; gaitName: string; robotId: string; robotName: string }[]> {
  const query = database()
    .select({
      id: gaitVersions.id,
      number: gaitVersions.number,
      message: gaitVersions.message,
      state: gaitVersions.state,
      ...gaitColumns,
    })
    .from(gaitVersions)
    .$dynamic();
  return withGait(query).where(eq(gaits.workspaceId, workspaceId)).orderBy(asc(robots.name), asc(gaits.name), desc(gaitVersions.number));
}

// ---------------------------------------------------------------------------
// Solving a stored version, for its flags and for comparisons

/** At most this many frames go to a page for playback and plots; longer moves are re-solved at a lower rate for display. */
const DISPLAY_FRAME_LIMIT = 1500;

/** The version's own solve (its flags and summary), and frames for playback: the same solve, or at a lower rate for a long move. */
export type SolvedVersion = { robot: Robot; sequence: Sequence; solved: { flags: Flag[]; summary: SolveSummary }; display: SolvedSequence };

/** Solves a version with the robot revision it pins (the same engine that committed it), on the worker pool. */
export async function solveVersion(version: Pick<VersionDetail, "sequence" | "robotRevisionId" | "number">): Promise<SolvedVersion> {
  const [revision] = await database()
    .select({ definition: robotRevisions.definition, number: robotRevisions.number })
    .from(robotRevisions)
    .where(eq(robotRevisions.id, version.robotRevisionId));
  const robot = robotOfRevision(revision, { version: version.number });
  const sequence = parseSequence(version.sequence);
  if (!sequence.ok)
    throw new ServiceError(409, "conflict", `Version ${version.number} holds a sequence this engine cannot read: ${issuesText(sequence.issues)}`);
  const { flags, summary, display } = await runCoreTask("playback", { robot, sequence: sequence.sequence, displayFrameLimit: DISPLAY_FRAME_LIMIT });
  return { robot, sequence: sequence.sequence, solved: { flags, summary }, display };
}

export type ComparedVersion = Omit<VersionDetail, "sequence" | "events"> & {
  robotDefinition: Robot;
  playback: Playback;
  flagGroups: FlagGroup[];
};

export type Comparison = {
  a: ComparedVersion;
  b: ComparedVersion;
  sameGait: boolean;
  metrics: MetricRow[];
  diff: SequenceDiff;
  robotDiff: RobotRevisionDiff | null;
  overlays: JointOverlay[];
};

/** One side of the joint overlays: the display frames, the version's flags and its robot revision's joint limits. */
function overlaySide(solved: SolvedVersion): AngleFrames {
  return {
    loop: solved.sequence.loop,
    frames: solved.display.frames,
    flags: solved.solved.flags,
    flagFrameCount: solved.solved.summary.frames,
    limits: Object.fromEntries(solved.robot.legs.map((leg) => [leg.id, leg.joints])),
  };
}

/** Any two versions of the same gait, or of two gaits on the same robot: what changed from A to B. */
export async function compareVersions(workspaceId: string, aId: string, bId: string): Promise<Comparison> {
  const [a, b] = await Promise.all([getVersionById(workspaceId, aId), getVersionById(workspaceId, bId)]);
  if (!a || !b) throw new ServiceError(404, "not-found", "One or both versions of this comparison are not in your workspace.");
  if (a.gait.robotId !== b.gait.robotId) {
    throw new ServiceError(
      422,
      "invalid",
      `These versions belong to gaits of different robots (${a.gait.robotName} and ${b.gait.robotName}); compare versions of one robot.`,
    );
  }
  const [solvedA, solvedB] = await Promise.all([solveVersion(a), solveVersion(b)]);
  const [revisionA, revisionB] = await Promise.all(
    [a, b].map(async (version) => {
      const [row] = await database()
        .select({ number: robotRevisions.number, definition: robotRevisions.definition })
        .from(robotRevisions)
        .where(eq(robotRevisions.id, version.robotRevisionId));
      return row;
    }),
  );
  const compared = (version: VersionDetail, solved: SolvedVersion): ComparedVersion => {
    const { sequence: _sequence, events: _events, ...rest } = version;
    return {
      ...rest,
      robotDefinition: solved.robot,
      playback: playbackOf(solved.display, solved.sequence.cycleMs, solved.sequence.loop),
      flagGroups: groupFlags(solved.solved.flags),
    };
  };
  return {
    a: compared(a, solvedA),
    b: compared(b, solvedB),
    sameGait: a.gait.id === b.gait.id,
    metrics: metricDeltas({ ...a.summary, cycleMs: solvedA.sequence.cycleMs }, { ...b.summary, cycleMs: solvedB.sequence.cycleMs }),
    diff: diffSequences(solvedA.sequence, solvedB.sequence),
    robotDiff: robotRevisionDiff(revisionA, revisionB),
    overlays: jointOverlays(overlaySide(solvedA), overlaySide(solvedB)),
  };
}
