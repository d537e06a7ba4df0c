// Reading the audit log: one page of a workspace's entries, newest first,
// filtered by person, by object or kind of object, by action and by words,
// with every entry's objects named. Paging is by id (keyset): a page is "the
// entries older than #n" or "newer than #n", so entries written while someone
// reads do not shift what the next page holds. Names come from the entry's own
// details where its writer recorded them, else from the object's row today,
// else from another entry about the same object (the one that deleted it).
import { and, asc, count, desc, eq, gt, ilike, inArray, isNull, lt, or, sql, type SQL } from "drizzle-orm";
import { apiTokens, auditLog, gaitVersions, gaits, invitations, memberships, robots, users, workspaces } from "../../db/schema";
import { AUDIT_ACTIONS, AUDIT_KINDS, describeAudit, type AuditKind, type AuditPart } from "./audit-labels";
import { database } from "./db.server";
import { isId } from "./params";

export const AUDIT_PAGE_SIZE = 50;

/** What the log is narrowed to; every field is optional. */
export type AuditFilter = {
  /** The person who acted, by user id, or "system" for what the app did by itself. */
  actor?: string;
  /** A kind of object, or one object of a kind. */
  object?: { kind: AuditKind; id?: string };
  action?: string;
  /** Words anywhere: the person, the object's name, the action, the details. */
  q?: string;
};

/** Which page: the newest, the entries older than an id, or newer than one. */
export type AuditCursor = { before?: number; after?: number };

export type AuditLogEntry = {
  id: number;
  at: Date;
  action: string;
  actor: { id: string; name: string } | null;
  target: { type: string | null; id: string | null; name: string | null };
  sentence: AuditPart[];
  details: unknown;
};

export type AuditPage = {
  entries: AuditLogEntry[];
  /** How many entries match the filter, and how many of them are newer than this page. */
  total: number;
  newerCount: number;
  /** The cursors of the neighbouring pages, null at either end. */
  older: number | null;
  newer: number | null;
};

/** This workspace's entries, and the sign-ins (which belong to no workspace) of its members. */
function inWorkspace(workspaceId: string): SQL {
  return or(
    eq(auditLog.workspaceId, workspaceId),
    and(
      isNull(auditLog.workspaceId),
      inArray(auditLog.actorId, database().select({ id: memberships.userId }).from(memberships).where(eq(memberships.workspaceId, workspaceId))),
    ),
  )!;
}

/** The target types an object kind covers: a gait's entries include its versions'. */
const TARGET_TYPES: Record<AuditKind, string[]> = {
  robot: ["robot"],
  gait: ["gait", "gait_version"],
  user: ["user"],
  token: ["token"],
  invitation: ["invitation"],
  workspace: ["workspace"],
};

function objectCondition(object: NonNullable<AuditFilter["object"]>): SQL {
  if (!object.id) return inArray(auditLog.targetType, TARGET_TYPES[object.kind]);
  const own = and(eq(auditLog.targetType, object.kind === "user" ? "user" : object.kind), eq(auditLog.targetId, object.id))!;
  if (object.kind !== "gait") return own;
  return or(own, and(eq(auditLog.targetType, "gait_version"), sql`${auditLog.details} ->> 'gaitId' = ${object.id}`))!;
}

/** `%` and `_` in what a person typed are letters, not wildcards. */
const likePattern = (words: string) => `%${words.replace(/[\\%_]/g, (character) => `\\${character}`)}%`;

async function searchCondition(workspaceId: string, q: string): Promise<SQL> {
  const pattern = likePattern(q);
  const db = database();
  // Objects whose name matches, today: their entries match even where the entry itself does not name them.
  const [robotIds, gaitIds, userIds, tokenIds] = await Promise.all([
    db
      .select({ id: robots.id })
      .from(robots)
      .where(and(eq(robots.workspaceId, workspaceId), ilike(robots.name, pattern))),
    db
      .select({ id: gaits.id })
      .from(gaits)
      .where(and(eq(gaits.workspaceId, workspaceId), ilike(gaits.name, pattern))),
    db
      .select({ id: users.id })
      .from(users)
      .where(or(ilike(users.name, pattern), ilike(users.login, pattern))),
    db
      .select({ id: apiTokens.id })
      .from(apiTokens)
      .where(and(eq(apiTokens.workspaceId, workspaceId), ilike(apiTokens.name, pattern))),
  ]);
  const named = [...robotIds, ...gaitIds, ...userIds, ...tokenIds].map((row) => row.id);
  const people = userIds.map((row) => row.id);
  const gaitIdList = gaitIds.map((row) => row.id);
  const actions = Object.entries(AUDIT_ACTIONS)
    .filter(([, { label }]) => label.toLowerCase().includes(q.toLowerCase()))
    .map(([action]) => action);
  return or(
    ilike(auditLog.action, pattern),
    sql`${auditLog.details}::text ilike ${pattern}`,
    actions.length > 0 ? inArray(auditLog.action, actions) : undefined,
    named.length > 0 ? inArray(auditLog.targetId, named) : undefined,
    people.length > 0 ? inArray(auditLog.actorId, people) : undefined,
    gaitIdList.length > 0 ? and(eq(auditLog.targetType, "gait_version"), inArray(sql`${auditLog.details} ->> 'gaitId'`, gaitIdList)) : undefined,
  )!;
}

