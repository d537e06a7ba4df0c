// Archiving robots and gaits (kept, hidden from the usual lists, restorable)
// and deleting them once archived and referenced by nothing; a refusal says
// what still references the object. Each step is audit-logged and checked
// against the roles (archive: editors; delete: the owner).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, gaits, robots } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, memberAs, outcome, PUBLIC_ORIGIN, refusal, requestsAs, type ApiRefusal, type DemoIds, type FormRefusal } from "../../support/routes";
import { demoRobotJson } from "../../support/robots";
import { uniqueName } from "../../support/names";
import { database } from "~/platform/db.server";
import { createToken } from "~/features/accounts/tokens.server";
import { listGaits } from "~/features/gaits/gaits.server";
import { archiveGait, deleteGait, restoreGait } from "~/features/gaits/archive.server";
import { archiveRobot, deleteRobot, restoreRobot } from "~/features/robots/archive.server";
import { createRobotFromDefinition, listRobots } from "~/features/robots/robots.server";
import { createGait, newGaitForm } from "~/features/gaits/new-gait.server";
import * as robotArchive from "~/routes/robots/archive";
import * as gaitArchive from "~/routes/gaits/archive";
import * as apiRobot from "~/routes/api.v1/robots/robot";
import * as apiRobotArchive from "~/routes/api.v1/robots/archive";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

const as = (role: "owner" | "lead" | "animator") => ({ userId: ids.userIds[role], workspaceId: ids.workspaceId });

async function newRobot(): Promise<{ robotId: string; name: string }> {
  const name = uniqueName("Shelf walker");
  const { robotId } = await createRobotFromDefinition(
    { ...demoRobotJson("quay-walker"), name },
    { workspaceId: ids.workspaceId, authorId: ids.userIds.animator, fileName: "walker.json" },
  );
  return { robotId, name };
}

async function newGait(robotId: string): Promise<{ gaitId: string; name: string }> {
  const name = uniqueName("Shelf trot");
  const { id } = await createGait(as("animator"), newGaitForm.parse({ robotId, name, template: "trot" }));
  return { gaitId: id, name };
}

const auditOf = async (targetId: string) =>
  (await database().select().from(auditLog).where(eq(auditLog.targetId, targetId))).map((row) => ({ action: row.action, details: row.details }));

