// How the audit log reads: each action as a sentence (who did what to which
// object, by name), the actions' names for the log's filter, and the kinds of
// object it can be filtered by. Pure, so the page, its tests and any other
// reader word an entry the same way; the rows come from audit-log.server.ts.

/** The kinds of object an entry can be about, as the log's filter offers them. */
export const AUDIT_KINDS = {
  robot: "Robots",
  gait: "Gaits and versions",
  user: "People",
  token: "API tokens",
  invitation: "Invitations",
  workspace: "The workspace",
} as const;

export type AuditKind = keyof typeof AUDIT_KINDS;

/** Every action the app records, with the words the filter shows, grouped by the kind of object it is about. */
export const AUDIT_ACTIONS: Record<string, { label: string; kind: AuditKind | "mail" }> = {
  "user.signed-in": { label: "Signed in", kind: "user" },
  "session.ended": { label: "Ended a session", kind: "user" },
  "user.signed-out-everywhere": { label: "Signed out everywhere", kind: "user" },
  "member.role-changed": { label: "Changed a member's role", kind: "user" },
  "member.removed": { label: "Removed a member", kind: "user" },
  "invitation.created": { label: "Invited someone", kind: "invitation" },
  "invitation.resent": { label: "Resent an invitation", kind: "invitation" },
  "invitation.revoked": { label: "Revoked an invitation", kind: "invitation" },
  "invitation.accepted": { label: "Joined by invitation", kind: "invitation" },
  "token.created": { label: "Created an API token", kind: "token" },
  "token.revoked": { label: "Revoked an API token", kind: "token" },
  "workspace.created": { label: "Created the workspace", kind: "workspace" },
  "workspace.renamed": { label: "Renamed the workspace", kind: "workspace" },
  "robot.create": { label: "Created a robot", kind: "robot" },
  "robot.save": { label: "Saved a robot", kind: "robot" },
  "robot.archived": { label: "Archived a robot", kind: "robot" },
  "robot.restored": { label: "Restored a robot", kind: "robot" },
  "robot.deleted": { label: "Deleted a robot", kind: "robot" },
  "calibration.created": { label: "Created a calibration profile", kind: "robot" },
  "calibration.updated": { label: "Changed a calibration profile", kind: "robot" },
  "calibration.deleted": { label: "Deleted a calibration profile", kind: "robot" },
  "bench-table.downloaded": { label: "Downloaded a bench table", kind: "robot" },
  "gait.created": { label: "Created a gait", kind: "gait" },
  "gait.archived": { label: "Archived a gait", kind: "gait" },
  "gait.restored": { label: "Restored a gait", kind: "gait" },
  "gait.deleted": { label: "Deleted a gait", kind: "gait" },
  "gait.draft.robot-moved": { label: "Moved a draft to a newer robot revision", kind: "gait" },
  "draft.restored": { label: "Restarted a draft from a version", kind: "gait" },
  "version.committed": { label: "Committed a version", kind: "gait" },
  "version.review-requested": { label: "Asked for a review", kind: "gait" },
  "version.approved": { label: "Approved a version", kind: "gait" },
  "version.approved-with-override": { label: "Approved a version, overriding a rule", kind: "gait" },
  "version.sent-back": { label: "Sent a version back", kind: "gait" },
  "version.released": { label: "Released a version", kind: "gait" },
  "version.retired": { label: "Retired a version", kind: "gait" },
  "table.downloaded": { label: "Downloaded an angle table", kind: "gait" },
  "mail.failed": { label: "A mail could not be sent", kind: "mail" },
  "mail.resent": { label: "Sent a failed mail again", kind: "mail" },
};

/** A piece of an entry's sentence: plain words, or an object's name (a link while the object is still there). */
export type AuditPart = string | { name: string; href: string | null };

/** What the sentence is made from: the entry, with its names resolved by the server. */
export type AuditSubject = {
  action: string;
  actor: string | null;
  /** The object the entry is about, named when the name is known (from the entry or the object's row). */
  target: { type: string | null; id: string | null; name: string | null; href: string | null };
  /** For an entry about a gait version: its gait, by name. */
  gait?: { name: string; href: string | null } | null;
  /** Other people an entry names by id (a reviewer), by their names. */
  people?: Record<string, string>;
  details: Record<string, unknown>;
};

