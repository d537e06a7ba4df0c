// A page answer's own headers, through the framework as the server runs it
// (React Router's request handler over the app's entry and root, the shell,
// the home page and one API route): the page's Content-Security-Policy names
// a nonce made for that answer, which every script of the page carries; a
// signed-in person's page and the data of its navigations are `private,
// no-store`. The headers every answer carries, and the policy of answers that
// are not pages, come from server.js (e2e/headers.spec.ts).
import { createRequestHandler, UNSAFE_withComponentProps, UNSAFE_withErrorBoundaryProps, type ServerBuild } from "react-router";
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../db/seed";
import { expectedPagePolicy } from "../support/page-policy";
import { demoIds, requestsAs, type Caller, type DemoIds } from "../support/routes";
import * as entry from "~/entry.server";
import { config } from "~/platform/config.server";
import { database } from "~/platform/db.server";
import * as root from "~/root";
import * as workspaceApi from "~/routes/api.v1/workspace";
import * as home from "~/routes/home";
import * as shell from "~/routes/shell";

/** A route module as the build passes it on: its components wrapped to receive their props. */
const built = (module: { default?: unknown; ErrorBoundary?: unknown }) => ({
  ...module,
  ...(module.default ? { default: UNSAFE_withComponentProps(module.default as never) } : {}),
  ...(module.ErrorBoundary ? { ErrorBoundary: UNSAFE_withErrorBoundaryProps(module.ErrorBoundary as never) } : {}),
});

// The route table's part these tests need, as `react-router build` writes it.
type RouteEntry = { module: unknown; parentId?: string; path?: string; index?: boolean; hasErrorBoundary: boolean };
const ROUTES: Record<string, RouteEntry> = {
  root: { module: built(root), path: "", hasErrorBoundary: true },
  "routes/shell": { module: built(shell), parentId: "root", hasErrorBoundary: true },
  "routes/home": { module: built(home), parentId: "routes/shell", index: true, hasErrorBoundary: false },
  "routes/api.v1/workspace": { module: workspaceApi, parentId: "root", path: "api/v1/workspace", hasErrorBoundary: false },
};

const build = {
  entry: { module: entry },
  routes: Object.fromEntries(
    Object.entries(ROUTES).map(([id, route]) => [
      id,
      { id, parentId: route.parentId, path: route.path, index: route.index, caseSensitive: undefined, module: route.module },
    ]),
  ),
  assets: {
    entry: { module: "/assets/entry.client.js", imports: [] },
    routes: Object.fromEntries(
      Object.entries(ROUTES).map(([id, route]) => [
        id,
        {
          id,
          parentId: route.parentId,
          path: route.path,
          index: route.index,
          module: `/assets/${id.replace(/\W/g, "-")}.js`,
          imports: [],
          hasAction: false,
          hasLoader: true,
          hasClientAction: false,
          hasClientLoader: false,
          hasClientMiddleware: false,
          hasErrorBoundary: route.hasErrorBoundary,
          clientActionModule: undefined,
          clientLoaderModule: undefined,
          clientMiddlewareModule: undefined,
          hydrateFallbackModule: undefined,
        },
      ]),
    ),
    url: "/assets/manifest.js",
    version: "test",
  },
  publicPath: "/",
  assetsBuildDirectory: "build/client",
  future: { v8_middleware: true },
  ssr: true,
  isSpaMode: false,
  prerender: [],
  routeDiscovery: { mode: "lazy", manifestPath: "/__manifest" },
} as unknown as ServerBuild;

const handle = createRequestHandler(build, "production");

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function answer(caller: Caller, path: string, method = "GET"): Promise<Response> {
  const request = await requestsAs(caller, ids);
  return handle(await request(method, path));
}

const pagePolicy = (nonce: string) => expectedPagePolicy(nonce, new URL(config().github.oauthUrl).origin);

const nonceOf = (response: Response) => /'nonce-([^']*)'/.exec(response.headers.get("Content-Security-Policy") ?? "")?.[1];

describe("a page's Content-Security-Policy", () => {
  test("names a nonce of at least 128 bits, made for this answer, which every script of the page carries", async () => {
    const response = await answer("signed-out", "/");
    expect(response.status).toBe(200);
    const nonce = nonceOf(response);
    expect(nonce, "a nonce in the page's policy").toBeDefined();
    expect(Buffer.from(nonce!, "base64").length * 8, "bits of the nonce").toBeGreaterThanOrEqual(128);
    expect(response.headers.get("Content-Security-Policy")).toBe(pagePolicy(nonce!));

    const html = await response.text();
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    // The hydration data, the module imports and the scroll restoration at least.
    expect(scripts.length, "scripts on the page").toBeGreaterThanOrEqual(3);
    expect(scripts.filter((tag) => !tag.includes(` nonce="${nonce}"`))).toEqual([]);
    expect(html, "a <style> element, which style-src 'self' refuses").not.toMatch(/<style\b/);

    const next = nonceOf(await answer("signed-out", "/"));
    expect(next, "the next answer's nonce").not.toBe(nonce);
  });

  test("a signed-in person's page, a page answering HEAD and a page that failed carry it too", async () => {
    for (const [caller, path, method, status] of [
      ["owner", "/", "GET", 200],
      ["signed-out", "/", "HEAD", 200],
      ["owner", "/no/such/page", "GET", 404],
    ] as const) {
      const response = await answer(caller, path, method);
      expect(response.status, `${method} ${path} as ${caller}`).toBe(status);
      expect(response.headers.get("Content-Security-Policy"), `${method} ${path} as ${caller}`).toBe(pagePolicy(nonceOf(response) ?? "(none)"));
    }
  });
});

describe("Cache-Control of page answers", () => {
  test("a signed-in person's page and the data of its navigations are private, no-store", async () => {
    for (const path of ["/", "/_root.data"]) {
      const response = await answer("viewer", path);
      expect(response.status, path).toBe(200);
      expect(response.headers.get("Cache-Control"), path).toBe("private, no-store");
    }
  });

  test("a page for no one in particular keeps the default", async () => {
    for (const path of ["/", "/_root.data"]) {
      const response = await answer("signed-out", path);
      expect(response.status, path).toBe(200);
      expect(response.headers.get("Cache-Control"), path).toBeNull();
    }
  });
});

describe("an API answer is not a page", () => {
  test("no page policy and no Cache-Control of a page's: its own, and server.js's policy of answers that load nothing", async () => {
    const response = await answer("owner", "/api/v1/workspace");
    expect(response.status).toBe(200);
    expect(response.headers.get("Content-Type")).toMatch(/^application\/json/);
    expect(response.headers.get("Content-Security-Policy")).toBeNull();
    expect(response.headers.get("Cache-Control")).toBeNull();
  });
});
