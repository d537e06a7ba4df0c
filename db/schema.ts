// The database schema. Migrations under db/migrations are generated from this
// file with `npx drizzle-kit generate` and committed; never edit them by hand.
import { sql } from "drizzle-orm";
import {
  type AnyPgColumn,
  bigint,
  bigserial,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";

export const roleEnum = pgEnum("role", ["owner", "lead", "animator", "firmware", "viewer"]);

export const versionStateEnum = pgEnum("version_state", ["committed", "in-review", "sent-back", "approved", "released", "retired"]);

// The columns most tables share, written once.
const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
/** A row that belongs to another and goes with it. */
const belongsTo = (name: string, parent: () => AnyPgColumn) => uuid(name).notNull().references(parent, { onDelete: "cascade" });

export const users = pgTable("users", {
  id: uuid("id").primaryKey().defaultRandom(),
  githubId: bigint("github_id", { mode: "number" }).unique(),
  login: text("login").notNull().unique(),
  name: text("name").notNull(),
  email: text("email").notNull(),
  // Every address GitHub had verified at the last sign-in, lower-cased: an invitation is accepted only by one of these.
  verifiedEmails: text("verified_emails")
    .array()
    .notNull()
    .default(sql`'{}'::text[]`),
  avatarUrl: text("avatar_url"),
  createdAt: createdAt(),
});

/** Who did something; kept as history when the person is gone from the workspace. */
const person = (name: string) => uuid(name).references(() => users.id);

export const workspaces = pgTable("workspaces", {
  id: uuid("id").primaryKey().defaultRandom(),
  slug: text("slug").notNull().unique(),
  name: text("name").notNull(),
  createdAt: createdAt(),
});

export const memberships = pgTable(
  "memberships",
  {
    workspaceId: belongsTo("workspace_id", () => workspaces.id),
    userId: belongsTo("user_id", () => users.id),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (table) => [primaryKey({ columns: [table.workspaceId, table.userId] })],
);

export const robots = pgTable(
  "robots",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: belongsTo("workspace_id", () => workspaces.id),
    name: text("name").notNull(),
    createdById: person("created_by_id"),
    createdAt: createdAt(),
    // Archived: kept and restorable, hidden from the usual lists (decision 012).
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    archivedById: uuid("archived_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [unique("robots_workspace_name").on(table.workspaceId, table.name)],
);

/** Every save of a robot is a new, immutable revision. */
export const robotRevisions = pgTable(
  "robot_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    robotId: belongsTo("robot_id", () => robots.id),
    number: integer("number").notNull(),
    definition: jsonb("definition").notNull(),
    message: text("message").notNull().default(""),
    authorId: person("author_id"),
    createdAt: createdAt(),
  },
  (table) => [unique("robot_revisions_robot_number").on(table.robotId, table.number)],
);

/** A gait holds its working draft; committed versions live in gait_versions. */
export const gaits = pgTable(
  "gaits",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: belongsTo("workspace_id", () => workspaces.id),
    robotId: belongsTo("robot_id", () => robots.id),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    draftSequence: jsonb("draft_sequence"),
    draftRobotRevisionId: uuid("draft_robot_revision_id").references(() => robotRevisions.id),
    // Optimistic concurrency: every draft save must name the revision it started from.
    draftRevision: integer("draft_revision").notNull().default(0),
    draftUpdatedAt: timestamp("draft_updated_at", { withTimezone: true }).notNull().defaultNow(),
    draftUpdatedById: person("draft_updated_by_id"),
    createdById: person("created_by_id"),
    createdAt: createdAt(),
    // Archived: kept and restorable, hidden from the usual lists (decision 012).
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    archivedById: uuid("archived_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [unique("gaits_robot_name").on(table.robotId, table.name)],
);

export const gaitVersions = pgTable(
  "gait_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    gaitId: belongsTo("gait_id", () => gaits.id),
    number: integer("number").notNull(),
    message: text("message").notNull(),
    authorId: person("author_id"),
    robotRevisionId: uuid("robot_revision_id")
      .notNull()
      .references(() => robotRevisions.id),
    sequence: jsonb("sequence").notNull(),
    summary: jsonb("summary")
      .notNull()
      .default(sql`'{}'::jsonb`),
    contentHash: text("content_hash").notNull(),
    state: versionStateEnum("state").notNull().default("committed"),
    // The content above never changes (a trigger refuses it); the review fields below do.
    reviewerId: person("reviewer_id"),
    stateChangedAt: timestamp("state_changed_at", { withTimezone: true }).notNull().defaultNow(),
    createdAt: createdAt(),
  },
  (table) => [
    unique("gait_versions_gait_number").on(table.gaitId, table.number),
    // At most one released version per gait.
    uniqueIndex("gait_versions_one_released")
      .on(table.gaitId)
      .where(sql`${table.state} = 'released'`),
  ],
);

/** Every review step of a version: requests, decisions (with comments and overrides), releases. */
export const reviewEvents = pgTable(
  "review_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    versionId: belongsTo("version_id", () => gaitVersions.id),
    actorId: person("actor_id"),
    fromState: versionStateEnum("from_state"),
    toState: versionStateEnum("to_state").notNull(),
    comment: text("comment").notNull().default(""),
    // Set when the step went past a rule (own version, error flags), with the reason given.
    overrideReason: text("override_reason"),
    createdAt: createdAt(),
  },
  (table) => [index("review_events_version").on(table.versionId)],
);

/** What a release shipped, so its table can be reproduced byte for byte. */
export const releases = pgTable("releases", {
  id: uuid("id").primaryKey().defaultRandom(),
  versionId: belongsTo("version_id", () => gaitVersions.id),
  releasedById: person("released_by_id"),
  tableSha256: text("table_sha256").notNull(),
  tableFormat: text("table_format").notNull(),
  solverVersion: text("solver_version").notNull(),
  exporterVersion: text("exporter_version").notNull(),
  createdAt: createdAt(),
});

/** Per-unit calibration of a robot (trim, reversal, channel overrides), edited by firmware. */
export const calibrationProfiles = pgTable(
  "calibration_profiles",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    robotId: belongsTo("robot_id", () => robots.id),
    name: text("name").notNull(),
    profile: jsonb("profile").notNull(),
    revision: integer("revision").notNull().default(1),
    updatedById: person("updated_by_id"),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    createdAt: createdAt(),
  },
  (table) => [unique("calibration_profiles_robot_name").on(table.robotId, table.name)],
);

