// Every loader, action and API route × every role and signed out, run
// in-process against the test database and judged by the one permission
// table: allowed callers succeed, the others get 401/403 (or the sign-in
// redirect) and change nothing in the database.
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import routeConfig from "~/routes";
import { database } from "~/platform/db.server";
import { ROLES, can } from "~/platform/permissions";
import { type Caller, type DemoIds, demoIds, outcome, requestsAs } from "../../support/routes";
import type { RouteCase } from "./support";

const caseFiles = import.meta.glob<{ cases: RouteCase[] }>("./cases/*.ts", { eager: true });
const cases = Object.values(caseFiles).flatMap((file) => file.cases);
const callers: Caller[] = [...ROLES, "signed-out"];

function allowed(entry: RouteCase, caller: Caller): boolean {
  if (entry.needs === "public") return true;
  if (caller === "signed-out") return false;
  return entry.needs === "signed-in" || can(caller, entry.needs);
}

type ConfigEntry = { file: string; children?: ConfigEntry[] };
const routeFiles = (entries: ConfigEntry[]): string[] => entries.flatMap((entry) => [entry.file, ...routeFiles(entry.children ?? [])]);

/** One hash over every row of every table: any write shows. */
async function fingerprint(): Promise<string> {
  const db = database();
  const tables = await db.execute<{ name: string }>(
    sql`select tablename as name from pg_tables where schemaname = 'public' and tablename not like '__drizzle%' order by 1`,
  );
  const parts = tables.map(
    ({ name }) => sql`select ${name}::text || ':' || coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as h from ${sql.identifier(name)} t`,
  );
  const [row] = await db.execute<{ h: string }>(sql`select md5(string_agg(h, ',')) as h from (${sql.join(parts, sql` union all `)}) parts`);
  return row.h;
}

let ids: DemoIds;
beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

describe("every route module has its loader and action in the matrix", () => {
  const files = ["root.tsx", ...routeFiles(routeConfig as ConfigEntry[])];
  test.each(files)("%s", async (file) => {
    const module = await import(/* @vite-ignore */ `../../../app/${file}`);
    for (const kind of ["loader", "action"] as const) {
      if (typeof module[kind] !== "function") continue;
      const listed = cases.some((entry) => entry.route === file && entry.kind === kind);
      expect(listed, `${file} exports a ${kind} but no access case names it`).toBe(true);
    }
  });
});

describe.each(cases.map((entry) => [entry.name, entry] as const))("%s", (_name, entry) => {
  test.each(callers)("as %s", async (caller) => {
    const prepared = entry.prepare ? await entry.prepare(database(), ids, caller) : {};
    const before = await fingerprint();
    const answer = await outcome(async () => entry.run(await requestsAs(caller, ids), ids, prepared));
    const expectAllowed = allowed(entry, caller);
    if (expectAllowed) {
      const ok = answer.status < 400 || answer.status === entry.allowedStatus;
      expect(ok, `${caller} may call ${entry.name} (needs ${entry.needs}) but got ${answer.status}`).toBe(true);
      expect(answer.location ?? "", `${caller} was sent to sign in`).not.toMatch(/^\/(sign-in|welcome)/);
    } else {
      const refused = answer.status === 401 || answer.status === 403 || (caller === "signed-out" && /^\/sign-in/.test(answer.location ?? ""));
      expect(refused, `${caller} must be refused ${entry.name} (needs ${entry.needs}) but got ${answer.status} ${answer.location ?? ""}`).toBe(true);
      expect(await fingerprint(), `${caller}'s refused ${entry.name} changed the database`).toBe(before);
    }
  });
});
