// Route parameters and form fields of the robot routes, checked with zod.
import { z } from "zod";
import { id, idParam, revisionNumber } from "../../platform/params";
import { STARTER_LEG_COUNTS } from "./starter";

export const robotParams = z.object({
  robotId: idParam("robotId"),
});

export const revisionParams = robotParams.extend({
  number: revisionNumber((issue) => `the revision number must be a whole number from 1 (got ${JSON.stringify(issue.input)})`),
});

export const saveForm = z.object({
  intent: z.literal("save", { error: (issue) => `intent must be "save" (got ${JSON.stringify(issue.input ?? null)})` }),
  baseRevision: z
    .string({ error: "baseRevision is required: the revision the edits started from" })
    .pipe(revisionNumber((issue) => `baseRevision must be a revision number (got ${JSON.stringify(issue.input)})`)),
  definition: z.string({ error: "definition is required: the robot definition as JSON" }).min(1, "definition must not be empty"),
  message: z.string().max(500, "message must be at most 500 characters").optional().default(""),
});

/** Restoring an old revision as the newest; the restore form's one intent. */
export const restoreForm = z.object({ intent: z.literal("restore") });

/** The robot list's ways to add a robot: from the starter or a copy, an uploaded definition, an imported URDF file. */
export const addForm = z.object({ intent: z.enum(["create", "upload", "import-urdf"]) });

export const robotName = z.string().trim().min(1, "give the robot a name").max(120, "the name must be at most 120 characters");

export const createForm = z.object({
  intent: z.literal("create"),
  name: robotName,
  source: z.union([z.templateLiteral(["starter-", z.enum(STARTER_LEG_COUNTS.map(String) as ["4", "6", "8"])]), z.templateLiteral(["robot-", id()])], {
    error: "choose what the new robot starts from",
  }),
});

export const optionalName = z
  .string()
  .trim()
  .max(120, "the name must be at most 120 characters")
  .optional()
  .transform((value) => (value ? value : undefined));

/** The first problem of a failed zod parse, as one sentence. */
export function firstProblem(error: z.ZodError): string {
  const issue = error.issues[0];
  return issue ? issue.message : "the request is not valid";
}