const text = (value: unknown): string | null => (typeof value === "string" && value !== "" ? value : typeof value === "number" ? String(value) : null);

/** The object's name as a part: its name, else what it is and the start of its id. */
function objectPart(subject: AuditSubject, kindWord: string, fallbackName?: unknown): AuditPart {
  const name = subject.target.name ?? text(fallbackName);
  if (name) return { name, href: subject.target.href };
  return subject.target.id ? `${kindWord} ${subject.target.id.slice(0, 8)}… (no longer there)` : kindWord;
}

function gaitPart(subject: AuditSubject): AuditPart {
  if (subject.gait) return { name: subject.gait.name, href: subject.gait.href };
  const named = text(subject.details.gait);
  if (named) return { name: named, href: null };
  return "a gait no longer there";
}

const count = (value: unknown, one: string, many: string) => (typeof value === "number" ? `${value} ${value === 1 ? one : many}` : null);

/**
 * The entry as a sentence, e.g. ["Ines Okafor", " changed ", {Theo Brandt}, "'s role from animator to lead"].
 * An action this list does not know still reads: who, the action's own name, and the object.
 */
export function describeAudit(subject: AuditSubject): AuditPart[] {
  const who = subject.actor ?? (subject.action === "mail.failed" ? "Gaitloom" : "Someone no longer known");
  const d = subject.details;
  const version = text(d.number);
  const parts = (...rest: (AuditPart | null | false)[]): AuditPart[] => [who, ...rest.filter((part): part is AuditPart => part !== null && part !== false)];
  switch (subject.action) {
    case "user.signed-in":
      return parts(" signed in");
    case "session.ended":
      return parts(" ended a session", text(d.browser) ? ` (${text(d.browser)})` : null);
    case "user.signed-out-everywhere":
      return parts(" signed out everywhere", count(d.sessions, "session", "sessions") ? ` (${count(d.sessions, "session", "sessions")} ended)` : null);
    case "workspace.created":
      return parts(" created the workspace ", objectPart(subject, "workspace"));
    case "workspace.renamed":
      return parts(` renamed the workspace from “${text(d.from) ?? "?"}” to “${text(d.to) ?? "?"}”`);
    case "member.role-changed":
      return parts(" changed ", objectPart(subject, "member", d.member), `’s role from ${text(d.from) ?? "?"} to ${text(d.to) ?? "?"}`);
    case "member.removed":
      return parts(" removed ", objectPart(subject, "member", d.member), text(d.role) ? ` (${text(d.role)})` : null, " from the workspace");
    case "invitation.created":
      return parts(` invited ${text(d.email) ?? "someone"}`, text(d.role) ? ` as ${text(d.role)}` : null);
    case "invitation.resent":
      return parts(` resent the invitation to ${text(d.email) ?? "someone"}`);
    case "invitation.revoked":
      return parts(` revoked the invitation to ${text(d.email) ?? "someone"}`);
    case "invitation.accepted":
      return parts(" joined", text(d.role) ? ` as ${text(d.role)}` : null, text(d.email) ? ` by the invitation to ${text(d.email)}` : null);
    case "token.created":
      return parts(" created the API token ", objectPart(subject, "token", d.name), text(d.expiresAt) ? `, expiring ${text(d.expiresAt)!.slice(0, 10)}` : null);
    case "token.revoked":
      return parts(" revoked the API token ", objectPart(subject, "token", d.name));
    case "robot.create":
      return parts(" created robot ", objectPart(subject, "robot", d.name), text(d.source) ? ` (${text(d.source)})` : null);
    case "robot.save":
      return parts(
        " saved robot ",
        objectPart(subject, "robot", d.name),
        text(d.revision) ? ` revision ${text(d.revision)}` : null,
        text(d.renamedFrom) ? ` (renamed from ${text(d.renamedFrom)})` : null,
        count(d.changedFields, "field changed", "fields changed") ? ` (${count(d.changedFields, "field changed", "fields changed")})` : null,
      );
    case "robot.archived":
      return parts(" archived robot ", objectPart(subject, "robot", d.name));
    case "robot.restored":
      return parts(" restored robot ", objectPart(subject, "robot", d.name), " from the archive");
    case "robot.deleted":
      return parts(
        " deleted robot ",
        objectPart(subject, "robot", d.name),
        count(d.revisions, "revision", "revisions") ? ` and its ${count(d.revisions, "revision", "revisions")}` : null,
      );
    case "calibration.created":
    case "calibration.updated":
    case "calibration.deleted": {
      const verb = { "calibration.created": "created", "calibration.updated": "changed", "calibration.deleted": "deleted" }[subject.action];
      return parts(
        ` ${verb} calibration profile “${text(d.name) ?? "?"}”`,
        text(d.revision) ? ` (revision ${text(d.revision)})` : null,
        " of robot ",
        objectPart(subject, "robot"),
      );
    }
    case "bench-table.downloaded":
      return parts(
        ` downloaded the bench table${text(d.table) ? ` “${text(d.table)}”` : ""} of robot `,
        objectPart(subject, "robot", d.robot),
        text(d.revision) ? ` revision ${text(d.revision)}` : null,
      );
    case "gait.created":
      return parts(" created gait ", objectPart(subject, "gait", d.name));
    case "gait.archived":
      return parts(" archived gait ", objectPart(subject, "gait", d.name));
    case "gait.restored":
      return parts(" restored gait ", objectPart(subject, "gait", d.name), " from the archive");
    case "gait.deleted":
      return parts(
        " deleted gait ",
        objectPart(subject, "gait", d.name),
        count(d.versions, "version", "versions") ? ` and its ${count(d.versions, "version", "versions")}` : null,
      );
    case "gait.draft.robot-moved":
      return parts(
        " moved the draft of gait ",
        objectPart(subject, "gait", d.gait),
        ` from robot revision ${text(d.fromRobotRevision) ?? "?"} to ${text(d.toRobotRevision) ?? "?"}`,
      );
    case "draft.restored":
      return parts(" restarted the draft of gait ", objectPart(subject, "gait", d.gait), text(d.fromVersion) ? ` from version ${text(d.fromVersion)}` : null);
    case "version.committed":
      return parts(" committed version ", version ?? "?", " of gait ", objectPart(subject, "gait", d.gait));
    case "version.review-requested": {
      const reviewer = text(d.reviewerId) ? (subject.people?.[text(d.reviewerId)!] ?? null) : null;
      return parts(" asked ", reviewer ?? "a reviewer", " to review version ", version ?? "?", " of gait ", gaitPart(subject));
    }
    case "version.approved":
      return parts(" approved version ", version ?? "?", " of gait ", gaitPart(subject));
    case "version.approved-with-override": {
      const reason = typeof d.override === "object" && d.override !== null ? text((d.override as Record<string, unknown>).reason) : null;
      return parts(" approved version ", version ?? "?", " of gait ", gaitPart(subject), reason ? `, overriding a rule: “${reason}”` : ", overriding a rule");
    }
    case "version.sent-back":
      return parts(" sent version ", version ?? "?", " of gait ", gaitPart(subject), " back");
    case "version.released":
      return parts(" released version ", version ?? "?", " of gait ", gaitPart(subject));
    case "version.retired":
      return parts(
        " retired version ",
        version ?? "?",
        " of gait ",
        gaitPart(subject),
        text(d.replacedBy) ? ` (version ${text(d.replacedBy)} released)` : null,
      );
    case "table.downloaded":
      return parts(
        ` downloaded the ${[text(d.format), text(d.units)].filter(Boolean).join(" ")} table of version `,
        version ?? "?",
        " of gait ",
        gaitPart(subject),
      );
    case "mail.failed":
      return [
        `A mail to ${text(d.to) ?? "someone"}${text(d.topic) ? ` (${text(d.topic)})` : ""} could not be sent after ${text(d.attempts) ?? "several"} tries`,
      ];
    case "mail.resent":
      return parts(` sent the mail to ${text(d.to) ?? "someone"} again`);
    default:
      return parts(` ${subject.action}`, subject.target.type ? " on " : null, subject.target.type ? objectPart(subject, subject.target.type) : null);
  }
}

/** The sentence as plain text, for a search result, a title or a test. */
export const auditSentence = (parts: AuditPart[]) => parts.map((part) => (typeof part === "string" ? part : part.name)).join("");
