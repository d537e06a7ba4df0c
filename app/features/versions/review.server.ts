// Review of gait versions (DESIGN.md, "Version states"): committed → in-review
// → sent-back or approved → released, and retired when another version of the
// gait is released. Every step is a conditional update inside a transaction
// (`… where id = $1 and state = 'in-review'`), so a double click or two people
// at once cannot skip a state; every step is written to review_events and the
// audit log. The reviewer is mailed on a request, the author on each decision,
// and a release also every firmware member (they download the table); the
// mail is queued in the step's own transaction (app/platform/outbox.server.ts).
import { and, asc, desc, eq, gt, inArray, or } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { gaitVersions, gaits, memberships, reviewEvents, users, type Role, type VersionState } from "../../../db/schema";
import type { Member } from "../../platform/access.server";
import { recordAudit } from "../../platform/audit.server";
import { config } from "../../platform/config.server";
import { database, type Reader, type Tx } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { queueMail, type OutgoingMail } from "../../platform/outbox.server";
import { isId } from "../../platform/params";
import { recordReleaseTable } from "../tables/index.server";
import { can, type Action } from "../../platform/permissions";
import { gaitColumns, withGait } from "./rows.server";
import { stateWord } from "./state-labels";
import type { Person, VersionSummary } from "./versions.server";

export const COMMENT_LIMIT = 2000;
export const REASON_LIMIT = 1000;

const authors = alias(users, "author");

type LoadedVersion = {
  id: string;
  number: number;
  message: string;
  state: VersionState;
  summary: Partial<VersionSummary>;
  reviewerId: string | null;
  gaitId: string;
  gaitName: string;
  robotId: string;
  robotName: string;
  author: { id: string; name: string; email: string } | null;
};

async function loadVersion(db: Reader, workspaceId: string, versionId: string): Promise<LoadedVersion> {
  // Checked here so a malformed id is a 404, not an SQL error that aborts the transaction.
  if (!isId(versionId)) throw new ServiceError(404, "not-found", "No such version in this workspace.");
  const query = db
    .select({
      id: gaitVersions.id,
      number: gaitVersions.number,
      message: gaitVersions.message,
      state: gaitVersions.state,
      summary: gaitVersions.summary,
      reviewerId: gaitVersions.reviewerId,
      ...gaitColumns,
      authorId: authors.id,
      authorName: authors.name,
      authorEmail: authors.email,
    })
    .from(gaitVersions)
    .$dynamic();
  const [row] = await withGait(query)
    .leftJoin(authors, eq(authors.id, gaitVersions.authorId))
    .where(and(eq(gaitVersions.id, versionId), eq(gaits.workspaceId, workspaceId)));
  if (!row) throw new ServiceError(404, "not-found", "No such version in this workspace.");
  return {
    ...row,
    summary: (row.summary ?? {}) as Partial<VersionSummary>,
    author: row.authorId ? { id: row.authorId, name: row.authorName ?? "", email: row.authorEmail ?? "" } : null,
  };
}

/** A review step in the audit log: who took it, on which version of which gait, and what more `details` say. */
function auditStep(tx: Tx, actor: Member, action: string, version: { id: string; gaitId: string; number: number }, details: Record<string, unknown> = {}) {
  return recordAudit(
    {
      workspaceId: actor.workspace.id,
      actorId: actor.user.id,
      action,
      targetType: "gait_version",
      targetId: version.id,
      details: { gaitId: version.gaitId, number: version.number, ...details },
    },
    tx,
  );
}

/** Moves the version from one of `from` to `to`, or refuses with 409 when someone else moved it first. */
async function moveState(tx: Tx, version: LoadedVersion, from: VersionState[], to: VersionState, extra: { reviewerId?: string } = {}): Promise<void> {
  const moved = await tx
    .update(gaitVersions)
    .set({ state: to, stateChangedAt: new Date(), ...extra })
    .where(and(eq(gaitVersions.id, version.id), inArray(gaitVersions.state, from)))
    .returning({ id: gaitVersions.id });
  if (moved.length === 0) {
    const [now] = await tx.select({ state: gaitVersions.state }).from(gaitVersions).where(eq(gaitVersions.id, version.id));
    throw new ServiceError(
      409,
      "conflict",
      `Version ${version.number} is ${stateWord(now?.state ?? version.state)} now, not ${from.map(stateWord).join(" or ")}; reload to see what changed.`,
    );
  }
}

