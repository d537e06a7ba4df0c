// The one table of who may do what. Every loader, action and API route asks
// it through `requireAccess` (app/platform/access.server.ts); the UI asks `can` to
// hide what a role cannot do, and the server refuses it anyway.
import type { Role } from "../../db/schema";

export type { Role };

export const ROLES = ["owner", "lead", "animator", "firmware", "viewer"] as const satisfies readonly Role[];

const everyone: readonly Role[] = ROLES;
const editors: readonly Role[] = ["owner", "lead", "animator"];
const leads: readonly Role[] = ["owner", "lead"];

export const PERMISSIONS = {
  // Reading: every member reads everything in the workspace.
  "workspace.read": everyone,
  "robots.read": everyone,
  "gaits.read": everyone,
  "reviews.read": everyone,
  "members.read": everyone,
  "audit.read": everyone,
  // The workspace itself.
  "workspace.manage": ["owner"],
  "members.changeRole": ["owner"],
  "members.remove": ["owner"],
  "invitations.manage": leads,
  // The local inbox (local and test mode) holds every invitation's link, as good as a membership.
  "mail.readLocal": ["owner"],
  // API tokens act with the holder's role; only these roles may hold one.
  "tokens.manage": ["owner", "lead", "firmware"],
  // Robots: geometry and limits by editors; servo mapping and calibration also by firmware.
  "robots.edit": editors,
  "robots.calibrate": [...editors, "firmware"],
  // Archiving and restoring are edits (robots.edit, gaits.edit); deleting for good is the owner's.
  "robots.delete": ["owner"],
  // Gaits and their versions.
  "gaits.edit": editors,
  "gaits.delete": ["owner"],
  "versions.commit": editors,
  "versions.requestReview": editors,
  "versions.decide": leads,
  "versions.release": leads,
  // Firmware output, the solver, tuning and the bench.
  "tables.download": ["owner", "lead", "animator", "firmware"],
  "solver.use": everyone,
  "tuning.run": editors,
  "bench.stream": ["owner", "lead", "firmware"],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof PERMISSIONS;

/** How a refusal reads: "The viewer role cannot edit robots." */
const ACTION_PHRASES: Record<Action, string> = {
  "workspace.read": "open this workspace",
  "robots.read": "see robots",
  "gaits.read": "see gaits",
  "reviews.read": "see reviews",
  "members.read": "see the members",
  "audit.read": "read the audit log",
  "workspace.manage": "change the workspace settings",
  "members.changeRole": "change members' roles",
  "members.remove": "remove members",
  "invitations.manage": "invite people",
  "mail.readLocal": "read the local inbox",
  "tokens.manage": "hold API tokens",
  "robots.edit": "edit robots",
  "robots.calibrate": "edit servo mapping and calibration",
  "robots.delete": "delete robots",
  "gaits.edit": "edit gaits",
  "gaits.delete": "delete gaits",
  "versions.commit": "commit versions",
  "versions.requestReview": "request reviews",
  "versions.decide": "approve or send back versions",
  "versions.release": "release versions",
  "tables.download": "download angle tables",
  "solver.use": "use the solver",
  "tuning.run": "run tuning jobs",
  "bench.stream": "stream to a robot on the bench",
};

/** What a loader, an action or one of its intents needs: a permission, only a signed-in person, or nothing. */
export type Requirement = Action | "signed-in" | "public";

/**
 * What a route module's loader and action need, exported by the module as
 * `permissions` and passed by its own loader and action to the access check,
 * so it is written once. An action told apart by an `intent` field names each
 * intent. The role × route matrix (test/integration/access) reads it for its
 * expected answers, and the OpenAPI document for each operation's x-permission.
 */
export type RoutePermissions = {
  loader?: Requirement;
  action?: Requirement | { readonly [intent: string]: Requirement };
};

/** The requirement a route module declares for its loader, or for its action (one intent of it, when it has intents); undefined when it declares none. */
export function requirementOf(permissions: RoutePermissions | undefined, kind: "loader" | "action", intent?: string): Requirement | undefined {
  const declared = permissions?.[kind];
  if (declared === undefined || typeof declared === "string") return declared;
  return intent !== undefined && Object.hasOwn(declared, intent) ? declared[intent] : undefined;
}

export function refusal(role: Role, action: Action): string {
  return `The ${role} role cannot ${ACTION_PHRASES[action]}.`;
}

export function can(role: Role | null | undefined, action: Action): boolean {
  return role ? (PERMISSIONS[action] as readonly Role[]).includes(role) : false;
}

/** Roles a person with `role` may hand out in an invitation (a lead cannot invite an owner). */
export function invitableRoles(role: Role): Role[] {
  if (role === "owner") return [...ROLES];
  if (role === "lead") return ROLES.filter((candidate) => candidate !== "owner");
  return [];
}

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  lead: "Lead",
  animator: "Animator",
  firmware: "Firmware",
  viewer: "Viewer",
};
