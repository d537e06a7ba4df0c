// Loads the demo scenario into $DATABASE_URL. Idempotent: rows that exist are
// kept as they are, so running it again never overwrites anyone's edits.
import { readFile } from "node:fs/promises";
import { and, desc, eq, sql } from "drizzle-orm";
import { generateGait } from "../app/gait/index";
import { parseRobot } from "../app/kinematics";
import { recordReleaseTable } from "../app/features/tables/releases.server";
import { commitDraft } from "../app/features/versions/versions.server";
import { createDatabase, databaseUrl, type Database } from "./client";
import { demoGaits, demoPeople, demoRobots, demoWorkspace } from "./demo/scenario";
import { gaitVersions, gaits, memberships, reviewEvents, robotRevisions, robots, users, workspaces, type VersionState } from "./schema";

export async function seedDemo(db: Database): Promise<{ workspaceId: string }> {
  return db
    .transaction(async (tx) => {
      await tx.insert(workspaces).values(demoWorkspace).onConflictDoNothing({ target: workspaces.slug });
      const [workspace] = await tx.select().from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));

      const userIds = new Map<string, string>();
      for (const person of demoPeople) {
        const { role, ...profile } = person;
        // Their address counts as verified on GitHub, as the local GitHub stand-in says it is, so invitations to it work.
        await tx
          .insert(users)
          .values({ ...profile, verifiedEmails: [profile.email.toLowerCase()] })
          .onConflictDoNothing({ target: users.login });
        const [user] = await tx.select({ id: users.id }).from(users).where(eq(users.login, person.login));
        userIds.set(person.login, user.id);
        await tx.insert(memberships).values({ workspaceId: workspace.id, userId: user.id, role }).onConflictDoNothing();
      }

      for (const entry of demoRobots) {
        const json = JSON.parse(await readFile(new URL(`./demo/robots/${entry.file}`, import.meta.url), "utf8"));
        const parsed = parseRobot(json);
        if (!parsed.ok) {
          throw new Error(`demo robot ${entry.file} is invalid: ${parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`);
        }
        const name = parsed.robot.name;
        const existing = await tx
          .select({ id: robots.id })
          .from(robots)
          .where(and(eq(robots.workspaceId, workspace.id), eq(robots.name, name)));
        if (existing.length > 0) continue;
        const authorId = userIds.get(entry.author);
        const [robot] = await tx.insert(robots).values({ workspaceId: workspace.id, name, createdById: authorId }).returning({ id: robots.id });
        await tx.insert(robotRevisions).values({ robotId: robot.id, number: 1, definition: parsed.robot, message: entry.message, authorId });
      }
      return { workspaceId: workspace.id, userIds };
    })
    .then(async ({ workspaceId, userIds }) => {
      // Gaits after the robots, each in its own transaction (commitDraft opens one per version).
      for (const demo of demoGaits) await seedGait(db, workspaceId, userIds, demo);
      return { workspaceId };
    });
}

/** The review steps that lead from committed to each demo state. */
const PATHS: Record<VersionState, VersionState[]> = {
  committed: [],
  "in-review": ["in-review"],
  "sent-back": ["in-review", "sent-back"],
  approved: ["in-review", "approved"],
  released: ["in-review", "approved", "released"],
  retired: ["in-review", "approved", "released", "retired"],
};

async function seedGait(db: Database, workspaceId: string, userIds: Map<string, string>, demo: (typeof demoGaits)[number]) {
  const [robot] = await db
    .select()
    .from(robots)
    .where(and(eq(robots.workspaceId, workspaceId), eq(robots.name, demo.robot)));
  const existing = await db
    .select({ id: gaits.id })
    .from(gaits)
    .where(and(eq(gaits.robotId, robot.id), eq(gaits.name, demo.name)));
  if (existing.length > 0) return;
  const [revision] = await db.select().from(robotRevisions).where(eq(robotRevisions.robotId, robot.id)).orderBy(desc(robotRevisions.number)).limit(1);
  const parsed = parseRobot(revision.definition);
  if (!parsed.ok) throw new Error(`demo robot ${demo.robot} is invalid`);
  const [gait] = await db
    .insert(gaits)
    .values({
      workspaceId,
      robotId: robot.id,
      name: demo.name,
      description: demo.description,
      draftRobotRevisionId: revision.id,
      createdById: userIds.get(demo.versions[0].author),
    })
    .returning();
  for (const version of demo.versions) {
    const authorId = userIds.get(version.author)!;
    const sequence = generateGait(parsed.robot, version.params);
    await db
      .update(gaits)
      .set({ draftSequence: sequence, draftRevision: sql`${gaits.draftRevision} + 1`, draftUpdatedAt: new Date(), draftUpdatedById: authorId })
      .where(eq(gaits.id, gait.id));
    const committed = await commitDraft({ userId: authorId, workspaceId }, gait.id, version.message, db);
    const reviewerId = version.reviewer ? userIds.get(version.reviewer) : undefined;
    let from: VersionState = "committed";
    for (const to of PATHS[version.state]) {
      await db.insert(reviewEvents).values({
        versionId: committed.id,
        actorId: to === "in-review" ? authorId : reviewerId,
        fromState: from,
        toState: to,
        comment:
          to === "sent-back"
            ? version.params.turnDegPerCycle
              ? "The inner legs scuff the deck at the start of the turn; lift them higher."
              : "The centre of mass leaves the support triangle whenever a leg lifts; sway the body towards the three feet down."
            : "",
      });
      from = to;
    }
    if (from !== "committed") {
      await db.update(gaitVersions).set({ state: from, reviewerId, stateChangedAt: new Date() }).where(eq(gaitVersions.id, committed.id));
    }
    if (from === "released") await recordReleaseTable(db, { versionId: committed.id, releasedById: reviewerId ?? null });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { db, client } = createDatabase(databaseUrl(), { max: 1 });
  try {
    await seedDemo(db);
    console.log(`demo scenario loaded: ${demoWorkspace.name}`);
  } finally {
    await client.end();
  }
}