function requirePermission(actor: Member, action: Action, phrase: string): void {
  if (!can(actor.role, action)) throw new ServiceError(403, "forbidden", `The ${actor.role} role cannot ${phrase}.`);
}

function cleanText(value: string | undefined | null, limit: number, field: string, what: string): string {
  const text = (value ?? "").trim();
  if (text.length > limit) throw new ServiceError(422, "invalid", `${what} must be at most ${limit} characters.`, { field });
  return text;
}

// ---------------------------------------------------------------------------
// Mail

const versionUrl = (version: { gaitId: string; number: number }) => `${config().publicUrl}/gaits/${version.gaitId}/versions/${version.number}`;
export const compareUrl = (a: string, b: string) => `${config().publicUrl}/gaits/compare?a=${a}&b=${b}`;

function checksLine(summary: Partial<VersionSummary>): string {
  const margin =
    summary.worstMarginMm === null || summary.worstMarginMm === undefined
      ? "no margin (fewer than three feet down)"
      : `worst stability margin ${summary.worstMarginMm.toFixed(1)} mm`;
  return `Checks: ${summary.errors ?? 0} error flag(s), ${summary.warnings ?? 0} warning flag(s), ${margin}.`;
}

const aboutVersion = (version: LoadedVersion) => ({ type: "gait_version", id: version.id });

/** The author's mail about a decision; none when the author decides (the page shows the outcome). */
function authorMail(
  version: LoadedVersion,
  actor: Member,
  decided: Extract<VersionState, "approved" | "sent-back" | "released">,
  lines: string[],
): OutgoingMail[] {
  if (!version.author || version.author.id === actor.user.id || !version.author.email) return [];
  const decision = stateWord(decided);
  return [
    {
      topic: decided === "released" ? "release" : "review-decision",
      target: aboutVersion(version),
      to: version.author.email,
      subject: `${version.gaitName} v${version.number} ${decision} by ${actor.user.name}`,
      text: [
        `${actor.user.name} ${decision} version ${version.number} of “${version.gaitName}” on ${version.robotName}: “${version.message}”.`,
        "",
        ...lines,
        ...(lines.length > 0 ? [""] : []),
        `Open the version: ${versionUrl(version)}`,
        `Your reviews: ${config().publicUrl}/reviews`,
      ].join("\n"),
    },
  ];
}

const sender = (actor: Member) => ({ workspaceId: actor.workspace.id, senderId: actor.user.id });

const tableUrl = (version: { gaitId: string; number: number }) => `${config().publicUrl}/export?gait=${version.gaitId}&version=${version.number}`;

/**
 * A release's mail: the author's, and one to each firmware member of the
 * workspace, who download the table; one per address (an author who is also
 * firmware, two accounts of one person), none to the releaser.
 */
async function releaseMails(tx: Tx, version: LoadedVersion, actor: Member, lines: string[]): Promise<OutgoingMail[]> {
  const firmware = await tx
    .select({ id: users.id, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, actor.workspace.id), eq(memberships.role, "firmware")))
    // Of two accounts under one address, the older one's spelling is used.
    .orderBy(asc(users.createdAt), asc(users.id));
  const mails = authorMail(version, actor, "released", [...lines, `Its angle table: ${tableUrl(version)}`]);
  const mailed = new Set([actor.user.email.toLowerCase(), ...mails.map((mail) => mail.to.toLowerCase())]);
  for (const member of firmware) {
    const address = member.email.toLowerCase();
    if (member.id === actor.user.id || !address || mailed.has(address)) continue;
    mailed.add(address);
    mails.push({
      topic: "release",
      target: aboutVersion(version),
      to: member.email,
      subject: `${version.gaitName} v${version.number} released by ${actor.user.name}`,
      text: [
        `${actor.user.name} released version ${version.number} of “${version.gaitName}” on ${version.robotName}: “${version.message}”.`,
        "",
        ...lines,
        "",
        `Its angle table: ${tableUrl(version)}`,
        `Open the version: ${versionUrl(version)}`,
      ].join("\n"),
    });
  }
  return mails;
}

// ---------------------------------------------------------------------------
// Who may review

