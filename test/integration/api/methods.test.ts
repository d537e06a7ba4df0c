// A method an /api/v1 route does not answer is 405 method_not_allowed in the
// API's error shape, with an Allow header listing the methods it does answer
// (RFC 9110 §15.5.6 requires it), for the routes that write as well as read.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, load, outcome, requestsAs, type ApiRefusal, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import * as draft from "~/routes/api.v1/gaits/draft";
import * as ik from "~/routes/api.v1/solver/ik";
import * as solve from "~/routes/api.v1/solver/solve";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function call(method: string, path: string, module: { loader?: (args: never) => unknown; action?: (args: never) => unknown }, params = {}) {
  const request = await (await requestsAs("owner", ids))(method, path, method === "GET" ? undefined : { json: {} });
  return outcome<ApiRefusal>(async () => (method === "GET" ? load(module, request, params) : act(module, request, params)));
}

describe("405 with Allow for a method the route does not answer", () => {
  test.each([
    ["GET", "/api/v1/solve", solve, "POST"],
    ["PUT", "/api/v1/solve", solve, "POST"],
    ["DELETE", "/api/v1/solve", solve, "POST"],
    ["GET", "/api/v1/ik", ik, "POST"],
    ["PATCH", "/api/v1/ik", ik, "POST"],
  ] as const)("%s %s answers 405, Allow: %s", async (method, path, module, allow) => {
    const answer = await call(method, path, module);
    expect(answer.status).toBe(405);
    expect(answer.headers.get("Allow")).toBe(allow);
    expect(answer.body.error.code).toBe("method_not_allowed");
    expect(answer.body.error.message).toContain(method);
  });

  test.each(["POST", "DELETE", "PATCH"])("%s /api/v1/gaits/:gaitId/draft answers 405, Allow: GET, HEAD, PUT", async (method) => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    const answer = await call(method, `/api/v1/gaits/${gaitId}/draft`, draft, { gaitId });
    expect(answer.status).toBe(405);
    expect(answer.headers.get("Allow")).toBe("GET, HEAD, PUT");
    expect(answer.body.error.code).toBe("method_not_allowed");
  });
});