async function filterCondition(workspaceId: string, filter: AuditFilter): Promise<SQL> {
  return and(
    inWorkspace(workspaceId),
    filter.actor === "system" ? isNull(auditLog.actorId) : filter.actor ? eq(auditLog.actorId, filter.actor) : undefined,
    filter.object ? objectCondition(filter.object) : undefined,
    filter.action ? eq(auditLog.action, filter.action) : undefined,
    filter.q ? await searchCondition(workspaceId, filter.q) : undefined,
  )!;
}

/** One page of the log, newest first. */
export async function readAuditLog(workspaceId: string, filter: AuditFilter = {}, cursor: AuditCursor = {}, pageSize = AUDIT_PAGE_SIZE): Promise<AuditPage> {
  const db = database();
  const where = await filterCondition(workspaceId, filter);
  const columns = {
    id: auditLog.id,
    at: auditLog.createdAt,
    action: auditLog.action,
    actorId: auditLog.actorId,
    actorName: users.name,
    targetType: auditLog.targetType,
    targetId: auditLog.targetId,
    details: auditLog.details,
  };
  const base = db.select(columns).from(auditLog).leftJoin(users, eq(users.id, auditLog.actorId));
  let rows;
  if (cursor.after !== undefined) {
    // The page just newer than `after`: read upwards, then show newest first.
    rows = (
      await base
        .where(and(where, gt(auditLog.id, cursor.after)))
        .orderBy(asc(auditLog.id))
        .limit(pageSize)
    ).reverse();
  } else {
    rows = await base
      .where(cursor.before !== undefined ? and(where, lt(auditLog.id, cursor.before)) : where)
      .orderBy(desc(auditLog.id))
      .limit(pageSize);
  }
  const [[{ total }], [{ newerCount }], olderRows] = await Promise.all([
    db.select({ total: count() }).from(auditLog).where(where),
    rows.length > 0
      ? db
          .select({ newerCount: count() })
          .from(auditLog)
          .where(and(where, gt(auditLog.id, rows[0].id)))
      : Promise.resolve([{ newerCount: 0 }]),
    rows.length > 0
      ? db
          .select({ id: auditLog.id })
          .from(auditLog)
          .where(and(where, lt(auditLog.id, rows.at(-1)!.id)))
          .limit(1)
      : Promise.resolve([]),
  ]);
  const names = await resolveNames(rows);
  const entries = rows.map((row): AuditLogEntry => {
    const details = (row.details ?? {}) as Record<string, unknown>;
    const target = names.target(row.targetType, row.targetId, details);
    const actor = row.actorId ? { id: row.actorId, name: row.actorName ?? "a deleted account" } : null;
    return {
      id: row.id,
      at: row.at,
      action: row.action,
      actor,
      target: { type: row.targetType, id: row.targetId, name: target.name },
      sentence: describeAudit({
        action: row.action,
        actor: actor?.name ?? null,
        target,
        gait: names.gaitOf(row.targetType, row.targetId, details),
        people: names.people,
        details,
      }),
      details: row.details,
    };
  });
  return {
    entries,
    total,
    newerCount,
    older: olderRows.length > 0 ? rows.at(-1)!.id : null,
    newer: newerCount > 0 ? rows[0].id : null,
  };
}

type Row = { targetType: string | null; targetId: string | null; details: unknown };