export type Reviewer = { id: string; login: string; name: string; role: Role };

/** Members who may approve, except the author, who may not review their own version (an owner may, overriding). */
export async function reviewersFor(workspaceId: string, authorId: string | null): Promise<Reviewer[]> {
  const rows = await database()
    .select({ id: users.id, login: users.login, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, workspaceId), inArray(memberships.role, ["owner", "lead"])))
    .orderBy(asc(users.name));
  return rows.filter((row) => row.id !== authorId || row.role === "owner");
}

/** Why approving needs an override reason, if it does: the approver's own version, error-severity flags. */
export type OverrideNeed = "own-version" | "error-flags";

export type ApprovalRules = { allowed: boolean; refusal?: string; needsReason: OverrideNeed[] };

export function approvalRules(version: { authorId: string | null; errors: number }, actor: { userId: string; role: Role }): ApprovalRules {
  const needsReason: OverrideNeed[] = [];
  if (!can(actor.role, "versions.decide")) return { allowed: false, refusal: `The ${actor.role} role cannot approve versions.`, needsReason };
  if (version.authorId === actor.userId) {
    if (actor.role !== "owner") return { allowed: false, refusal: "No one approves their own version: ask another lead or an owner.", needsReason };
    needsReason.push("own-version");
  }
  if (version.errors > 0) needsReason.push("error-flags");
  return { allowed: true, needsReason };
}

// ---------------------------------------------------------------------------
// The steps

/** The version's new state and how many mails the step queued. */
export type StepOutcome = { state: VersionState; mails: number };

/** committed or sent-back → in-review, assigned to a reviewer who may approve; mails the reviewer with a comparison link. */
export async function requestReview(
  actor: Member,
  versionId: string,
  input: { reviewerId: string; comment?: string; compareWithId?: string | null },
): Promise<StepOutcome & { reviewer: string }> {
  requirePermission(actor, "versions.requestReview", "request reviews");
  const comment = cleanText(input.comment, COMMENT_LIMIT, "comment", "The note to the reviewer");
  const db = database();
  const { reviewer, mails } = await db.transaction(async (tx) => {
    const version = await loadVersion(tx, actor.workspace.id, versionId);
    if (!isId(input.reviewerId)) throw new ServiceError(422, "invalid", "Choose a reviewer from this workspace.", { field: "reviewerId" });
    const [reviewer] = await tx
      .select({ id: users.id, name: users.name, email: users.email, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.workspaceId, actor.workspace.id), eq(memberships.userId, input.reviewerId)));
    if (!reviewer) throw new ServiceError(422, "invalid", "Choose a reviewer from this workspace.", { field: "reviewerId" });
    if (!can(reviewer.role, "versions.decide"))
      throw new ServiceError(422, "invalid", `${reviewer.name} is ${reviewer.role} and cannot approve versions; choose a lead or an owner.`, {
        field: "reviewerId",
      });
    if (version.author?.id === reviewer.id && reviewer.role !== "owner") {
      throw new ServiceError(422, "invalid", `${reviewer.name} wrote this version and cannot approve it; choose another reviewer.`, { field: "reviewerId" });
    }
    let baseline: { id: string; number: number; gaitName: string } | null = null;
    if (input.compareWithId) {
      const other = await loadVersion(tx, actor.workspace.id, input.compareWithId).catch(() => null);
      if (!other || other.robotId !== version.robotId || other.id === version.id) {
        throw new ServiceError(422, "invalid", "Compare with another version of this gait or of a gait on the same robot.", { field: "compareWithId" });
      }
      baseline = { id: other.id, number: other.number, gaitName: other.gaitName };
    }
    await moveState(tx, version, ["committed", "sent-back"], "in-review", { reviewerId: reviewer.id });
    await tx.insert(reviewEvents).values({ versionId: version.id, actorId: actor.user.id, fromState: version.state, toState: "in-review", comment });
    await auditStep(tx, actor, "version.review-requested", version, { from: version.state, reviewerId: reviewer.id, compareWith: baseline?.id ?? null });
    const mails = await queueMail(tx, sender(actor), [
      {
        topic: "review-request",
        target: aboutVersion(version),
        to: reviewer.email,
        subject: `Review requested: ${version.gaitName} v${version.number} (${version.robotName})`,
        text: [
          `${actor.user.name} asks you to review version ${version.number} of “${version.gaitName}” on ${version.robotName}: “${version.message}”.`,
          "",
          checksLine(version.summary),
          ...(comment ? ["", `Note: ${comment}`] : []),
          "",
          ...(baseline
            ? [
                `Compare with ${baseline.gaitName === version.gaitName ? "" : `${baseline.gaitName} `}v${baseline.number}: ${compareUrl(baseline.id, version.id)}`,
              ]
            : []),
          `Open the version to approve or send it back: ${versionUrl(version)}`,
          `Everything waiting for you: ${config().publicUrl}/reviews`,
        ].join("\n"),
      },
    ]);
    return { reviewer, mails };
  });
  return { state: "in-review", mails, reviewer: reviewer.name };
}

