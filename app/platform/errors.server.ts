// Services that cannot go on throw one kind of error: a status, a short
// kebab-case code, a sentence a person can act on, and details. One adapter
// per surface turns it into an answer, so no route catches it by hand:
// formAction (an inline form error), apiAction (a JSON error), pageGuard
// (the route's error page), and attempt for a page that shows a refusal
// beside what it could load.
import { data } from "react-router";
import type { ApiErrorCode, DetailRecord, ErrorDetails, FormError, Issue } from "./errors";

export type { ApiErrorCode, DetailRecord, ErrorDetails, FormError, Issue } from "./errors";

export type ErrorStatus = 400 | 403 | 404 | 409 | 410 | 413 | 415 | 422 | 503;

/** The code a refusal has when its status says all there is to say. */
const GENERAL_CODES: Record<ErrorStatus, string> = {
  400: "bad-request",
  403: "forbidden",
  404: "not-found",
  409: "conflict",
  410: "gone",
  413: "too-large",
  415: "unsupported-media-type",
  422: "invalid",
  503: "unavailable",
};

export class ServiceError extends Error {
  /**
   * @param code kebab-case: the status's own (`not-found`, `conflict`, `invalid` …) or a more specific one
   *   (`revision-unparseable`, `draft-conflict`, `stale` …) when a client tells it apart.
   */
  constructor(
    readonly status: ErrorStatus,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetails,
  ) {
    super(message);
    this.name = "ServiceError";
  }

  /** The details as named entries; an issue list sent as the details themselves is under `issues`. */
  get record(): DetailRecord {
    if (this.details === undefined) return {};
    return isIssueList(this.details) ? { issues: this.details } : this.details;
  }

  /** The form field the refusal is about, if it names one. */
  get field(): string | undefined {
    const { field } = this.record;
    return typeof field === "string" ? field : undefined;
  }
}

const isIssueList = (details: ErrorDetails): details is readonly Issue[] => Array.isArray(details);

// ---------------------------------------------------------------------------
// JSON

/** The one JSON error shape of the API: `{ error: { code, message, details? } }`. */
export function apiError(
  status: 400 | 401 | 403 | 404 | 405 | 409 | 413 | 415 | 422 | 429 | 500 | 503,
  code: ApiErrorCode,
  message: string,
  details?: unknown,
  headers?: HeadersInit,
): Response {
  return Response.json({ error: { code, message, ...(details === undefined ? {} : { details }) } }, { status, headers });
}

/** 405 for a method the route does not answer, with the Allow header RFC 9110 §15.5.6 requires. */
export function methodNotAllowed(method: string, allow: readonly string[]): Response {
  const methods = allow.length === 1 ? allow[0] : `${allow.slice(0, -1).join(", ")} and ${allow.at(-1)}`;
  return apiError(405, "method_not_allowed", `${method} is not a method this address answers; it answers ${methods}.`, undefined, { Allow: allow.join(", ") });
}

const API_CODES: Record<ErrorStatus, ApiErrorCode> = {
  400: "bad_request",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  410: "not_found",
  413: "payload_too_large",
  415: "unsupported_media_type",
  422: "invalid",
  503: "unavailable",
};

/**
 * A refusal as the API answers it. `code` stays one of the few the API
 * documents; a more specific code goes into `details.reason`, so clients that
 * only know the kinds keep working. A refusal for now (503) whose details
 * give `retryAfterS` says when to try again in Retry-After too.
 */
export function apiErrorOf(error: ServiceError): Response {
  const specific = error.code !== GENERAL_CODES[error.status];
  const details = specific && (error.details === undefined || !isIssueList(error.details)) ? { reason: error.code, ...error.details } : error.details;
  const { retryAfterS } = error.record;
  const headers = error.status === 503 && typeof retryAfterS === "number" ? { "Retry-After": String(Math.max(1, Math.ceil(retryAfterS))) } : undefined;
  return apiError(error.status === 410 ? 404 : error.status, API_CODES[error.status], error.message, details, headers);
}

/** Runs an API route's work; a refusal becomes its JSON error. */
export async function apiAction<T>(run: () => Promise<T>): Promise<T | Response> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof ServiceError) return apiErrorOf(error);
    throw error;
  }
}

// ---------------------------------------------------------------------------
// Forms and pages

/**
 * Runs a form action's work; a refusal comes back as `{ error, code, field?, details? }`
 * with its status. `Details` names what the action's refusals carry, for the component.
 */
export async function formAction<T, Details extends ErrorDetails = ErrorDetails>(run: () => Promise<T>) {
  try {
    return await run();
  } catch (error) {
    if (!(error instanceof ServiceError)) throw error;
    const answer: FormError<Details> = { error: error.message, code: error.code };
    if (error.field !== undefined) answer.field = error.field;
    if (error.details !== undefined) answer.details = error.details as Details;
    return data(answer, { status: error.status });
  }
}

/** Runs a page's work (a loader, or what an action needs before it can start); a refusal becomes the route's error page, with its sentence and status. */
export async function pageGuard<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof ServiceError) throw data({ message: error.message }, { status: error.status });
    throw error;
  }
}

export type Attempt<T> = { ok: true; value: T } | { ok: false; refusal: ServiceError };

/** For a page that shows a refusal beside what it could load instead of an error page; other errors are thrown on. */
export async function attempt<T>(run: () => T | Promise<T>): Promise<Attempt<T>> {
  try {
    return { ok: true, value: await run() };
  } catch (error) {
    if (error instanceof ServiceError) return { ok: false, refusal: error };
    throw error;
  }
}
