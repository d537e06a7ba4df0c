// Saving the robot form, and restoring an old revision: reads the posted
// fields and calls the robot service; a refusal is a ServiceError.
import type { Member } from "../../platform/access.server";
import { refuseNulIn, type LimitedForm } from "../../platform/body.server";
import { ServiceError } from "../../platform/errors.server";
import { revisionNumber } from "../../platform/params";
import { getRevision, saveRevision } from "./robots.server";
import { DEFINITION_LIMIT_BYTES, formatBytes } from "./files";
import { describeJsonError } from "./json-errors";
import { firstProblem, restoreForm, saveForm } from "./params";
import type { SavedRevision } from "./results";

/** A definition of up to 256 KB plus the other fields of the form. */
export const SAVE_BODY_LIMIT_BYTES = DEFINITION_LIMIT_BYTES + 16 * 1024;

export async function saveFromForm(body: LimitedForm, context: { member: Member; robotId: string }): Promise<SavedRevision> {
  if (!body.ok) {
    throw body.tooLarge
      ? new ServiceError(413, "too-large", `The save is ${formatBytes(body.bytes)}; a robot definition may be up to 256 KB. Nothing was saved.`)
      : body.refusal;
  }
  const fields = Object.fromEntries([...body.form].filter(([, value]) => typeof value === "string"));
  const parsed = saveForm.safeParse(fields);
  if (!parsed.success) throw new ServiceError(400, "bad-request", `Cannot save: ${firstProblem(parsed.error)}.`);
  let definition: unknown;
  try {
    definition = JSON.parse(parsed.data.definition);
  } catch (error) {
    throw new ServiceError(400, "bad-request", `Cannot save: the definition is not valid JSON: ${describeJsonError(error, parsed.data.definition)}.`);
  }
  refuseNulIn(definition, "Cannot save: the definition", "definition");
  const saved = await saveRevision({
    workspaceId: context.member.workspace.id,
    robotId: context.robotId,
    author: { id: context.member.user.id, role: context.member.role },
    baseRevision: parsed.data.baseRevision,
    definition,
    message: parsed.data.message,
  });
  return { ok: true, ...saved };
}

/** Saves an old revision's definition as the newest revision. */
export async function restoreFromForm(form: FormData, context: { member: Member; robotId: string; number: number }): Promise<SavedRevision> {
  if (!restoreForm.shape.intent.safeParse(form.get("intent")).success) {
    throw new ServiceError(400, "bad-request", `Unknown intent ${JSON.stringify(form.get("intent"))}: expected "restore".`);
  }
  const given = String(form.get("baseRevision") ?? "");
  const base = revisionNumber().safeParse(given);
  if (!base.success) {
    throw new ServiceError(400, "bad-request", `Cannot restore: baseRevision must be a revision number (got ${JSON.stringify(given)}).`);
  }
  const old = await getRevision(context.member.workspace.id, context.robotId, context.number);
  if (!old) throw new ServiceError(404, "not-found", `This robot has no revision ${context.number}.`);
  const saved = await saveRevision({
    workspaceId: context.member.workspace.id,
    robotId: context.robotId,
    author: { id: context.member.user.id, role: context.member.role },
    baseRevision: base.data,
    definition: old.revision.definition,
    message: `Restored revision ${context.number}`,
  });
  return { ok: true, ...saved };
}