/** in-review → approved. Not one's own version (an owner may, with a reason); error flags need a reason too. */
export async function approveVersion(
  actor: Member,
  versionId: string,
  input: { comment?: string; overrideReason?: string | null },
): Promise<StepOutcome & { override: OverrideNeed[] }> {
  requirePermission(actor, "versions.decide", "approve versions");
  const comment = cleanText(input.comment, COMMENT_LIMIT, "comment", "The comment");
  const reason = cleanText(input.overrideReason, REASON_LIMIT, "overrideReason", "The override reason");
  const db = database();
  const { needs, mails } = await db.transaction(async (tx) => {
    const version = await loadVersion(tx, actor.workspace.id, versionId);
    if (version.state !== "in-review")
      throw new ServiceError(
        409,
        "conflict",
        `Version ${version.number} is ${stateWord(version.state)}, not in review; only a version in review can be approved.`,
      );
    const rules = approvalRules({ authorId: version.author?.id ?? null, errors: version.summary.errors ?? 0 }, { userId: actor.user.id, role: actor.role });
    if (!rules.allowed) throw new ServiceError(403, "forbidden", rules.refusal!);
    if (rules.needsReason.length > 0 && reason.length === 0) {
      const why = rules.needsReason
        .map((need) => (need === "own-version" ? "it is your own version" : `it has ${version.summary.errors} error flag(s)`))
        .join(" and ");
      throw new ServiceError(422, "invalid", `Approving needs an override reason because ${why}; the reason goes into the review history and the audit log.`, {
        field: "overrideReason",
      });
    }
    await moveState(tx, version, ["in-review"], "approved");
    const overrideReason = rules.needsReason.length > 0 ? reason : null;
    await tx
      .insert(reviewEvents)
      .values({ versionId: version.id, actorId: actor.user.id, fromState: "in-review", toState: "approved", comment, overrideReason });
    await auditStep(tx, actor, rules.needsReason.length > 0 ? "version.approved-with-override" : "version.approved", version, {
      errors: version.summary.errors ?? 0,
      ...(overrideReason ? { override: { reasons: rules.needsReason, reason: overrideReason } } : {}),
    });
    const needs = rules.needsReason;
    const mails = await queueMail(
      tx,
      sender(actor),
      authorMail(version, actor, "approved", [
        ...(comment ? [`Comment: ${comment}`] : []),
        ...(needs.length > 0 ? [`Approved with an override (${needs.join(", ")}): ${reason}`] : []),
        "A lead or an owner can now release it.",
      ]),
    );
    return { needs, mails };
  });
  return { state: "approved", mails, override: needs };
}

/** in-review → sent-back, with a comment saying what to change. */
export async function sendBackVersion(actor: Member, versionId: string, input: { comment: string }): Promise<StepOutcome> {
  requirePermission(actor, "versions.decide", "send versions back");
  const comment = cleanText(input.comment, COMMENT_LIMIT, "comment", "The comment");
  if (comment.length === 0) throw new ServiceError(422, "invalid", "Say what needs to change: sending a version back needs a comment.", { field: "comment" });
  const mails = await database().transaction(async (tx) => {
    const version = await loadVersion(tx, actor.workspace.id, versionId);
    await moveState(tx, version, ["in-review"], "sent-back");
    await tx.insert(reviewEvents).values({ versionId: version.id, actorId: actor.user.id, fromState: "in-review", toState: "sent-back", comment });
    await auditStep(tx, actor, "version.sent-back", version);
    return queueMail(
      tx,
      sender(actor),
      authorMail(version, actor, "sent-back", [
        `Comment: ${comment}`,
        "Start a new draft from it, change what the comment asks, commit and request review again.",
      ]),
    );
  });
  return { state: "sent-back", mails };
}

