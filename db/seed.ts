// Loads the demo scenario into $DATABASE_URL. Idempotent: rows that exist are
// kept as they are, so running it again never overwrites anyone's edits.
import { readFile } from "node:fs/promises";
import { and, eq } from "drizzle-orm";
import { parseRobot } from "../app/kinematics";
import { createDatabase, databaseUrl, type Database } from "./client";
import { demoPeople, demoRobots, demoWorkspace } from "./demo/scenario";
import { memberships, robotRevisions, robots, users, workspaces } from "./schema";

export async function seedDemo(db: Database): Promise<{ workspaceId: string }> {
  return db.transaction(async (tx) => {
    await tx.insert(workspaces).values(demoWorkspace).onConflictDoNothing({ target: workspaces.slug });
    const [workspace] = await tx.select().from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));

    const userIds = new Map<string, string>();
    for (const person of demoPeople) {
      const { role, ...profile } = person;
      await tx.insert(users).values(profile).onConflictDoNothing({ target: users.login });
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
      const [robot] = await tx
        .insert(robots)
        .values({ workspaceId: workspace.id, name, createdById: authorId })
        .returning({ id: robots.id });
      await tx
        .insert(robotRevisions)
        .values({ robotId: robot.id, number: 1, definition: parsed.robot, message: entry.message, authorId });
    }
    return { workspaceId: workspace.id };
  });
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
