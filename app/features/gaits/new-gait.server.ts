// Starting a gait: the robots to choose from (with the templates that suit
// each), and the new gait row with its first draft, pinned to the robot's
// newest revision. Also the copy that keeps someone's edits after a stale save.
import { and, desc, eq, isNull } from "drizzle-orm";
import { z } from "zod";
import { gaits, robotRevisions, robots } from "../../../db/schema";
import type { Database } from "../../../db/client";
import { GaitInputError, TEMPLATE_NAMES, generateGait, type GaitParams } from "../../gait/index";
import { parseRobot, type Robot } from "../../kinematics/index";
import { recordAudit } from "../../platform/audit.server";
import { database, isUniqueViolation } from "../../platform/db.server";
import { checkSequenceFor, type DraftActor } from "./drafts.server";
import { ServiceError } from "../../platform/errors.server";
import { fromDecimalText, id } from "../../platform/params";
import { newestRevisionInWorkspace, robotOfRevision } from "../robots/index.server";
import { suitableTemplates, type TemplateChoice } from "./editor/templates";

export type RobotChoice = {
  id: string;
  name: string;
  revision: number;
  legCount: number;
  standHeightMm: number;
  templates: TemplateChoice[];
};

/** Robots of the workspace at their newest revision; robots whose newest revision no longer parses are left out. */
export async function robotChoices(workspaceId: string, db: Database = database()): Promise<RobotChoice[]> {
  const rows = await db
    .selectDistinctOn([robots.id], { id: robots.id, name: robots.name, revision: robotRevisions.number, definition: robotRevisions.definition })
    .from(robots)
    .innerJoin(robotRevisions, eq(robotRevisions.robotId, robots.id))
    // An archived robot is out of the usual lists, this one too.
    .where(and(eq(robots.workspaceId, workspaceId), isNull(robots.archivedAt)))
    .orderBy(robots.id, desc(robotRevisions.number));
  const choices: RobotChoice[] = [];
  for (const row of rows) {
    const parsed = parseRobot(row.definition);
    if (!parsed.ok) continue;
    choices.push({
      id: row.id,
      name: row.name,
      revision: row.revision,
      legCount: parsed.robot.legs.length,
      standHeightMm: parsed.robot.standHeight,
      templates: suitableTemplates(parsed.robot),
    });
  }
  return choices.sort((a, b) => a.name.localeCompare(b.name));
}

// Number fields are read as decimal numbers only (no 0x10, no padding); an empty field takes the default.
const optionalNumber = (schema: z.ZodNumber) =>
  z
    .string()
    .optional()
    .transform((text) => (text === undefined || text === "" ? undefined : fromDecimalText(text)))
    .pipe(schema.optional());

const requiredNumber = (schema: z.ZodNumber, fallback: number) =>
  z
    .string()
    .optional()
    .transform((text) => (text === undefined || text === "" ? fallback : fromDecimalText(text)))
    .pipe(schema);

export const gaitName = z.string().trim().min(1, "give the gait a name").max(120, "the name must be at most 120 characters");

/** The new-gait form: strings in, generator parameters out; each message names its field. */
export const newGaitForm = z.object({
  robotId: id("choose a robot"),
  name: gaitName,
  description: z.string().trim().max(2000, "the description must be at most 2000 characters").optional().default(""),
  template: z.enum(TEMPLATE_NAMES, { error: "choose a template" }),
  cycleMs: requiredNumber(z.number({ error: "must be a number" }).positive("must be positive").max(600_000, "must be at most 600000"), 1200),
  fps: requiredNumber(z.number({ error: "must be a number" }).positive("must be positive").max(1000, "must be at most 1000"), 50),
  strideMm: requiredNumber(z.number({ error: "must be a number" }).finite(), 40),
  stepHeightMm: requiredNumber(z.number({ error: "must be a number" }).min(0, "must be at least 0").max(1000, "must be at most 1000"), 25),
  directionDeg: requiredNumber(z.number({ error: "must be a number" }).finite(), 0),
  turnDegPerCycle: requiredNumber(z.number({ error: "must be a number" }).finite(), 0),
  bodyHeightMm: optionalNumber(z.number({ error: "must be a number" }).positive("must be positive")),
  dutyFactor: optionalNumber(z.number({ error: "must be a number" }).gt(0, "must be above 0").lt(1, "must be below 1")),
});

export type NewGaitInput = z.output<typeof newGaitForm>;