/**
 * approved → released; the gait's previously released version, if any,
 * becomes retired in the same transaction (the gait row is locked so two
 * releases take turns; the partial unique index allows one released per gait).
 */
export async function releaseVersion(actor: Member, versionId: string, input: { comment?: string } = {}): Promise<StepOutcome & { retired: number | null }> {
  requirePermission(actor, "versions.release", "release versions");
  const comment = cleanText(input.comment, COMMENT_LIMIT, "comment", "The comment");
  const { retired, mails } = await database().transaction(async (tx) => {
    const version = await loadVersion(tx, actor.workspace.id, versionId);
    await tx.select({ id: gaits.id }).from(gaits).where(eq(gaits.id, version.gaitId)).for("update");
    // Read again under the gait's lock: another release may have finished while this one waited.
    const [fresh] = await tx.select({ state: gaitVersions.state }).from(gaitVersions).where(eq(gaitVersions.id, version.id));
    if (fresh.state !== "approved") {
      throw new ServiceError(409, "conflict", `Version ${version.number} is ${stateWord(fresh.state)}; only an approved version can be released.`);
    }
    const retiredRows = await tx
      .update(gaitVersions)
      .set({ state: "retired", stateChangedAt: new Date() })
      .where(and(eq(gaitVersions.gaitId, version.gaitId), eq(gaitVersions.state, "released")))
      .returning({ id: gaitVersions.id, number: gaitVersions.number });
    for (const old of retiredRows) {
      await tx
        .insert(reviewEvents)
        .values({ versionId: old.id, actorId: actor.user.id, fromState: "released", toState: "retired", comment: `Replaced by version ${version.number}.` });
      await auditStep(tx, actor, "version.retired", { id: old.id, gaitId: version.gaitId, number: old.number }, { replacedBy: version.number });
    }
    // Conditional: if the version left `approved` since it was read, this refuses and the retirement above rolls back.
    await moveState(tx, version, ["approved"], "released");
    // What the release ships, kept so its table can be reproduced byte for byte.
    await recordReleaseTable(tx, { versionId: version.id, releasedById: actor.user.id });
    await tx.insert(reviewEvents).values({ versionId: version.id, actorId: actor.user.id, fromState: "approved", toState: "released", comment });
    await auditStep(tx, actor, "version.released", version, { retired: retiredRows.map((row) => row.number) });
    const retired = retiredRows[0]?.number ?? null;
    const mails = await queueMail(
      tx,
      sender(actor),
      await releaseMails(tx, version, actor, [
        ...(comment ? [`Comment: ${comment}`] : []),
        retired ? `It replaces version ${retired}, which is now retired.` : "It is the first released version of this gait.",
        "Firmware can now download its angle table.",
      ]),
    );
    return { retired, mails };
  });
  return { state: "released", mails, retired };
}

// ---------------------------------------------------------------------------
// What waits for whom

export type QueueItem = {
  versionId: string;
  number: number;
  message: string;
  state: VersionState;
  stateChangedAt: Date;
  gait: { id: string; name: string };
  robotName: string;
  author: Person;
  reviewer: Person;
  errors: number;
  warnings: number;
  worstMarginMm: number | null;
  /** The newest review step, with who took it and what they wrote. */
  lastStep: { toState: VersionState; comment: string; overrideReason: string | null; actor: Person; createdAt: Date } | null;
  /** The version before it in the gait (for a comparison link), if any. */
  previousVersionId: string | null;
};

export type ReviewQueue = {
  /** In review, assigned to the signed-in person. */
  assigned: QueueItem[];
  /** The signed-in person's versions in review, sent back, approved, or released in the last 30 days. */
  mine: QueueItem[];
  /** Approved versions waiting for someone who may release them (only for those who may). */
  toRelease: QueueItem[];
};

const RECENT_DAYS = 30;

