// The JSON API reads its bodies within the route's limit as they arrive: a
// chunked upload (no declared length) far beyond it is refused with 413 in
// the API's error shape without reading it whole.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, outcome, requestsAs, type DemoIds } from "../../support/routes";
import { DRAFT_BODY_LIMIT_BYTES } from "~/features/gaits/drafts.server";
import { SOLVE_BODY_LIMIT_BYTES } from "~/features/solver/solve.server";
import { database } from "~/platform/db.server";
import * as draft from "~/routes/api.v1/gaits/draft";
import * as ik from "~/routes/api.v1/solver/ik";
import * as solve from "~/routes/api.v1/solver/solve";
import { countedBody } from "../forms/support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

const UPLOAD_BYTES = 16 * 1024 * 1024;
// Room for the chunks in flight when the limit is passed.
const SLACK_BYTES = 256 * 1024;

const ROUTES = [
  { name: "POST /api/v1/ik", module: ik, method: "POST", path: () => "/api/v1/ik", params: () => ({}), limit: 256 * 1024 },
  { name: "POST /api/v1/solve", module: solve, method: "POST", path: () => "/api/v1/solve", params: () => ({}), limit: SOLVE_BODY_LIMIT_BYTES },
  {
    name: "PUT /api/v1/gaits/:gaitId/draft",
    module: draft,
    method: "PUT",
    path: (ids: DemoIds) => `/api/v1/gaits/${ids.gaitIds["Tripod cruise"]}/draft`,
    params: (ids: DemoIds) => ({ gaitId: ids.gaitIds["Tripod cruise"] }),
    limit: DRAFT_BODY_LIMIT_BYTES,
  },
];

describe("a chunked JSON body of 16 MB is refused with 413 after reading little more than the limit", () => {
  test.each(ROUTES.map((route) => [route.name, route] as const))("%s", async (_name, route) => {
    const { stream, counter } = countedBody('{"robot": "', UPLOAD_BYTES);
    const base = await (await requestsAs("owner", ids))(route.method, route.path(ids));
    const headers = new Headers(base.headers);
    headers.set("Content-Type", "application/json");
    const request = new Request(base.url, { method: route.method, headers, body: stream, duplex: "half" } as RequestInit);
    const answer = await outcome<{ error: { code: string; message: string } }>(async () => act(route.module, request, route.params(ids)));
    expect(answer.status).toBe(413);
    expect(answer.body.error.code).toBe("payload_too_large");
    expect(counter.pulled, `bytes read of ${UPLOAD_BYTES} (limit ${route.limit})`).toBeLessThanOrEqual(route.limit + SLACK_BYTES);
  });
});
