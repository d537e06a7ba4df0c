// The one error model: a ServiceError and the adapter of each surface — an
// inline form error, a JSON API error, the route's error page, and a refusal
// shown beside a page — plus the unique-violation check drizzle's wrapping needs.
import { describe, expect, test } from "vitest";
import { isUniqueViolation } from "~/platform/db.server";
import { ServiceError, apiAction, attempt, formAction, pageGuard } from "~/platform/errors.server";

type DataWithInit = { type: string; data: unknown; init: ResponseInit | null };

const refuse = (error: unknown) => async (): Promise<never> => {
  throw error;
};

describe("formAction", () => {
  test("a refusal becomes { error, code, field, details } with its status", async () => {
    const answer = (await formAction(refuse(new ServiceError(409, "name-taken", "Taken.", { field: "name" })))) as unknown as DataWithInit;
    expect(answer.type).toBe("DataWithResponseInit");
    expect(answer.init?.status).toBe(409);
    expect(answer.data).toEqual({ error: "Taken.", code: "name-taken", field: "name", details: { field: "name" } });
  });

  test("a refusal without details is the sentence and the code only", async () => {
    const answer = (await formAction(refuse(new ServiceError(404, "not-found", "Gone.")))) as unknown as DataWithInit;
    expect(answer.data).toEqual({ error: "Gone.", code: "not-found" });
  });

  test("anything else is thrown on, and a value is returned as it is", async () => {
    const crash = new Error("boom");
    await expect(formAction(refuse(crash))).rejects.toBe(crash);
    expect(await formAction(async () => ({ ok: true }))).toEqual({ ok: true });
  });
});

describe("apiAction", () => {
  const json = async (run: () => Promise<unknown>) => {
    const response = (await apiAction(run)) as Response;
    return { status: response.status, body: await response.json() };
  };

  test("a refusal whose code is its status's own keeps the API's code and its details as they are", async () => {
    expect(await json(refuse(new ServiceError(404, "not-found", "No such gait.")))).toEqual({
      status: 404,
      body: { error: { code: "not_found", message: "No such gait." } },
    });
    expect(await json(refuse(new ServiceError(400, "bad-request", "Bad rate.", { parameter: "rate" })))).toEqual({
      status: 400,
      body: { error: { code: "bad_request", message: "Bad rate.", details: { parameter: "rate" } } },
    });
  });

  test("a more specific code goes into details.reason; the API's code stays the status's", async () => {
    const answer = await json(refuse(new ServiceError(409, "revision-unparseable", "Robot revision 3 no longer parses.", { robotRevision: 3 })));
    expect(answer).toEqual({
      status: 409,
      body: { error: { code: "conflict", message: "Robot revision 3 no longer parses.", details: { reason: "revision-unparseable", robotRevision: 3 } } },
    });
  });

  test("an issue list sent as the details stays a list", async () => {
    const issues = [{ path: "sequence.legs.LF", message: "is missing" }];
    expect(await json(refuse(new ServiceError(422, "invalid", "The sequence is invalid.", issues)))).toEqual({
      status: 422,
      body: { error: { code: "invalid", message: "The sequence is invalid.", details: issues } },
    });
  });

  test("410 (gone) answers the API as 404 not_found", async () => {
    const answer = await json(refuse(new ServiceError(410, "gone", "This invitation has expired.")));
    expect(answer).toEqual({ status: 404, body: { error: { code: "not_found", message: "This invitation has expired." } } });
  });
});

describe("pageGuard and attempt", () => {
  test("pageGuard throws the refusal as the route's error response with its sentence", async () => {
    const thrown = await pageGuard(refuse(new ServiceError(410, "gone", "This invitation link was already used."))).catch((error: unknown) => error);
    const response = thrown as DataWithInit;
    expect(response.init?.status).toBe(410);
    expect(response.data).toEqual({ message: "This invitation link was already used." });
  });

  test("attempt hands back the refusal, or the value; other errors are thrown on", async () => {
    const refusal = new ServiceError(422, "invalid", "Different robots.");
    expect(await attempt(refuse(refusal))).toEqual({ ok: false, refusal });
    expect(await attempt(() => 7)).toEqual({ ok: true, value: 7 });
    const crash = new TypeError("boom");
    await expect(attempt(refuse(crash))).rejects.toBe(crash);
  });

  test("field and record read the details, an issue list under issues", () => {
    expect(new ServiceError(422, "invalid", "x", { field: "name" }).field).toBe("name");
    expect(new ServiceError(422, "invalid", "x", [{ path: "a", message: "b" }]).record).toEqual({ issues: [{ path: "a", message: "b" }] });
    expect(new ServiceError(404, "not-found", "x").field).toBeUndefined();
  });
});

describe("isUniqueViolation", () => {
  // postgres.js errors carry SQLSTATE as `code` and the constraint as `constraint_name`; drizzle wraps them as `cause`.
  const driverError = Object.assign(new Error("duplicate key value violates unique constraint"), {
    code: "23505",
    constraint_name: "calibration_profiles_robot_name",
  });
  const wrapped = new Error("Failed query: insert into calibration_profiles …", { cause: driverError });

  test("finds SQLSTATE 23505 on the error or anywhere down its cause chain", () => {
    expect(isUniqueViolation(driverError)).toBe(true);
    expect(isUniqueViolation(wrapped)).toBe(true);
    expect(isUniqueViolation(new Error("outer", { cause: wrapped }))).toBe(true);
  });

  test("names the constraint when asked", () => {
    expect(isUniqueViolation(wrapped, "calibration_profiles_robot_name")).toBe(true);
    expect(isUniqueViolation(wrapped, "robots_workspace_name")).toBe(false);
  });

  test("other errors, other SQLSTATEs and non-errors are not", () => {
    expect(isUniqueViolation(new Error("Failed query", { cause: Object.assign(new Error("x"), { code: "23503" }) }))).toBe(false);
    expect(isUniqueViolation(null)).toBe(false);
    expect(isUniqueViolation("23505")).toBe(false);
    const cyclic: { message: string; cause?: unknown } = { message: "loop" };
    cyclic.cause = cyclic;
    expect(isUniqueViolation(cyclic)).toBe(false);
  });
});
