// Calibration profiles: one physical unit of a robot (named, e.g. by its
// serial number) with its per-joint trim, reversal and channel overrides,
// applied when a table is exported. Checked with app/export's schema against
// the robot's newest revision; every save names the revision it started from
// (optimistic concurrency), and every change goes into the audit log.
import { and, asc, eq } from "drizzle-orm";
import { calibrationProfiles, robots, users } from "../../../db/schema";
import type { Database } from "../../../db/client";
import {
  TableExportError,
  calibrationIssuesForRobot,
  parseCalibrationProfile,
  tableChannels,
  type TableExportIssue,
  type ValidCalibrationProfile,
} from "../../export/index";
import { JOINT_NAMES, type Robot } from "../../kinematics/index";
import { recordAudit } from "../../platform/audit.server";
import { database, isUniqueViolation, type Reader, type Writer } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";
import { isDecimal } from "../../platform/params";
import { robotOfRevision } from "./revision-robot.server";
import { newestRevisionInWorkspace } from "./robots.server";

/** Shorter than the schema's 120, so the header's "<name> (revision N)" still fits. */
export const PROFILE_NAME_LIMIT = 100;

export type StoredProfile = {
  id: string;
  robotId: string;
  name: string;
  profile: ValidCalibrationProfile;
  revision: number;
  updatedAt: Date;
  updatedBy: { login: string; name: string } | null;
};

/** A profile that is not valid or does not fit the robot: 422 with the issues by path (`joints.LF.femur.trimDeg`), the first one as the field. */
const invalidProfile = (message: string, issues: TableExportIssue[]) =>
  new ServiceError(422, "invalid", message, { ...(issues[0] ? { field: issues[0].path } : {}), issues });

export type CalibrationActor = { userId: string; workspaceId: string };

// ---------------------------------------------------------------------------
// Reading

export type CalibrationRobot = { id: string; name: string; revision: number; robot: Robot };

/** The robot (newest revision) of this workspace; 404 otherwise. */
export async function calibrationRobot(workspaceId: string, robotId: string, db: Reader = database()): Promise<CalibrationRobot> {
  const row = await newestRevisionInWorkspace(workspaceId, robotId, db);
  if (!row) throw new ServiceError(404, "not-found", `No robot ${robotId} in this workspace.`);
  const robot = robotOfRevision({ number: row.revision, definition: row.definition }, { robotName: row.name, remedy: "fix the robot first" });
  return { id: row.id, name: row.name, revision: row.revision, robot };
}

const profileColumns = {
  id: calibrationProfiles.id,
  robotId: calibrationProfiles.robotId,
  name: calibrationProfiles.name,
  profile: calibrationProfiles.profile,
  revision: calibrationProfiles.revision,
  updatedAt: calibrationProfiles.updatedAt,
  updaterLogin: users.login,
  updaterName: users.name,
};

type ProfileRow = {
  id: string;
  robotId: string;
  name: string;
  profile: unknown;
  revision: number;
  updatedAt: Date;
  updaterLogin: string | null;
  updaterName: string | null;
};

const storedProfile = (row: ProfileRow): StoredProfile => ({
  id: row.id,
  robotId: row.robotId,
  name: row.name,
  profile: row.profile as ValidCalibrationProfile,
  revision: row.revision,
  updatedAt: row.updatedAt,
  updatedBy: row.updaterLogin ? { login: row.updaterLogin, name: row.updaterName ?? row.updaterLogin } : null,
});

function selectProfiles(db: Reader) {
  return db.select(profileColumns).from(calibrationProfiles).leftJoin(users, eq(users.id, calibrationProfiles.updatedById));
}

/** The robot's profiles by name. The robot must be in the workspace (calibrationRobot checks it). */
export async function listProfiles(robotId: string, db: Reader = database()): Promise<StoredProfile[]> {
  const rows = await selectProfiles(db).where(eq(calibrationProfiles.robotId, robotId)).orderBy(asc(calibrationProfiles.name));
  return rows.map(storedProfile);
}

/** One profile of the robot by name, and the names there are (for a message when there is none). */
export async function findProfileByName(robotId: string, name: string, db: Reader = database()): Promise<{ profile: StoredProfile | null; names: string[] }> {
  const all = await listProfiles(robotId, db);
  return { profile: all.find((entry) => entry.name === name) ?? null, names: all.map((entry) => entry.name) };
}

// ---------------------------------------------------------------------------
// Checking