export async function reviewQueue(member: Member): Promise<ReviewQueue> {
  const db = database();
  const reviewersTable = alias(users, "reviewer");
  const recent = new Date(Date.now() - RECENT_DAYS * 86_400_000);
  const mineFilter = and(
    eq(gaitVersions.authorId, member.user.id),
    or(inArray(gaitVersions.state, ["in-review", "sent-back", "approved"]), and(eq(gaitVersions.state, "released"), gt(gaitVersions.stateChangedAt, recent))),
  );
  const assignedFilter = and(eq(gaitVersions.state, "in-review"), eq(gaitVersions.reviewerId, member.user.id));
  const releaseFilter = can(member.role, "versions.release") ? eq(gaitVersions.state, "approved") : undefined;
  const query = db
    .select({
      versionId: gaitVersions.id,
      number: gaitVersions.number,
      message: gaitVersions.message,
      state: gaitVersions.state,
      stateChangedAt: gaitVersions.stateChangedAt,
      summary: gaitVersions.summary,
      authorId: gaitVersions.authorId,
      reviewerId: gaitVersions.reviewerId,
      ...gaitColumns,
      authorLogin: authors.login,
      authorName: authors.name,
      reviewerLogin: reviewersTable.login,
      reviewerName: reviewersTable.name,
    })
    .from(gaitVersions)
    .$dynamic();
  const rows = await withGait(query)
    .leftJoin(authors, eq(authors.id, gaitVersions.authorId))
    .leftJoin(reviewersTable, eq(reviewersTable.id, gaitVersions.reviewerId))
    .where(and(eq(gaits.workspaceId, member.workspace.id), or(assignedFilter, mineFilter, releaseFilter)))
    .orderBy(desc(gaitVersions.stateChangedAt));
  const ids = rows.map((row) => row.versionId);
  const steps =
    ids.length === 0
      ? []
      : await db
          .select({ event: reviewEvents, actorId: users.id, actorLogin: users.login, actorName: users.name })
          .from(reviewEvents)
          .leftJoin(users, eq(users.id, reviewEvents.actorId))
          .where(inArray(reviewEvents.versionId, ids))
          .orderBy(asc(reviewEvents.createdAt), asc(reviewEvents.id));
  const lastSteps = new Map<string, QueueItem["lastStep"]>();
  for (const { event, actorId, actorLogin, actorName } of steps) {
    lastSteps.set(event.versionId, {
      toState: event.toState,
      comment: event.comment,
      overrideReason: event.overrideReason,
      actor: actorId && actorLogin ? { id: actorId, login: actorLogin, name: actorName ?? actorLogin } : null,
      createdAt: event.createdAt,
    });
  }
  const gaitIds = [...new Set(rows.map((row) => row.gaitId))];
  const numbers =
    gaitIds.length === 0
      ? []
      : await db
          .select({ id: gaitVersions.id, gaitId: gaitVersions.gaitId, number: gaitVersions.number })
          .from(gaitVersions)
          .where(inArray(gaitVersions.gaitId, gaitIds));
  const previousOf = (gaitId: string, number: number) =>
    numbers.filter((row) => row.gaitId === gaitId && row.number < number).sort((x, y) => y.number - x.number)[0]?.id ?? null;
  const item = (row: (typeof rows)[number]): QueueItem => {
    const summary = (row.summary ?? {}) as Partial<VersionSummary>;
    return {
      versionId: row.versionId,
      number: row.number,
      message: row.message,
      state: row.state,
      stateChangedAt: row.stateChangedAt,
      gait: { id: row.gaitId, name: row.gaitName },
      robotName: row.robotName,
      author: row.authorId && row.authorLogin ? { id: row.authorId, login: row.authorLogin, name: row.authorName ?? row.authorLogin } : null,
      reviewer: row.reviewerId && row.reviewerLogin ? { id: row.reviewerId, login: row.reviewerLogin, name: row.reviewerName ?? row.reviewerLogin } : null,
      errors: summary.errors ?? 0,
      warnings: summary.warnings ?? 0,
      worstMarginMm: summary.worstMarginMm ?? null,
      lastStep: lastSteps.get(row.versionId) ?? null,
      previousVersionId: previousOf(row.gaitId, row.number),
    };
  };
  return {
    assigned: rows.filter((row) => row.state === "in-review" && row.reviewerId === member.user.id).map(item),
    mine: rows.filter((row) => row.authorId === member.user.id).map(item),
    toRelease: releaseFilter ? rows.filter((row) => row.state === "approved").map(item) : [],
  };
}