describe("robots", () => {
  test("an archived robot is kept, leaves the usual list, shows under the archived one, and comes back when restored", async () => {
    const { robotId, name } = await newRobot();
    await archiveRobot(as("animator"), robotId);
    expect((await listRobots(ids.workspaceId)).map((robot) => robot.name)).not.toContain(name);
    expect((await listRobots(ids.workspaceId, { archived: true })).map((robot) => robot.name)).toContain(name);
    await restoreRobot(as("lead"), robotId);
    expect((await listRobots(ids.workspaceId)).map((robot) => robot.name)).toContain(name);
    expect((await auditOf(robotId)).map((entry) => entry.action)).toEqual(["robot.create", "robot.archived", "robot.restored"]);
  });

  test("deleting needs the robot archived first, and refuses while gaits use it, naming them", async () => {
    const { robotId, name } = await newRobot();
    const active = await refusal(() => deleteRobot(as("owner"), robotId));
    expect(active).toMatchObject({ status: 409, code: "not-archived" });
    expect(active.message).toBe(`Archive ${name} before deleting it: an archived robot can still be restored, a deleted one cannot. Nothing was deleted.`);

    const { gaitId, name: gaitName } = await newGait(robotId);
    await archiveRobot(as("animator"), robotId);
    const used = await refusal(() => deleteRobot(as("owner"), robotId));
    expect(used).toMatchObject({ status: 409, code: "referenced" });
    expect(used.message).toBe(
      `${name} cannot be deleted: 1 gait uses it (${gaitName}). Delete that gait first, or keep the robot archived. Nothing was deleted.`,
    );
    expect(used.details).toEqual({ references: [{ kind: "gait", id: gaitId, name: gaitName, archived: false }] });

    await archiveGait(as("animator"), gaitId);
    await deleteGait(as("owner"), gaitId);
    const deleted = await deleteRobot(as("owner"), robotId);
    expect(deleted.name).toBe(name);
    expect(await database().select().from(robots).where(eq(robots.id, robotId))).toEqual([]);
    expect((await auditOf(robotId)).at(-1)).toEqual({ action: "robot.deleted", details: { name, revisions: 1 } });
  });

  test("the robot's gaits with released versions are named in the refusal too", async () => {
    await archiveRobot(as("lead"), ids.robotIds["Pier crawler"]);
    const refused = await refusal(() => deleteRobot(as("owner"), ids.robotIds["Pier crawler"]));
    expect(refused.message).toMatch(/^Pier crawler cannot be deleted: \d+ gaits use it \(.*Tripod cruise.*\)/);
    await restoreRobot(as("lead"), ids.robotIds["Pier crawler"]);
  });

  test("archiving twice or restoring what is not archived changes nothing and logs nothing more", async () => {
    const { robotId } = await newRobot();
    await archiveRobot(as("animator"), robotId);
    const again = await archiveRobot(as("animator"), robotId);
    expect(again.archivedAt).not.toBeNull();
    await restoreRobot(as("animator"), robotId);
    await restoreRobot(as("animator"), robotId);
    expect((await auditOf(robotId)).map((entry) => entry.action)).toEqual(["robot.create", "robot.archived", "robot.restored"]);
  });

  test("the page's form: an animator archives; an animator may not delete (403); a robot of another workspace is not found", async () => {
    const { robotId } = await newRobot();
    const post = async (role: "animator" | "owner", intent: string, id = robotId) =>
      outcome<FormRefusal | { ok: true; notice: string }>(async () =>
        act(robotArchive, await (await requestsAs(role, ids))("POST", `/robots/${id}/archive`, { form: { intent } }), { robotId: id }),
      );
    const archived = await post("animator", "archive");
    expect(archived.status).toBe(200);
    expect(archived.body).toMatchObject({ ok: true });
    const forbidden = await post("animator", "delete");
    expect(forbidden.status).toBe(403);
    const missing = await post("owner", "archive", "00000000-0000-4000-8000-000000000000");
    expect(missing.status).toBe(404);
    const deleted = await post("owner", "delete");
    expect(deleted.status).toBe(302);
    expect(deleted.headers.get("Location")).toMatch(/^\/robots\?show=archived&deleted=/);
  });

  test("the API: archive, restore and delete with a token, JSON refusals", async () => {
    const owner = await memberAs("owner", ids);
    const { token } = await createToken(owner, uniqueName("archive script"));
    const { robotId, name } = await newRobot();
    const call = (module: typeof apiRobot | typeof apiRobotArchive, method: string, path: string) =>
      outcome<ApiRefusal & { id: string; name: string; archivedAt: string | null }>(() =>
        act(module, new Request(new URL(path, PUBLIC_ORIGIN), { method, headers: { Authorization: `Bearer ${token}` } }), { robotId }),
      );
    const refused = await call(apiRobot, "DELETE", `/api/v1/robots/${robotId}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: "conflict", details: { reason: "not-archived" } });
    const archived = await call(apiRobotArchive, "POST", `/api/v1/robots/${robotId}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body).toMatchObject({ id: robotId, name });
    expect(archived.body.archivedAt).not.toBeNull();
    const restored = await call(apiRobotArchive, "DELETE", `/api/v1/robots/${robotId}/archive`);
    expect(restored.body.archivedAt).toBeNull();
    await call(apiRobotArchive, "POST", `/api/v1/robots/${robotId}/archive`);
    const gone = await call(apiRobot, "DELETE", `/api/v1/robots/${robotId}`);
    expect(gone.status).toBe(200);
    expect(gone.body).toMatchObject({ id: robotId, name, deleted: true });
  });
});

describe("gaits", () => {
  test("an archived gait leaves the usual list and shows under the archived one", async () => {
    const { robotId } = await newRobot();
    const { gaitId, name } = await newGait(robotId);
    await archiveGait(as("animator"), gaitId);
    expect((await listGaits(ids.workspaceId)).map((gait) => gait.name)).not.toContain(name);
    expect((await listGaits(ids.workspaceId, { archived: true })).map((gait) => gait.name)).toContain(name);
    await restoreGait(as("animator"), gaitId);
    expect((await listGaits(ids.workspaceId)).map((gait) => gait.name)).toContain(name);
  });

  test("a gait with a released version cannot be deleted; the refusal names the versions", async () => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    await archiveGait(as("lead"), gaitId);
    const refused = await refusal(() => deleteGait(as("owner"), gaitId));
    expect(refused).toMatchObject({ status: 409, code: "referenced" });
    expect(refused.message).toBe(
      "Tripod cruise cannot be deleted: version 1 was released, and firmware builds may still fetch it. Keep the gait archived instead. Nothing was deleted.",
    );
    expect(await database().select({ id: gaits.id }).from(gaits).where(eq(gaits.id, gaitId))).toHaveLength(1);
    await restoreGait(as("lead"), gaitId);
  });

  test("the page's form: deleting an archived gait as the owner goes back to the archived list; the entry names it", async () => {
    const { robotId } = await newRobot();
    const { gaitId, name } = await newGait(robotId);
    const post = async (intent: string) =>
      outcome(async () => act(gaitArchive, await (await requestsAs("owner", ids))("POST", `/gaits/${gaitId}/archive`, { form: { intent } }), { gaitId }));
    expect((await post("archive")).status).toBe(200);
    const deleted = await post("delete");
    expect(deleted.status).toBe(302);
    expect(deleted.headers.get("Location")).toBe(`/gaits?show=archived&deleted=${encodeURIComponent(name)}`);
    expect((await auditOf(gaitId)).at(-1)).toEqual({ action: "gait.deleted", details: { name, robot: expect.any(String), versions: 0 } });
  });
});
