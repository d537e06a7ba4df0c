// Form actions that carry several commands, told apart by an `intent` field
// (commit or restore a draft; request review, approve, send back, release):
// the body is read within a limit and parsed, and the permission checked is
// the one that intent needs.
import { data } from "react-router";
import type { z } from "zod";
import { requireAccess, type Member } from "./access.server";
import type { FormError } from "./errors.server";
import type { Action } from "./permissions";
import { readFormWithin } from "./body.server";

const INTENT_FORM_LIMIT_BYTES = 16 * 1024;

type IntentSchema = z.ZodType<{ intent: string }>;

/**
 * The member and the parsed form, or the answer to send instead: 413 or 400
 * for the body, the sign-in or permission refusal, 400 naming the first field
 * at fault. A form without a valid intent is checked against `fallback`, so
 * only a member who may do something here learns what was wrong with it.
 */
export async function readIntentForm<Schema extends IntentSchema>(
  request: Request,
  schema: Schema,
  permissions: Record<z.output<Schema>["intent"], Action>,
  fallback: Action,
) {
  const body = await readFormWithin(request, INTENT_FORM_LIMIT_BYTES);
  if (!body.ok) {
    return { ok: false as const, response: data<FormError>({ error: body.tooLarge ? "The form is too large." : body.message }, { status: body.tooLarge ? 413 : 400 }) };
  }
  const form = schema.safeParse(Object.fromEntries(body.form));
  const intent = form.success ? (form.data.intent as z.output<Schema>["intent"]) : null;
  const member: Member = await requireAccess(request, intent === null ? fallback : permissions[intent]);
  if (!form.success) {
    const issue = form.error.issues[0];
    return { ok: false as const, response: data<FormError>({ error: issue?.message ?? "The form is not valid.", field: issue?.path.join(".") }, { status: 400 }) };
  }
  return { ok: true as const, member, form: form.data as z.output<Schema> };
}
