// Services refuse with a ServiceError (status + a sentence a person can act
// on); routes turn it into an inline form message or a JSON API error.
import { data } from "react-router";
import { apiError, type ApiErrorCode } from "./api-errors.server";

export class ServiceError extends Error {
  constructor(
    readonly status: 400 | 403 | 404 | 409 | 410 | 413 | 422,
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

export type FormError = { error: string; field?: string };

/** Runs a form action's service call; a refusal comes back as `{ error, field }` with its status. */
export async function formAction<T>(run: () => Promise<T>) {
  try {
    return await run();
  } catch (error) {
    if (error instanceof ServiceError) return data<FormError>({ error: error.message, field: error.field }, { status: error.status });
    throw error;
  }
}

const API_CODES: Record<ServiceError["status"], ApiErrorCode> = {
  400: "bad_request",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  410: "not_found",
  413: "payload_too_large",
  422: "invalid",
};

/** The same for API routes: a refusal becomes `{ error: { code, message } }`. */
export async function apiAction<T>(run: () => Promise<T>): Promise<T | Response> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof ServiceError) {
      const status = error.status === 410 ? 404 : error.status;
      return apiError(status, API_CODES[error.status], error.message, error.field ? { field: error.field } : undefined);
    }
    throw error;
  }
}
