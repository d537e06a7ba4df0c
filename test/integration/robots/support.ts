// Helpers of the robot integration tests: what a loader or action answered
// (status, body, redirect), multipart uploads, and reading revisions back.
import { readFileSync } from "node:fs";
import { asc, count, eq } from "drizzle-orm";
import { robotRevisions, robots } from "../../../db/schema";
import type { MakeRequest } from "../../support/access-matrix";
import { database } from "~/platform/db.server";

export type Outcome<T = unknown> = { status: number; location?: string; headers?: Headers; body: T };

/** Runs a loader or action and reads what it produced, returned or thrown. */
export async function outcome<T = any>(run: () => Promise<unknown>): Promise<Outcome<T>> {
  const read = async (value: unknown, thrown: boolean): Promise<Outcome<T>> => {
    if (value instanceof Response) {
      const text = await value.text();
      const type = value.headers.get("Content-Type") ?? "";
      const body = /json/.test(type) && text ? JSON.parse(text) : text;
      return { status: value.status, location: value.headers.get("Location") ?? undefined, headers: value.headers, body };
    }
    if (value && typeof value === "object" && "type" in value && value.type === "DataWithResponseInit") {
      const { data, init } = value as unknown as { data: T; init?: ResponseInit | null };
      return { status: init?.status ?? 200, body: data };
    }
    if (thrown) throw value;
    return { status: 200, body: value as T };
  };
  try {
    return await read(await run(), false);
  } catch (error) {
    return read(error, true);
  }
}

/** A multipart POST as the browser sends a file form, with the caller's session. */
export async function multipart(request: MakeRequest, path: string, fields: Record<string, string | File>): Promise<Request> {
  const base = await request("POST", path);
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  const headers = new Headers(base.headers);
  headers.delete("Content-Type");
  return new Request(base.url, { method: "POST", headers, body: form });
}

export const fixture = (name: string) => readFileSync(new URL(`../../kinematics/fixtures/${name}`, import.meta.url), "utf8");
export const demoJson = (file: string) => JSON.parse(readFileSync(new URL(`../../../db/demo/robots/${file}`, import.meta.url), "utf8"));

export async function revisionsOf(robotId: string) {
  return database().select().from(robotRevisions).where(eq(robotRevisions.robotId, robotId)).orderBy(asc(robotRevisions.number));
}

export async function robotCount(): Promise<number> {
  const [row] = await database().select({ n: count() }).from(robots);
  return row.n;
}

export async function revisionCount(): Promise<number> {
  const [row] = await database().select({ n: count() }).from(robotRevisions);
  return row.n;
}

let counter = 0;
/** A robot name no other test run uses. */
export const uniqueName = (label: string) => `${label} ${Date.now().toString(36)}-${++counter}`;