/** What the entry itself calls its object, by the names its writers record. */
function ownName(type: string | null, details: Record<string, unknown>): string | null {
  const pick = (...keys: string[]) => keys.map((key) => details[key]).find((value): value is string => typeof value === "string" && value !== "") ?? null;
  if (type === "robot") return pick("robot", "robotName") ?? (typeof details.profileId === "string" ? null : pick("name"));
  if (type === "gait") return pick("gait", "name");
  if (type === "user") return pick("member");
  if (type === "token") return pick("name");
  if (type === "invitation") return pick("email");
  return null;
}

/** Names, today, of every object the page's entries are about, and of the people they name by id. */
async function resolveNames(rows: Row[]) {
  const db = database();
  const idsOf = (type: string) => [...new Set(rows.filter((row) => row.targetType === type && row.targetId && isId(row.targetId)).map((row) => row.targetId!))];
  const detail = (row: Row, key: string) => {
    const value = (row.details as Record<string, unknown> | null)?.[key];
    return typeof value === "string" && isId(value) ? value : null;
  };
  const versionIds = idsOf("gait_version");
  const gaitIdsFromDetails = rows.filter((row) => row.targetType === "gait_version").flatMap((row) => detail(row, "gaitId") ?? []);
  const peopleIds = [...new Set([...idsOf("user"), ...rows.flatMap((row) => detail(row, "reviewerId") ?? [])])];
  const none = Promise.resolve([]);
  const [robotRows, gaitRows, versionRows, userRows, tokenRows, invitationRows, workspaceRows] = await Promise.all([
    idsOf("robot").length
      ? db
          .select({ id: robots.id, name: robots.name })
          .from(robots)
          .where(inArray(robots.id, idsOf("robot")))
      : none,
    [...idsOf("gait"), ...gaitIdsFromDetails].length
      ? db
          .select({ id: gaits.id, name: gaits.name })
          .from(gaits)
          .where(inArray(gaits.id, [...new Set([...idsOf("gait"), ...gaitIdsFromDetails])]))
      : none,
    versionIds.length
      ? db
          .select({ id: gaitVersions.id, gaitId: gaits.id, gaitName: gaits.name, number: gaitVersions.number })
          .from(gaitVersions)
          .innerJoin(gaits, eq(gaits.id, gaitVersions.gaitId))
          .where(inArray(gaitVersions.id, versionIds))
      : none,
    peopleIds.length ? db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, peopleIds)) : none,
    idsOf("token").length
      ? db
          .select({ id: apiTokens.id, name: apiTokens.name })
          .from(apiTokens)
          .where(inArray(apiTokens.id, idsOf("token")))
      : none,
    idsOf("invitation").length
      ? db
          .select({ id: invitations.id, name: invitations.email })
          .from(invitations)
          .where(inArray(invitations.id, idsOf("invitation")))
      : none,
    idsOf("workspace").length
      ? db
          .select({ id: workspaces.id, name: workspaces.name })
          .from(workspaces)
          .where(inArray(workspaces.id, idsOf("workspace")))
      : none,
  ]);
  const byId = (list: { id: string; name: string }[]) => new Map(list.map((row) => [row.id, row.name]));
  const today: Record<string, Map<string, string>> = {
    robot: byId(robotRows),
    gait: byId(gaitRows),
    user: byId(userRows),
    token: byId(tokenRows),
    invitation: byId(invitationRows),
    workspace: byId(workspaceRows),
  };
  const versions = new Map(versionRows.map((row) => [row.id, row]));

  // Objects gone today (a deleted robot or gait): the newest entry about them that names them.
  const missing = rows
    .filter((row) => row.targetId && (row.targetType === "robot" || row.targetType === "gait") && !today[row.targetType].has(row.targetId))
    .map((row) => row.targetId!);
  const missingGaits = gaitIdsFromDetails.filter((gaitId) => !today.gait.has(gaitId));
  const remembered = new Map<string, string>();
  const lookFor = [...new Set([...missing, ...missingGaits])];
  if (lookFor.length > 0) {
    const named = await db
      .select({ targetId: auditLog.targetId, name: sql<string>`coalesce(${auditLog.details} ->> 'name', ${auditLog.details} ->> 'gait')` })
      .from(auditLog)
      .where(
        and(
          inArray(auditLog.targetId, lookFor),
          sql`coalesce(${auditLog.details} ->> 'name', ${auditLog.details} ->> 'gait') is not null`,
          sql`${auditLog.details} ->> 'profileId' is null`,
        ),
      )
      .orderBy(desc(auditLog.id));
    for (const row of named) if (row.targetId && row.name && !remembered.has(row.targetId)) remembered.set(row.targetId, row.name);
  }

  const hrefOf = (type: string, id: string) => (type === "robot" ? `/robots/${id}` : type === "gait" ? `/gaits/${id}` : null);

  return {
    people: Object.fromEntries(userRows.map((row) => [row.id, row.name])),
    target(type: string | null, id: string | null, details: Record<string, unknown>) {
      if (!type || !id) return { type, id, name: null, href: null };
      if (type === "gait_version") {
        const version = versions.get(id);
        return {
          type,
          id,
          name: version ? `${version.gaitName} v${version.number}` : null,
          href: version ? `/gaits/${version.gaitId}/versions/${version.number}` : null,
        };
      }
      const current = today[type]?.get(id);
      // A person's name today reads better than the one recorded; an object's recorded name is what it was called then.
      if (current) return { type, id, name: type === "user" || type === "token" ? current : (ownName(type, details) ?? current), href: hrefOf(type, id) };
      return { type, id, name: ownName(type, details) ?? remembered.get(id) ?? null, href: null };
    },
    gaitOf(type: string | null, id: string | null, details: Record<string, unknown>) {
      if (type !== "gait_version") return null;
      const version = id ? versions.get(id) : undefined;
      if (version) return { name: version.gaitName, href: `/gaits/${version.gaitId}` };
      const gaitId = typeof details.gaitId === "string" ? details.gaitId : null;
      const name = (gaitId && (today.gait.get(gaitId) ?? remembered.get(gaitId))) || (typeof details.gait === "string" ? details.gait : null);
      return name ? { name, href: gaitId && today.gait.has(gaitId) ? `/gaits/${gaitId}` : null } : null;
    },
  };
}

