// Form actions that carry several commands, told apart by an `intent` field
// (commit or restore a draft; request review, approve, send back, release):
// the body is read within a limit and parsed, and the permission checked is
// the one that intent needs.
import type { z } from "zod";
import { requireAccess, type Member } from "./access.server";
import { ServiceError } from "./errors.server";
import type { Action } from "./permissions";
import { readFormWithin } from "./body.server";

const INTENT_FORM_LIMIT_BYTES = 16 * 1024;

type IntentSchema = z.ZodType<{ intent: string }>;

/**
 * The member and the parsed form. Refused (run it inside formAction) with 413
 * or 400 for the body, the sign-in or permission refusal, 400 naming the
 * first field at fault. A form without a valid intent is checked against
 * `fallback`, so only a member who may do something here learns what was
 * wrong with it.
 */
export async function readIntentForm<Schema extends IntentSchema>(
  request: Request,
  schema: Schema,
  permissions: Record<z.output<Schema>["intent"], Action>,
  fallback: Action,
) {
  const body = await readFormWithin(request, INTENT_FORM_LIMIT_BYTES);
  if (!body.ok) throw body.tooLarge ? new ServiceError(413, "too-large", "The form is too large.") : new ServiceError(400, "bad-request", body.message);
  const form = schema.safeParse(Object.fromEntries(body.form));
  const intent = form.success ? (form.data.intent as z.output<Schema>["intent"]) : null;
  const member: Member = await requireAccess(request, intent === null ? fallback : permissions[intent]);
  if (!form.success) {
    const issue = form.error.issues[0];
    throw new ServiceError(400, "bad-request", issue?.message ?? "The form is not valid.", issue ? { field: issue.path.join(".") } : undefined);
  }
  return { member, form: form.data as z.output<Schema> };
}
