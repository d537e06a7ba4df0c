// The three ways to add a robot from the robot list: a new one from a copy or
// the starter template, an uploaded definition file, or an imported URDF file.
// Reads the posted form and calls the robot service; a refusal is a ServiceError.
import type { Member } from "../../platform/access.server";
import { fileText, refuseNulIn, type LimitedForm } from "../../platform/body.server";
import { ServiceError } from "../../platform/errors.server";
import { createRobotFrom, createRobotFromDefinition, createRobotFromUrdf } from "./robots.server";
import { DEFINITION_LIMIT_BYTES, formatBytes, URDF_LIMIT_BYTES } from "./files";
import { describeJsonError } from "./json-errors";
import { addForm, createForm, firstProblem, optionalName } from "./params";
import type { ImportedRobot } from "./results";
import type { StarterLegCount } from "./starter";

/** A created robot opens at once; an imported one first shows what was mapped. */
export type Added = { redirectTo: string } | ImportedRobot;

/** The largest request body the add actions read: the URDF limit plus room for the form around it. */
export const ADD_BODY_LIMIT_BYTES = URDF_LIMIT_BYTES + 64 * 1024;

const badRequest = (message: string) => new ServiceError(400, "bad-request", message);

export async function addRobot(body: LimitedForm, member: Pick<Member, "user" | "workspace">): Promise<Added> {
  if (!body.ok) {
    if (!body.tooLarge) throw body.refusal;
    throw new ServiceError(
      413,
      "too-large",
      `The upload is ${formatBytes(body.bytes)}: a robot definition may be up to 256 KB and a URDF file up to 1 MB. Nothing was saved.`,
    );
  }
  const form = body.form;
  const given = addForm.shape.intent.safeParse(form.get("intent"));
  if (!given.success) throw badRequest(`Unknown intent ${JSON.stringify(form.get("intent"))}: expected "create", "upload" or "import-urdf".`);
  const intent = given.data;
  const owner = { workspaceId: member.workspace.id, authorId: member.user.id };
  if (intent === "create") {
    const parsed = createForm.safeParse(Object.fromEntries(form));
    if (!parsed.success) throw badRequest(`Cannot create the robot: ${firstProblem(parsed.error)}.`);
    const { name, source } = parsed.data;
    const created = await createRobotFrom(
      source.startsWith("starter-")
        ? { kind: "starter", legCount: Number(source.slice("starter-".length)) as StarterLegCount }
        : { kind: "robot", robotId: source.slice("robot-".length) },
      { ...owner, name },
    );
    return { redirectTo: `/robots/${created.robotId}` };
  }
  const file = form.get("file");
  const kind = intent === "upload" ? "robot definition (JSON)" : "URDF file";
  if (!file || typeof file === "string" || file.size === 0) {
    throw badRequest(
      `Choose a ${kind} to ${intent === "upload" ? "upload" : "import"}${file && typeof file !== "string" && file.name ? `: ${file.name} is empty` : ""}.`,
    );
  }
  const limit = intent === "upload" ? DEFINITION_LIMIT_BYTES : URDF_LIMIT_BYTES;
  if (file.size > limit) {
    throw new ServiceError(413, "too-large", `${file.name} is ${formatBytes(file.size)}; a ${kind} may be up to ${formatBytes(limit)}. Nothing was saved.`);
  }
  const name = optionalName.safeParse(form.get("name") ?? undefined);
  if (!name.success) throw badRequest(`Cannot use that name: ${firstProblem(name.error)}.`);
  const text = await fileText(file, "file");
  if (intent === "upload") {
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (error) {
      throw badRequest(`${file.name} is not valid JSON: ${describeJsonError(error, text)}. Nothing was saved.`);
    }
    refuseNulIn(json, file.name, "file");
    const created = await createRobotFromDefinition(json, { ...owner, fileName: file.name, name: name.data });
    return { redirectTo: `/robots/${created.robotId}` };
  }
  const imported = await createRobotFromUrdf(text, { ...owner, fileName: file.name, name: name.data });
  return { ok: true, ...imported };
}
