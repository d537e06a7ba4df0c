// Helpers of the version and review integration tests: signed-in members,
// fresh versions in a chosen state, what a loader or action answered, and
// the local fake SMTP server's messages.
import { eq } from "drizzle-orm";
import { gaitVersions, gaits, type VersionState } from "../../../db/schema";
import { demoIds, requestsAs, type Caller, type DemoIds } from "../../support/access-matrix";
import { currentMember, type Member } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { ServiceError } from "~/platform/errors.server";
import { commitDraft } from "~/features/versions/versions.server";
import { seedDemo } from "../../../db/seed";

export const MAIL_API = process.env.MAIL_INBOX_URL ?? "http://127.0.0.1:2626";

export async function setUp(): Promise<DemoIds> {
  await seedDemo(database());
  return demoIds(database());
}

export async function memberAs(role: Exclude<Caller, "signed-out">, ids: DemoIds): Promise<Member> {
  const member = await currentMember(await (await requestsAs(role, ids))("GET", "/"));
  if (!member) throw new Error(`no member for ${role}`);
  return member;
}

let counter = 0;
/** A message no other test (or worker) writes, so its mails can be told apart. */
export const unique = (label: string) => `${label} ${Date.now().toString(36)}-${process.env.VITEST_POOL_ID ?? 0}-${++counter}`;

/** Commits the gait's current draft as `author`, then moves the version straight to `state` (as the seed does). */
export async function versionIn(ids: DemoIds, gaitName: string, state: VersionState, author: Member, options: { reviewerId?: string; message?: string } = {}) {
  const message = options.message ?? unique("Test version");
  const version = await commitDraft({ userId: author.user.id, workspaceId: ids.workspaceId }, ids.gaitIds[gaitName], message);
  if (state !== "committed") {
    await database()
      .update(gaitVersions)
      .set({ state, reviewerId: options.reviewerId ?? ids.userIds.lead })
      .where(eq(gaitVersions.id, version.id));
  }
  return { ...version, message, gaitId: ids.gaitIds[gaitName] };
}

export async function stateOf(versionId: string): Promise<VersionState> {
  const [row] = await database().select({ state: gaitVersions.state }).from(gaitVersions).where(eq(gaitVersions.id, versionId));
  return row.state;
}

export async function draftRevisionOf(gaitId: string): Promise<number> {
  const [row] = await database().select({ draftRevision: gaits.draftRevision }).from(gaits).where(eq(gaits.id, gaitId));
  return row.draftRevision;
}

/** The refusal a service call ends in; fails the test if it succeeds. */
export async function refusal(run: () => Promise<unknown>): Promise<ServiceError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal, but the call succeeded");
}

export type Outcome<T = any> = { status: number; location?: string; body: T };

/** What a loader or action produced, returned or thrown: a Response, data(), or plain data. */
export async function outcome<T = any>(run: () => Promise<unknown>): Promise<Outcome<T>> {
  const read = async (value: unknown, thrown: boolean): Promise<Outcome<T>> => {
    if (value instanceof Response) {
      const text = await value.text();
      const body = /json/.test(value.headers.get("Content-Type") ?? "") && text ? JSON.parse(text) : text;
      return { status: value.status, location: value.headers.get("Location") ?? undefined, body };
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

export type Mail = { subject: string; text: string; to: string[] };

/** Mails to `to` whose text contains `needle`, newest first, waiting up to `timeoutMs` for at least one. */
export async function mailsTo(to: string, needle: string, timeoutMs = 5_000): Promise<Mail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await fetch(`${MAIL_API}/messages?to=${encodeURIComponent(to)}`);
    const found = ((await response.json()) as Mail[]).filter((mail) => mail.text.includes(needle));
    if (found.length > 0 || Date.now() > deadline) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
