// Access cases for the answer at /api/v1 addresses no route has: the same 404 to everyone.
import { act, load } from "../../../support/routes";
import type { RouteCase } from "../support";
import * as notFound from "~/routes/api.v1/not-found";

export const cases: RouteCase[] = [
  {
    name: "GET /api/v1/* (an address no route has)",
    route: "routes/api.v1/not-found.ts",
    kind: "loader",
    allowedStatus: 404,
    run: (req) => req("GET", "/api/v1/robotz").then((r) => load(notFound, r)),
  },
  {
    name: "POST /api/v1/* (an address no route has)",
    route: "routes/api.v1/not-found.ts",
    kind: "action",
    allowedStatus: 404,
    run: (req) => req("POST", "/api/v1/robotz", { json: {} }).then((r) => act(notFound, r)),
  },
];
