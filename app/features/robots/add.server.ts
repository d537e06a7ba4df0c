// The three ways to add a robot from the robot list: a new one from a copy or
// the starter template, an uploaded definition file, or an imported URDF file.
// Reads the posted form, calls the robot service and says what to answer.
import type { Member } from "../../platform/access.server";
import { createRobotFrom, createRobotFromDefinition, createRobotFromUrdf, nameTakenMessage, type CreateOutcome } from "./robots.server";
import { DEFINITION_LIMIT_BYTES, formatBytes, URDF_LIMIT_BYTES } from "./files";
import { describeJsonError } from "./json-errors";
import { createForm, firstProblem, optionalName } from "./params";
import type { AddIntent, AddResult } from "./results";
import type { StarterLegCount } from "./starter";

export type AddAnswer = { redirectTo: string } | { status: 200 | 400 | 404 | 409 | 413 | 422; result: AddResult };

/** The largest request body the add actions read: the URDF limit plus room for the form around it. */
export const ADD_BODY_LIMIT_BYTES = URDF_LIMIT_BYTES + 64 * 1024;

const fail = (status: 400 | 404 | 409 | 413 | 422, intent: AddIntent | null, message: string, extra: Partial<AddResult> = {}): AddAnswer => ({
  status,
  result: { ok: false, intent, message, ...extra } as AddResult,
});

export async function addRobot(form: FormData, member: Pick<Member, "user" | "workspace">): Promise<AddAnswer> {
  const intent = form.get("intent");
  const owner = { workspaceId: member.workspace.id, authorId: member.user.id };
  if (intent === "create") {
    const parsed = createForm.safeParse(Object.fromEntries(form));
    if (!parsed.success) return fail(400, "create", `Cannot create the robot: ${firstProblem(parsed.error)}.`);
    const { name, source } = parsed.data;
    const outcome = await createRobotFrom(
      source.startsWith("starter-")
        ? { kind: "starter", legCount: Number(source.slice("starter-".length)) as StarterLegCount }
        : { kind: "robot", robotId: source.slice("robot-".length) },
      { ...owner, name },
    );
    return answerCreated(outcome, "create");
  }
  if (intent === "upload" || intent === "import-urdf") {
    const file = form.get("file");
    const kind = intent === "upload" ? "robot definition (JSON)" : "URDF file";
    if (!file || typeof file === "string" || file.size === 0) {
      return fail(400, intent, `Choose a ${kind} to ${intent === "upload" ? "upload" : "import"}${file && typeof file !== "string" && file.name ? `: ${file.name} is empty` : ""}.`);
    }
    const limit = intent === "upload" ? DEFINITION_LIMIT_BYTES : URDF_LIMIT_BYTES;
    if (file.size > limit) {
      return fail(413, intent, `${file.name} is ${formatBytes(file.size)}; a ${kind} may be up to ${formatBytes(limit)}. Nothing was saved.`);
    }
    const name = optionalName.safeParse(form.get("name") ?? undefined);
    if (!name.success) return fail(400, intent, `Cannot use that name: ${firstProblem(name.error)}.`);
    const text = await file.text();
    if (intent === "upload") {
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch (error) {
        return fail(400, intent, `${file.name} is not valid JSON: ${describeJsonError(error, text)}. Nothing was saved.`);
      }
      const outcome = await createRobotFromDefinition(json, { ...owner, fileName: file.name, name: name.data });
      return answerCreated(outcome, intent);
    }
    const { outcome, report } = await createRobotFromUrdf(text, { ...owner, fileName: file.name, name: name.data });
    if (outcome.kind === "refused") {
      return fail(422, intent, `${file.name} cannot be imported. Nothing was saved.`, { issues: outcome.issues });
    }
    if (outcome.kind === "created") {
      return { status: 200, result: { ok: true, intent, robotId: outcome.robotId, name: outcome.name, report } };
    }
    return answerCreated(outcome, intent, report);
  }
  return fail(400, null, `Unknown intent ${JSON.stringify(intent)}: expected "create", "upload" or "import-urdf".`);
}

function answerCreated(outcome: CreateOutcome, intent: AddIntent, report?: string[]): AddAnswer {
  switch (outcome.kind) {
    case "created":
      return { redirectTo: `/robots/${outcome.robotId}` };
    case "invalid":
      return fail(422, intent, `The definition has ${outcome.issues.length === 1 ? "1 problem" : `${outcome.issues.length} problems`}. Nothing was saved.`, {
        issues: outcome.issues,
        report,
      });
    case "name-taken":
      return fail(409, intent, `${nameTakenMessage(outcome.name)} Nothing was saved.`, { report });
    case "source-missing":
      return fail(404, intent, "The robot to copy is not in this workspace (it may have been removed).");
  }
}
