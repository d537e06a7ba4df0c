// Helpers of the export integration tests: API tokens, calling the table
// route, and reading back stored versions, their robots and audit entries.
import { createHash } from "node:crypto";
import { and, desc, eq } from "drizzle-orm";
import { apiTokens, auditLog, gaitVersions, gaits, memberships, robotRevisions, robots, users, workspaces, type Role } from "../../../db/schema";
import { parseSequence, type Sequence } from "~/gait";
import { parseRobot, type Robot } from "~/kinematics";
import { withGait } from "~/features/versions/index.server";
import { hashToken } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import * as tableRoute from "~/routes/api.v1/export/table";
import { uniqueName } from "../../support/names";
import { load, responseOf, type Outcome } from "../../support/routes";

/** A token of `userId` in `workspaceId`, stored as the app stores one. */
export async function tokenFor(workspaceId: string, userId: string): Promise<string> {
  const token = `gl_export_test_${uniqueName("t")}_0123456789abcdef`;
  await database()
    .insert(apiTokens)
    .values({ workspaceId, userId, name: uniqueName("export test"), tokenHash: hashToken(token), prefix: token.slice(0, 8) });
  return token;
}

/** Another workspace with an owner who holds a token there. */
export async function foreignOwnerToken(): Promise<string> {
  const db = database();
  const [workspace] = await db
    .insert(workspaces)
    .values({ slug: uniqueName("other-lab"), name: "Other lab" })
    .returning();
  const login = uniqueName("other-owner");
  const [user] = await db
    .insert(users)
    .values({ login, name: "Other Owner", email: `${login}@other.test` })
    .returning();
  await db.insert(memberships).values({ workspaceId: workspace.id, userId: user.id, role: "owner" satisfies Role });
  return tokenFor(workspace.id, user.id);
}

export const tablePath = (gaitId: string, number: string | number, query = "") => `/api/v1/gaits/${gaitId}/versions/${number}/table${query ? `?${query}` : ""}`;

/** GET the table route as the framework would call it; `Answer` is the body expected (a JsonTable, an ApiRefusal), if one is read. */
export function getTable<Answer = unknown>(request: Request, gaitId: string, number: string | number): Promise<Outcome<Answer>> {
  return responseOf<Answer>(() => load(tableRoute, request, { gaitId, number: String(number) }));
}

export const sha256 = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

/** A stored version with its parsed sequence and the robot revision it pins. */
export async function storedVersion(
  gaitId: string,
  number: number,
): Promise<{ id: string; contentHash: string; sequence: Sequence; robot: Robot; robotRevision: number; gaitName: string; robotName: string }> {
  const query = database()
    .select({
      id: gaitVersions.id,
      contentHash: gaitVersions.contentHash,
      sequence: gaitVersions.sequence,
      definition: robotRevisions.definition,
      robotRevision: robotRevisions.number,
      gaitName: gaits.name,
      robotName: robots.name,
    })
    .from(gaitVersions)
    .$dynamic();
  const [row] = await withGait(query)
    .innerJoin(robotRevisions, eq(robotRevisions.id, gaitVersions.robotRevisionId))
    .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, number)));
  const sequence = parseSequence(row.sequence);
  const robot = parseRobot(row.definition);
  if (!sequence.ok || !robot.ok) throw new Error("stored version does not parse");
  return {
    id: row.id,
    contentHash: row.contentHash,
    sequence: sequence.sequence,
    robot: robot.robot,
    robotRevision: row.robotRevision,
    gaitName: row.gaitName,
    robotName: row.robotName,
  };
}

/** The newest audit entries of an action. */
export async function auditEntries(action: string, limit = 5) {
  return database().select().from(auditLog).where(eq(auditLog.action, action)).orderBy(desc(auditLog.id)).limit(limit);
}