/** Validates a profile against the robot: the schema, its legs, and no two joints on one channel. */
export function checkProfile(robot: Robot, json: unknown): ValidCalibrationProfile {
  const parsed = parseCalibrationProfile(json);
  if (!parsed.ok) throw invalidProfile(`The profile is not valid (${plural(parsed.issues.length, "problem")}).`, parsed.issues);
  const profile = parsed.profile;
  const issues: TableExportIssue[] = [];
  if (profile.name.length > PROFILE_NAME_LIMIT) issues.push({ path: "name", message: `must be at most ${PROFILE_NAME_LIMIT} characters` });
  issues.push(...calibrationIssuesForRobot(robot, profile));
  if (issues.length === 0) {
    try {
      tableChannels(robot, profile);
    } catch (error) {
      if (!(error instanceof TableExportError)) throw error;
      issues.push(...(error.issues.length ? error.issues : [{ path: "joints", message: error.message }]));
    }
  }
  if (issues.length) throw invalidProfile(`The profile does not fit ${robot.name} (${plural(issues.length, "problem")}).`, issues);
  return profile;
}

const plural = (count: number, word: string) => `${count} ${word}${count === 1 ? "" : "s"}`;

/**
 * A profile from the editor's form: `name`, `description`, and per joint
 * `joints.<leg>.<joint>.trimDeg` (degrees), `.reversed` ("" = the robot's,
 * "true", "false") and `.channel`, named like the profile's paths so that each
 * issue lands beside its field. Empty fields say nothing.
 */
export function profileFromForm(robot: Robot, form: FormData): { json: unknown; issues: TableExportIssue[] } {
  const issues: TableExportIssue[] = [];
  const raw = (name: string) => {
    const value = form.get(name);
    return typeof value === "string" ? value : "";
  };
  const text = (name: string) => raw(name).trim();
  const joints: Record<string, Record<string, Record<string, unknown>>> = {};
  for (const leg of robot.legs) {
    for (const joint of JOINT_NAMES) {
      const path = `joints.${leg.id}.${joint}`;
      const entry: Record<string, unknown> = {};
      // Numbers as a number field sends them: decimal, unpadded (not 0x10, not " 1.5").
      const trim = raw(`${path}.trimDeg`);
      if (trim.trim() !== "") {
        const value = isDecimal(trim) ? Number(trim) : Number.NaN;
        if (Number.isFinite(value)) entry.trimDeg = value;
        else issues.push({ path: `${path}.trimDeg`, message: `must be a number of degrees written in decimal (got ${JSON.stringify(trim)})` });
      }
      const reversed = text(`${path}.reversed`);
      if (reversed === "true" || reversed === "false") entry.reversed = reversed === "true";
      const channel = text(`${path}.channel`);
      if (channel !== "") {
        const value = Number(channel);
        if (/^[0-9]+$/.test(channel)) entry.channel = value;
        else issues.push({ path: `${path}.channel`, message: `must be a whole channel number (got ${JSON.stringify(channel)})` });
      }
      if (Object.keys(entry).length) (joints[leg.id] ??= {})[joint] = entry;
    }
  }
  const description = text("description");
  return { json: { name: text("name"), ...(description ? { description } : {}), joints }, issues };
}

// ---------------------------------------------------------------------------
// Changing

async function nameTaken(db: Reader, robotId: string, name: string, exceptId?: string): Promise<boolean> {
  const rows = await db
    .select({ id: calibrationProfiles.id })
    .from(calibrationProfiles)
    .where(and(eq(calibrationProfiles.robotId, robotId), eq(calibrationProfiles.name, name)));
  return rows.some((row) => row.id !== exceptId);
}

const nameTakenError = (name: string, robot: string) =>
  new ServiceError(409, "name-taken", `${robot} already has a calibration profile named "${name}"; choose another name (e.g. the unit's serial number).`, {
    field: "name",
  });

/** A profile's change in the audit log, on its robot: which profile, its name and revision in `details`. */
function auditProfile(tx: Writer, actor: CalibrationActor, action: string, robotId: string, details: Record<string, unknown>) {
  return recordAudit({ workspaceId: actor.workspaceId, actorId: actor.userId, action, targetType: "robot", targetId: robotId, details }, tx);
}

