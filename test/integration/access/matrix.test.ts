// Every loader, action and API route × every role and signed out, run
// in-process against the test database and judged by what the route module
// declares it needs (its `permissions` export) and the one permission table:
// allowed callers succeed, the others get 401/403 (or the sign-in redirect)
// and change nothing in the database.
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import routeConfig from "~/routes";
import { database } from "~/platform/db.server";
import { PERMISSIONS, ROLES, can, requirementOf, type Requirement, type RoutePermissions } from "~/platform/permissions";
import { MailFake } from "../../support/mail";
import { type Caller, type DemoIds, demoIds, outcome, requestsAs } from "../../support/routes";
import type { RouteCase } from "./support";

const caseFiles = import.meta.glob<{ cases: RouteCase[] }>("./cases/*.ts", { eager: true });
const cases = Object.values(caseFiles).flatMap((file) => file.cases);
const callers: Caller[] = [...ROLES, "signed-out"];

type ConfigEntry = { file: string; children?: ConfigEntry[] };
const routeFiles = (entries: ConfigEntry[]): string[] => entries.flatMap((entry) => [entry.file, ...routeFiles(entry.children ?? [])]);

type RouteModule = { loader?: unknown; action?: unknown; permissions?: RoutePermissions; actionForm?: unknown };
const files = ["root.tsx", ...routeFiles(routeConfig as ConfigEntry[])];
const modules = new Map<string, RouteModule>(
  await Promise.all(files.map(async (file) => [file, (await import(/* @vite-ignore */ `../../../app/${file}`)) as RouteModule] as const)),
);

/** What a case's route needs: its module's declaration for the loader, the action, or the action's intent. */
function requirement(entry: RouteCase): Requirement {
  const needs = requirementOf(modules.get(entry.route)?.permissions, entry.kind, entry.intent);
  if (!needs) throw new Error(`${entry.route} declares nothing for its ${entry.kind}${entry.intent ? ` (intent ${entry.intent})` : ""}`);
  return needs;
}

function allowed(needs: Requirement, caller: Caller): boolean {
  if (needs === "public") return true;
  if (caller === "signed-out") return false;
  return needs === "signed-in" || can(caller, needs);
}

const isRequirement = (value: unknown) => value === "public" || value === "signed-in" || (typeof value === "string" && Object.hasOwn(PERMISSIONS, value));

/**
 * The intents an action's form schema (the module's `actionForm`) lists: the
 * literal values of its `intent` field, which zod keeps for an object and a
 * discriminated union alike; null without such a field.
 */
function intentsOf(schema: unknown): string[] | null {
  const values = (schema as { _zod?: { propValues?: Record<string, Set<unknown>> } } | undefined)?._zod?.propValues?.intent;
  return values ? [...values].map(String).sort() : null;
}

/**
 * One hash over every row of every table: any write shows. The request
 * counters aside: a refused API call is counted too (decision 009).
 */
async function fingerprint(): Promise<string> {
  const db = database();
  const tables = await db.execute<{ name: string }>(
    sql`select tablename as name from pg_tables where schemaname = 'public' and tablename not like '__drizzle%' and tablename <> 'rate_limits' order by 1`,
  );
  const parts = tables.map(
    ({ name }) => sql`select ${name}::text || ':' || coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as h from ${sql.identifier(name)} t`,
  );
  const [row] = await db.execute<{ h: string }>(sql`select md5(string_agg(h, ',')) as h from (${sql.join(parts, sql` union all `)}) parts`);
  return row.h;
}

let ids: DemoIds;
// The local inbox page reads an SMTP fake's messages: one of this file's own, so the matrix needs no other.
let inbox: MailFake | undefined;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  inbox = await MailFake.start();
  process.env.MAIL_INBOX_URL = inbox.inboxUrl;
}, 60_000);

afterAll(async () => {
  await inbox?.stop();
});

describe("every route module declares what its loader, action and each intent need, and the matrix runs each", () => {
  test.each(files)("%s", (file) => {
    const module = modules.get(file)!;
    const declared = module.permissions;
    for (const kind of ["loader", "action"] as const) {
      const named = declared?.[kind];
      if (typeof module[kind] !== "function") {
        expect(named, `${file} declares a ${kind} it does not export`).toBeUndefined();
        continue;
      }
      expect(named, `${file} exports a ${kind} but its \`permissions\` do not say what it needs`).toBeDefined();
      for (const needs of typeof named === "object" ? Object.values(named) : [named]) {
        expect(isRequirement(needs), `${file}: ${String(needs)} is neither a permission of app/platform/permissions.ts nor "public" or "signed-in"`).toBe(true);
      }
    }
    const intents = intentsOf(module.actionForm);
    if (module.actionForm !== undefined) expect(intents, `${file} exports an actionForm without an intent field`).not.toBeNull();
    const declaredIntents = typeof declared?.action === "object" ? Object.keys(declared.action).sort() : null;
    expect(declaredIntents, `${file}: permissions.action names each intent its actionForm lists, and only those`).toEqual(intents);

    const runs = (kind: "loader" | "action", intent?: string) =>
      cases.some((entry) => entry.route === file && entry.kind === kind && (intent === undefined || entry.intent === intent));
    if (typeof module.loader === "function") expect(runs("loader"), `${file} exports a loader but no access case names it`).toBe(true);
    if (typeof module.action === "function") {
      for (const intent of intents ?? [undefined]) {
        expect(runs("action", intent), `${file} exports an action but no access case posts ${intent ? `intent=${intent}` : "to it"}`).toBe(true);
      }
    }
  });
});

describe.each(cases.map((entry) => [entry.name, entry] as const))("%s", (_name, entry) => {
  test.each(callers)("as %s", async (caller) => {
    const needs = requirement(entry);
    const prepared = entry.prepare ? await entry.prepare(database(), ids, caller) : {};
    // Signing the caller in stores their session: before the fingerprint, which judges only the route.
    const request = await requestsAs(caller, ids);
    const before = await fingerprint();
    const answer = await outcome(async () => entry.run(request, ids, prepared));
    if (allowed(needs, caller)) {
      const ok = answer.status < 400 || answer.status === entry.allowedStatus;
      expect(ok, `${caller} may call ${entry.name} (needs ${needs}) but got ${answer.status}`).toBe(true);
      expect(answer.location ?? "", `${caller} was sent to sign in`).not.toMatch(/^\/(sign-in|welcome)/);
    } else {
      const refused = answer.status === 401 || answer.status === 403 || (caller === "signed-out" && /^\/sign-in/.test(answer.location ?? ""));
      expect(refused, `${caller} must be refused ${entry.name} (needs ${needs}) but got ${answer.status} ${answer.location ?? ""}`).toBe(true);
      expect(await fingerprint(), `${caller}'s refused ${entry.name} changed the database`).toBe(before);
    }
  });
});