export type AuditChoices = {
  people: { id: string; name: string }[];
  objects: { kind: AuditKind; label: string; items: { id: string; name: string }[] }[];
  actions: { kind: string; label: string; items: { action: string; label: string }[] }[];
};

/** What the filter offers: the people who appear in the log, the workspace's robots, gaits and members, and every action. */
export async function auditChoices(workspaceId: string): Promise<AuditChoices> {
  const db = database();
  const [actors, robotRows, gaitRows, memberRows] = await Promise.all([
    db.selectDistinct({ id: users.id, name: users.name }).from(auditLog).innerJoin(users, eq(users.id, auditLog.actorId)).where(inWorkspace(workspaceId)),
    db.select({ id: robots.id, name: robots.name, archivedAt: robots.archivedAt }).from(robots).where(eq(robots.workspaceId, workspaceId)),
    db
      .select({ id: gaits.id, name: gaits.name, robot: robots.name, archivedAt: gaits.archivedAt })
      .from(gaits)
      .innerJoin(robots, eq(robots.id, gaits.robotId))
      .where(eq(gaits.workspaceId, workspaceId)),
    db
      .select({ id: users.id, name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.workspaceId, workspaceId)),
  ]);
  const byName = <T extends { name: string }>(list: T[]) => [...list].sort((a, b) => a.name.localeCompare(b.name));
  const archived = (name: string, at: Date | null) => (at ? `${name} (archived)` : name);
  const people = new Map([...actors, ...memberRows].map((row) => [row.id, row.name]));
  const groups = new Map<string, { action: string; label: string }[]>();
  for (const [action, { label, kind }] of Object.entries(AUDIT_ACTIONS)) groups.set(kind, [...(groups.get(kind) ?? []), { action, label }]);
  return {
    people: byName([...people].map(([id, name]) => ({ id, name }))),
    objects: [
      { kind: "robot", label: AUDIT_KINDS.robot, items: byName(robotRows.map((row) => ({ id: row.id, name: archived(row.name, row.archivedAt) }))) },
      {
        kind: "gait",
        label: AUDIT_KINDS.gait,
        items: byName(gaitRows.map((row) => ({ id: row.id, name: archived(`${row.name} (${row.robot})`, row.archivedAt) }))),
      },
      { kind: "user", label: AUDIT_KINDS.user, items: byName(memberRows) },
      { kind: "token", label: AUDIT_KINDS.token, items: [] },
      { kind: "invitation", label: AUDIT_KINDS.invitation, items: [] },
      { kind: "workspace", label: AUDIT_KINDS.workspace, items: [] },
    ],
    actions: [...groups].map(([kind, items]) => ({ kind, label: kind === "mail" ? "Mail" : AUDIT_KINDS[kind as AuditKind], items })),
  };
}