export async function createProfile(actor: CalibrationActor, robotId: string, json: unknown, db: Database = database()): Promise<StoredProfile> {
  const target = await calibrationRobot(actor.workspaceId, robotId, db);
  const profile = checkProfile(target.robot, json);
  if (await nameTaken(db, robotId, profile.name)) throw nameTakenError(profile.name, target.name);
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(calibrationProfiles)
        .values({ robotId, name: profile.name, profile, revision: 1, updatedById: actor.userId })
        .returning({ id: calibrationProfiles.id });
      await auditProfile(tx, actor, "calibration.created", robotId, { profileId: row.id, name: profile.name, revision: 1 });
      const [stored] = await selectProfiles(tx).where(eq(calibrationProfiles.id, row.id));
      return storedProfile(stored);
    });
  } catch (error) {
    if (isUniqueViolation(error, "calibration_profiles_robot_name")) throw nameTakenError(profile.name, target.name);
    throw error;
  }
}

async function staleOrMissing(db: Reader, robotId: string, profileId: string, baseRevision: number): Promise<never> {
  const [current] = await db
    .select({ revision: calibrationProfiles.revision, name: calibrationProfiles.name })
    .from(calibrationProfiles)
    .where(and(eq(calibrationProfiles.id, profileId), eq(calibrationProfiles.robotId, robotId)));
  if (!current) throw new ServiceError(404, "not-found", "This calibration profile no longer exists; someone deleted it.");
  throw new ServiceError(
    409,
    "stale",
    `Profile "${current.name}" changed since you opened it (revision ${baseRevision}, now ${current.revision}); reload to see the other edits before saving yours.`,
  );
}

/** Saves a new content over revision `baseRevision`; 409 when someone saved since. */
export async function updateProfile(
  actor: CalibrationActor,
  robotId: string,
  profileId: string,
  json: unknown,
  baseRevision: number,
  db: Database = database(),
): Promise<StoredProfile> {
  const target = await calibrationRobot(actor.workspaceId, robotId, db);
  const profile = checkProfile(target.robot, json);
  if (await nameTaken(db, robotId, profile.name, profileId)) throw nameTakenError(profile.name, target.name);
  try {
    return await db.transaction(async (tx) => {
      const updated = await tx
        .update(calibrationProfiles)
        .set({ name: profile.name, profile, revision: baseRevision + 1, updatedById: actor.userId, updatedAt: new Date() })
        .where(and(eq(calibrationProfiles.id, profileId), eq(calibrationProfiles.robotId, robotId), eq(calibrationProfiles.revision, baseRevision)))
        .returning({ id: calibrationProfiles.id });
      if (updated.length === 0) await staleOrMissing(tx, robotId, profileId, baseRevision);
      await auditProfile(tx, actor, "calibration.updated", robotId, { profileId, name: profile.name, revision: baseRevision + 1 });
      const [stored] = await selectProfiles(tx).where(eq(calibrationProfiles.id, profileId));
      return storedProfile(stored);
    });
  } catch (error) {
    if (isUniqueViolation(error, "calibration_profiles_robot_name")) throw nameTakenError(profile.name, target.name);
    throw error;
  }
}

/** Deletes the profile as it was at `baseRevision`; 409 when someone saved since. */
export async function deleteProfile(
  actor: CalibrationActor,
  robotId: string,
  profileId: string,
  baseRevision: number,
  db: Database = database(),
): Promise<{ name: string }> {
  await calibrationRobot(actor.workspaceId, robotId, db);
  return db.transaction(async (tx) => {
    const deleted = await tx
      .delete(calibrationProfiles)
      .where(and(eq(calibrationProfiles.id, profileId), eq(calibrationProfiles.robotId, robotId), eq(calibrationProfiles.revision, baseRevision)))
      .returning({ name: calibrationProfiles.name });
    if (deleted.length === 0) await staleOrMissing(tx, robotId, profileId, baseRevision);
    await auditProfile(tx, actor, "calibration.deleted", robotId, { profileId, name: deleted[0].name, revision: baseRevision });
    return { name: deleted[0].name };
  });
}

/** The workspace's robots with how many calibration profiles each has. */
export async function robotsWithProfiles(workspaceId: string, db: Reader = database()): Promise<{ id: string; name: string; profiles: number }[]> {
  const rows = await db
    .select({ id: robots.id, name: robots.name, profileId: calibrationProfiles.id })
    .from(robots)
    .leftJoin(calibrationProfiles, eq(calibrationProfiles.robotId, robots.id))
    .where(eq(robots.workspaceId, workspaceId))
    .orderBy(asc(robots.name));
  const byRobot = new Map<string, { id: string; name: string; profiles: number }>();
  for (const row of rows) {
    const entry = byRobot.get(row.id) ?? { id: row.id, name: row.name, profiles: 0 };
    if (row.profileId) entry.profiles += 1;
    byRobot.set(row.id, entry);
  }
  return [...byRobot.values()];
}
