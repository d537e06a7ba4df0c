// Versions never change content: the database refuses any UPDATE of it,
// whoever sends it; only the review state, reviewer and state time may move.
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { gaitVersions } from "../../../db/schema";
import { memberAs, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import { setUp, versionIn } from "./support";

let ids: DemoIds;
let versionId: string;

beforeAll(async () => {
  ids = await setUp();
  versionId = (await versionIn(ids, "Tripod cruise", "committed", await memberAs("animator", ids))).id;
});

/** The Postgres error under drizzle's wrapper. */
async function databaseError(run: () => Promise<unknown>): Promise<{ code?: string; message: string }> {
  try {
    await run();
  } catch (error) {
    let current = error as { code?: string; message: string; cause?: unknown };
    while (current.cause && !current.code) current = current.cause as typeof current;
    return current;
  }
  throw new Error("the update went through");
}

describe("a committed version is immutable at the database", () => {
  const edits: [string, Record<string, unknown>][] = [
    ["its message", { message: "Rewritten history" }],
    ["its sequence", { sequence: { format: "gaitloom.sequence/1", cycleMs: 1, fps: 1, loop: true, legs: {} } }],
    ["its summary", { summary: { errors: 0 } }],
    ["its content hash", { contentHash: "0".repeat(64) }],
    ["its number", { number: 999 }],
    ["its author", { authorId: null }],
  ];
  test.each(edits)("an UPDATE of %s fails with an integrity error and changes nothing", async (_what, change) => {
    const [before] = await database().select().from(gaitVersions).where(eq(gaitVersions.id, versionId));
    const error = await databaseError(() => database().update(gaitVersions).set(change).where(eq(gaitVersions.id, versionId)));
    expect(error.code).toBe("23000"); // integrity_constraint_violation
    expect(error.message).toMatch(/immutable/);
    const [after] = await database().select().from(gaitVersions).where(eq(gaitVersions.id, versionId));
    expect(after).toEqual(before);
  });

  test("raw SQL is refused the same way", async () => {
    const error = await databaseError(() =>
      database().execute(sql`update gait_versions set sequence = sequence || '{"cycleMs": 2}'::jsonb where id = ${versionId}`),
    );
    expect(error.code).toBe("23000");
  });

  test("the review state, the reviewer and the state time may change", async () => {
    const changedAt = new Date("2030-01-01T00:00:00Z");
    await database()
      .update(gaitVersions)
      .set({ state: "in-review", reviewerId: ids.userIds.lead, stateChangedAt: changedAt })
      .where(eq(gaitVersions.id, versionId));
    const [row] = await database().select().from(gaitVersions).where(eq(gaitVersions.id, versionId));
    expect(row).toMatchObject({ state: "in-review", reviewerId: ids.userIds.lead, stateChangedAt: changedAt });
  });
});
