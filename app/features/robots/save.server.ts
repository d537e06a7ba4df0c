// Saving the robot form, and restoring an old revision: reads the posted
// fields, calls the robot service, and says which status and message to answer.
import type { Member } from "../../platform/access.server";
import { ROLE_LABELS } from "../../platform/permissions";
import { getRevision, nameTakenMessage, saveRevision, type SaveOutcome } from "./robots.server";
import { describeChange } from "./changes";
import { DEFINITION_LIMIT_BYTES, formatBytes } from "./files";
import type { LimitedForm } from "../../platform/body.server";
import { describeJsonError } from "./json-errors";
import { firstProblem, saveForm } from "./params";
import type { SaveResult } from "./results";

export type SaveAnswer = { status: 200 | 400 | 403 | 404 | 409 | 413 | 422; result: SaveResult };

/** A definition of up to 256 KB plus the other fields of the form. */
export const SAVE_BODY_LIMIT_BYTES = DEFINITION_LIMIT_BYTES + 16 * 1024;

const timeOf = (date: Date) => `${date.toISOString().slice(0, 10)} ${date.toISOString().slice(11, 16)} UTC`;

export async function saveAnswer(body: LimitedForm, context: { member: Member; robotId: string }): Promise<SaveAnswer> {
  if (!body.ok) {
    return body.tooLarge
      ? { status: 413, result: { ok: false, code: "too-large", message: `The save is ${formatBytes(body.bytes)}; a robot definition may be up to 256 KB. Nothing was saved.` } }
      : { status: 400, result: { ok: false, code: "bad-request", message: body.message } };
  }
  const fields = Object.fromEntries([...body.form].filter(([, value]) => typeof value === "string"));
  const parsed = saveForm.safeParse(fields);
  if (!parsed.success) return { status: 400, result: { ok: false, code: "bad-request", message: `Cannot save: ${firstProblem(parsed.error)}.` } };
  let definition: unknown;
  try {
    definition = JSON.parse(parsed.data.definition);
  } catch (error) {
    return {
      status: 400,
      result: { ok: false, code: "bad-request", message: `Cannot save: the definition is not valid JSON: ${describeJsonError(error, parsed.data.definition)}.` },
    };
  }
  const outcome = await saveRevision({
    workspaceId: context.member.workspace.id,
    robotId: context.robotId,
    author: { id: context.member.user.id, role: context.member.role },
    baseRevision: parsed.data.baseRevision,
    definition,
    message: parsed.data.message,
  });
  return answerOf(outcome, context.member);
}

/** Saves an old revision's definition as the newest revision. */
export async function restoreAnswer(
  form: FormData,
  context: { member: Member; robotId: string; number: number },
): Promise<SaveAnswer> {
  const base = String(form.get("baseRevision") ?? "");
  if (!/^[1-9][0-9]{0,8}$/.test(base)) {
    return { status: 400, result: { ok: false, code: "bad-request", message: `Cannot restore: baseRevision must be a revision number (got ${JSON.stringify(base)}).` } };
  }
  const old = await getRevision(context.member.workspace.id, context.robotId, context.number);
  if (!old) return { status: 404, result: { ok: false, code: "not-found", message: `This robot has no revision ${context.number}.` } };
  const outcome = await saveRevision({
    workspaceId: context.member.workspace.id,
    robotId: context.robotId,
    author: { id: context.member.user.id, role: context.member.role },
    baseRevision: Number(base),
    definition: old.revision.definition,
    message: `Restored revision ${context.number}`,
  });
  return answerOf(outcome, context.member);
}

function answerOf(outcome: SaveOutcome, member: Member): SaveAnswer {
  switch (outcome.kind) {
    case "saved":
      return { status: 200, result: { ok: true, number: outcome.number, message: outcome.message } };
    case "invalid":
      return {
        status: 422,
        result: {
          ok: false,
          code: "invalid",
          message: `The definition has ${outcome.issues.length === 1 ? "1 problem" : `${outcome.issues.length} problems`}. Nothing was saved.`,
          issues: outcome.issues,
        },
      };
    case "not-found":
      return { status: 404, result: { ok: false, code: "not-found", message: "There is no robot at this address in your workspace." } };
    case "stale": {
      const { latest } = outcome;
      const who = latest.author?.name ?? "someone";
      return {
        status: 409,
        result: {
          ok: false,
          code: "stale",
          message: `Revision ${latest.number} was saved by ${who} at ${timeOf(latest.createdAt)} while you were editing revision ${outcome.baseRevision}. Nothing was saved.`,
          baseRevision: outcome.baseRevision,
          latest: { number: latest.number, authorName: latest.author?.name ?? null, createdAt: latest.createdAt.toISOString(), message: latest.message },
        },
      };
    }
    case "forbidden": {
      const [first, ...others] = outcome.changes;
      const more = others.length === 0 ? "" : ` and ${others.length} more field${others.length === 1 ? "" : "s"} (${others.slice(0, 3).map((change) => change.path).join(", ")}${others.length > 3 ? ", …" : ""})`;
      return {
        status: 403,
        result: {
          ok: false,
          code: "forbidden",
          message: `${ROLE_LABELS[member.role]} can change only zero offsets and servo mapping; this save also changes ${describeChange(first)}${more}. Nothing was saved.`,
        },
      };
    }
    case "unchanged":
      return { status: 422, result: { ok: false, code: "unchanged", message: `Nothing changed since revision ${outcome.number}, so nothing was saved.` } };
    case "name-taken":
      return { status: 409, result: { ok: false, code: "name-taken", message: `${nameTakenMessage(outcome.name)} Nothing was saved.` } };
  }
}