/** A pending or used invitation; the link's token is stored only as a hash. */
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: belongsTo("workspace_id", () => workspaces.id),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    invitedById: person("invited_by_id"),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    lastSentAt: timestamp("last_sent_at", { withTimezone: true }).notNull().defaultNow(),
    sendCount: integer("send_count").notNull().default(1),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedById: person("accepted_by_id"),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("invitations_workspace").on(table.workspaceId), index("invitations_email").on(table.email)],
);

/** Personal API tokens for build scripts: shown once, stored as a SHA-256 hash. */
export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: belongsTo("workspace_id", () => workspaces.id),
    userId: belongsTo("user_id", () => users.id),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    // The first characters, so a person can tell their tokens apart.
    prefix: text("prefix").notNull(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    // Chosen at creation; null: the token does not expire. Past it the token answers 401.
    expiresAt: timestamp("expires_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("api_tokens_user").on(table.userId)],
);

/** Who did what, when: sign-ins, roles, invitations, tokens, reviews, downloads. */
export const auditLog = pgTable(
  "audit_log",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    workspaceId: uuid("workspace_id").references(() => workspaces.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    targetType: text("target_type"),
    targetId: text("target_id"),
    details: jsonb("details")
      .notNull()
      .default(sql`'{}'::jsonb`),
    createdAt: createdAt(),
  },
  (table) => [
    index("audit_log_workspace_time").on(table.workspaceId, table.createdAt),
    // The log page reads newest first by id (its paging key), filtered by person or by object.
    index("audit_log_workspace_id").on(table.workspaceId, table.id),
    index("audit_log_actor_id").on(table.actorId, table.id),
    index("audit_log_target").on(table.targetType, table.targetId),
  ],
);

/**
 * Browser sessions: the cookie holds only a signed id, so signing out (here or
 * everywhere) ends a session for good. A row without a user is a visitor's
 * before sign-in (it carries the address to return to).
 */
export const sessions = pgTable(
  "sessions",
  {
    id: text("id").primaryKey(),
    userId: uuid("user_id").references(() => users.id, { onDelete: "cascade" }),
    data: jsonb("data").notNull(),
    userAgent: text("user_agent"),
    createdAt: createdAt(),
    lastSeenAt: timestamp("last_seen_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  },
  (table) => [index("sessions_user").on(table.userId), index("sessions_expires").on(table.expiresAt)],
);

/** Request counters shared by every app process (rate-limiter-flexible's Drizzle store: key, points, expire). */
export const rateLimits = pgTable("rate_limits", {
  key: text("key").primaryKey(),
  points: integer("points").notNull().default(0),
  expire: timestamp("expire", { withTimezone: true }),
});

export const mailStateEnum = pgEnum("mail_state", ["queued", "sent", "failed"]);

/**
 * Outgoing e-mail, written in the same transaction as the action that sends
 * it and delivered by the job runner with retries: nothing is sent for an
 * action that rolled back, and nothing an action promised is lost.
 */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id").references(() => workspaces.id, { onDelete: "cascade" }),
    senderId: uuid("sender_id").references(() => users.id, { onDelete: "set null" }),
    // What the mail is about, so the page that sent it can show how it went.
    topic: text("topic").notNull(),
    targetType: text("target_type"),
    targetId: text("target_id"),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    body: text("body").notNull(),
    state: mailStateEnum("state").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    createdAt: createdAt(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    failedAt: timestamp("failed_at", { withTimezone: true }),
  },
  (table) => [index("mail_outbox_target").on(table.targetType, table.targetId), index("mail_outbox_state").on(table.state, table.createdAt)],
);

export type Role = (typeof roleEnum.enumValues)[number];
export type VersionState = (typeof versionStateEnum.enumValues)[number];
export type MailState = (typeof mailStateEnum.enumValues)[number];