async function newestRobot(db: Database, workspaceId: string, robotId: string): Promise<{ revisionId: string; robot: Robot }> {
  const row = await newestRevisionInWorkspace(workspaceId, robotId, db);
  if (!row) throw new ServiceError(404, "not-found", "No such robot in this workspace.", { field: "robotId" });
  const robot = robotOfRevision({ number: row.revision, definition: row.definition }, { remedy: "fix the robot first", field: "robotId" });
  return { revisionId: row.revisionId, robot };
}

const nameTaken = (name: string) =>
  new ServiceError(409, "name-taken", `This robot already has a gait named “${name}”; choose another name.`, { field: "name" });

async function insertGait(
  db: Database,
  actor: DraftActor,
  row: { robotId: string; name: string; description: string; sequence: unknown; robotRevisionId: string },
  audit: Record<string, unknown>,
): Promise<{ id: string }> {
  const taken = await db
    .select({ id: gaits.id })
    .from(gaits)
    .where(and(eq(gaits.robotId, row.robotId), eq(gaits.name, row.name)));
  if (taken.length > 0) throw nameTaken(row.name);
  try {
    return await db.transaction(async (tx) => {
      const [gait] = await tx
        .insert(gaits)
        .values({
          workspaceId: actor.workspaceId,
          robotId: row.robotId,
          name: row.name,
          description: row.description,
          draftSequence: row.sequence,
          draftRobotRevisionId: row.robotRevisionId,
          draftRevision: 1,
          draftUpdatedById: actor.userId,
          createdById: actor.userId,
        })
        .returning({ id: gaits.id });
      await recordAudit(
        {
          workspaceId: actor.workspaceId,
          actorId: actor.userId,
          action: "gait.created",
          targetType: "gait",
          targetId: gait.id,
          details: { name: row.name, ...audit },
        },
        tx,
      );
      return gait;
    });
  } catch (error) {
    if (isUniqueViolation(error, "gaits_robot_name")) throw nameTaken(row.name);
    throw error;
  }
}

/** A new gait generated from a template for the robot's newest revision. */
export async function createGait(actor: DraftActor, input: NewGaitInput, db: Database = database()): Promise<{ id: string }> {
  const { revisionId, robot } = await newestRobot(db, actor.workspaceId, input.robotId);
  const params: GaitParams = {
    template: input.template,
    name: input.name,
    cycleMs: input.cycleMs,
    fps: input.fps,
    strideMm: input.strideMm,
    stepHeightMm: input.stepHeightMm,
    directionDeg: input.directionDeg,
    turnDegPerCycle: input.turnDegPerCycle,
    bodyHeightMm: input.bodyHeightMm,
    dutyFactor: input.dutyFactor,
  };
  let sequence;
  try {
    sequence = generateGait(robot, params);
  } catch (error) {
    if (error instanceof GaitInputError) {
      const first = error.issues[0];
      throw new ServiceError(
        422,
        "invalid",
        first ? `${first.path}: ${first.message}` : error.message,
        first ? { field: first.path.split(".")[0] } : undefined,
      );
    }
    throw error;
  }
  return insertGait(
    db,
    actor,
    { robotId: input.robotId, name: input.name, description: input.description, sequence, robotRevisionId: revisionId },
    { template: input.template, robot: robot.name },
  );
}

export const copyForm = z.object({
  sourceGaitId: id("the gait to copy is missing"),
  name: gaitName,
  sequence: z.string().min(2, "the sequence to keep is missing"),
});

/** A new gait holding someone's edits, on the same robot revision as the draft they edited. */
export async function createGaitCopy(actor: DraftActor, input: z.output<typeof copyForm>, db: Database = database()): Promise<{ id: string }> {
  const [source] = await db
    .select()
    .from(gaits)
    .where(and(eq(gaits.id, input.sourceGaitId), eq(gaits.workspaceId, actor.workspaceId)));
  if (!source) throw new ServiceError(404, "not-found", "No such gait in this workspace.");
  const revisionId = source.draftRobotRevisionId;
  if (!revisionId) throw new ServiceError(409, "conflict", "The gait to copy has no draft.");
  const [revision] = await db.select().from(robotRevisions).where(eq(robotRevisions.id, revisionId));
  const robot = robotOfRevision(revision);
  let json: unknown;
  try {
    json = JSON.parse(input.sequence);
  } catch {
    throw new ServiceError(400, "bad-request", "The sequence to keep is not valid JSON.", { field: "sequence" });
  }
  const sequence = checkSequenceFor(robot, json);
  return insertGait(
    db,
    actor,
    { robotId: source.robotId, name: input.name, description: source.description, sequence: { ...sequence, name: input.name }, robotRevisionId: revisionId },
    { copyOf: source.id },
  );
}
