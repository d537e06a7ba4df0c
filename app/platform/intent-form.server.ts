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
 * The access check for a form's intent: the permission that intent needs, or
 * for a form without a valid intent any of them, so only a member who may do
 * something here learns what was wrong with it.
 */
export function requireIntentAccess<Intent extends string>(request: Request, permissions: Record<Intent, Action>, intent: Intent | null): Promise<Member> {
  return requireAccess(request, intent === null ? Object.values<Action>(permissions) : permissions[intent]);
}

/**
 * For an action that checks access before it reads its form (an upload, a
 * body of no set size): the one permission all its intents need. Throws when
 * they differ, so an intent with a permission of its own cannot go unchecked.
 */
export function permissionOfEveryIntent(permissions: Record<string, Action>): Action {
  const distinct = [...new Set(Object.values(permissions))];
  if (distinct.length !== 1) throw new Error(`These intents need different permissions (${distinct.join(", ")}): read the intent before checking access.`);
  return distinct[0];
}

/**
 * The member and the parsed form. Refused (run it inside formAction) with 413
 * or 400 for the body, the sign-in or permission refusal, 400 naming the
 * first field at fault. `permissions` is the route module's declaration for
 * its action, one permission per intent.
 */
export async function readIntentForm<Schema extends IntentSchema>(request: Request, schema: Schema, permissions: Record<z.output<Schema>["intent"], Action>) {
  const body = await readFormWithin(request, INTENT_FORM_LIMIT_BYTES);
  if (!body.ok) throw body.tooLarge ? new ServiceError(413, "too-large", "The form is too large.") : body.refusal;
  const form = schema.safeParse(Object.fromEntries(body.form));
  const intent = form.success ? (form.data.intent as z.output<Schema>["intent"]) : null;
  const member = await requireIntentAccess(request, permissions, intent);
  if (!form.success) {
    const issue = form.error.issues[0];
    throw new ServiceError(400, "bad-request", issue?.message ?? "The form is not valid.", issue ? { field: issue.path.join(".") } : undefined);
  }
  return { member, form: form.data as z.output<Schema> };
}
