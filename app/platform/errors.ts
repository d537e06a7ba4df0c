// The shapes a refusal takes on its way out, shared by the server's adapters
// (errors.server.ts) and the components that show them, which must not
// import server modules.

/** A problem at a path; `field` names the field in words when the message starts with it ("Leg LF, tibia length must be …"). */
export type Issue = { path: string; message: string; field?: string };

/**
 * What a client needs to act on a refusal: the form field to mark, the
 * issues by path, the query parameter at fault, or the state a conflict is
 * with. Some API answers send the issue list itself as `details`.
 */
export type ErrorDetails = DetailRecord | readonly Issue[];

export type DetailRecord = { field?: string; issues?: readonly Issue[]; [key: string]: unknown };

/** An inline form refusal: the sentence, its code, the field to mark, and the details. */
export type FormError<Details extends ErrorDetails = ErrorDetails> = { error: string; code: string; field?: string; details?: Details };

/** The `error.code` values of the JSON API, one per kind of refusal (the specific one goes into `details.reason`). */
export type ApiErrorCode =
  | "bad_request"
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "method_not_allowed"
  | "payload_too_large"
  | "unsupported_media_type"
  | "invalid"
  | "rate_limited"
  | "internal_error"
  | "unavailable";
