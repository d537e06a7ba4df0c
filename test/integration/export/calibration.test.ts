// Calibration profiles per physical unit: create, edit, delete through the
// page's form and the service; checked against the robot (schema, legs,
// channels) with the issues by path; optimistic concurrency on `revision`;
// audit entries; and the read-only API list.
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { calibrationProfiles } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { uniqueName } from "../../support/names";
import { act, bearer, demoIds, load, loaderData, outcome, requestsAs, responseOf, type DemoIds, type FormRefusal, type Outcome } from "../../support/routes";
import { createProfile, deleteProfile, listProfiles, updateProfile } from "~/features/robots/calibration.server";
import { database } from "~/platform/db.server";
import { ServiceError } from "~/platform/errors.server";
import * as apiList from "~/routes/api.v1/export/calibration-profiles";
import * as page from "~/routes/export/calibration";
import { auditEntries, tokenFor } from "./support";

let ids: DemoIds;
let robotId: string;
let actor: { userId: string; workspaceId: string };

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  robotId = ids.robotIds["Quay walker"];
  actor = { userId: ids.userIds.firmware, workspaceId: ids.workspaceId };
});

/** What the page's action answered: a redirect, or a refusal with a status. */
async function post(role: "firmware" | "viewer" | "owner", form: Record<string, string>): Promise<Outcome<FormRefusal>> {
  const request = await requestsAs(role, ids);
  return outcome(async () => act(page, await request("POST", `/export/calibration/${robotId}`, { form }), { robotId }));
}

async function thrown(run: () => Promise<unknown>): Promise<Error> {
  try {
    await run();
  } catch (error) {
    return error as Error;
  }
  throw new Error("expected a refusal");
}

describe("through the page's form", () => {
  test("create: the form's fields become the profile; the page then opens it at revision 1", async () => {
    const name = uniqueName("SN-QW");
    const outcome = await post("firmware", {
      intent: "create",
      name,
      description: "femur servo swapped",
      "joints.LF.femur.trimDeg": "-1.5",
      "joints.LF.femur.reversed": "true",
      "joints.RR.tibia.channel": "",
      "joints.LR.coxa.reversed": "",
    });
    expect(outcome.status).toBe(302);
    const [row] = await database().select().from(calibrationProfiles).where(eq(calibrationProfiles.name, name));
    expect(outcome.location).toBe(`/export/calibration/${robotId}?edit=${row.id}&saved=1`);
    expect(row.revision).toBe(1);
    expect(row.profile).toEqual({ name, description: "femur servo swapped", joints: { LF: { femur: { trimDeg: -1.5, reversed: true } } } });
    const [entry] = await auditEntries("calibration.created", 1);
    expect(entry).toMatchObject({ actorId: ids.userIds.firmware, targetType: "robot", targetId: robotId, details: { profileId: row.id, name, revision: 1 } });

    const request = await requestsAs("viewer", ids);
    const loaded = await loaderData(page, await request("GET", `/export/calibration/${robotId}?edit=${row.id}&saved=1`), { robotId });
    expect(loaded.editing).toBe(row.id);
    expect(loaded.canEdit).toBe(false);
    expect(loaded.profiles.find((entry) => entry.id === row.id)?.profile.joints.LF?.femur?.trimDeg).toBe(-1.5);
  });

  test("invalid fields come back by path, beside their inputs, and nothing is saved", async () => {
    const name = uniqueName("SN-bad");
    const outcome = await post("firmware", { intent: "create", name, "joints.LF.coxa.trimDeg": "50", "joints.RF.femur.channel": "two" });
    expect(outcome.status).toBe(422);
    expect(outcome.body.details?.issues).toEqual([{ path: "joints.RF.femur.channel", message: 'must be a whole channel number (got "two")' }]);
    const schema = await post("firmware", { intent: "create", name, "joints.LF.coxa.trimDeg": "50" });
    expect(schema.status).toBe(422);
    expect(schema.body.details?.issues?.[0].path).toBe("joints.LF.coxa.trimDeg");
    expect(schema.body.details?.issues?.[0].message).toMatch(/45/);
    expect(await database().select().from(calibrationProfiles).where(eq(calibrationProfiles.name, name))).toEqual([]);
  });

  test("two joints on one channel: refused, naming the channel", async () => {
    const outcome = await post("firmware", { intent: "create", name: uniqueName("SN-dup"), "joints.LF.coxa.channel": "1" });
    expect(outcome.status).toBe(422);
    expect(JSON.stringify(outcome.body.details?.issues)).toMatch(/channel 1/);
  });

  test("a pasted JSON profile naming a leg the robot lacks: the issue at joints.<leg>", async () => {
    const outcome = await post("firmware", {
      intent: "import",
      json: JSON.stringify({ name: uniqueName("SN-json"), joints: { LM: { coxa: { trimDeg: 1 } } } }),
    });
    expect(outcome.status).toBe(422);
    expect(outcome.body.details?.issues?.[0].path).toBe("joints.LM");
    expect((await post("firmware", { intent: "import", json: "{ nope" })).body.error).toMatch(/not JSON/);
  });

  test("update over a stale revision: 409 with both revisions; the newer save stays", async () => {
    const created = await createProfile(actor, robotId, { name: uniqueName("SN-race"), joints: {} });
    const first = await post("firmware", { intent: "update", profileId: created.id, baseRevision: "1", name: created.name, "joints.LF.tibia.trimDeg": "1" });
    expect(first.status).toBe(302);
    expect(first.location).toContain("saved=2");
    const stale = await post("firmware", { intent: "update", profileId: created.id, baseRevision: "1", name: created.name, "joints.LF.tibia.trimDeg": "9" });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/revision 1, now 2/);
    const [row] = await database().select().from(calibrationProfiles).where(eq(calibrationProfiles.id, created.id));
    expect(row.revision).toBe(2);
    expect(row.profile).toMatchObject({ joints: { LF: { tibia: { trimDeg: 1 } } } });
  });

  test("delete needs the current revision too; then the profile is gone and the deletion audited", async () => {
    const created = await createProfile(actor, robotId, { name: uniqueName("SN-del"), joints: {} });
    await updateProfile(actor, robotId, created.id, { name: created.name, joints: { RF: { coxa: { trimDeg: 0.5 } } } }, 1);
    expect((await post("firmware", { intent: "delete", profileId: created.id, baseRevision: "1" })).status).toBe(409);
    const done = await post("firmware", { intent: "delete", profileId: created.id, baseRevision: "2" });
    expect(done.status).toBe(302);
    expect(await database().select().from(calibrationProfiles).where(eq(calibrationProfiles.id, created.id))).toEqual([]);
    expect((await auditEntries("calibration.deleted", 1))[0].details).toMatchObject({ profileId: created.id, revision: 2 });
    // Deleting it again: it is gone (404), not a conflict.
    expect((await post("firmware", { intent: "delete", profileId: created.id, baseRevision: "2" })).status).toBe(404);
  });

  test("a name the robot already uses: 409 on the name field", async () => {
    const created = await createProfile(actor, robotId, { name: uniqueName("SN-twice"), joints: {} });
    const outcome = await post("firmware", { intent: "create", name: created.name });
    expect(outcome.status).toBe(409);
    expect(outcome.body).toMatchObject({ field: "name" });
  });

  test("a viewer is refused, and nothing changes", async () => {
    const before = (await listProfiles(robotId)).length;
    expect((await post("viewer", { intent: "create", name: uniqueName("SN-viewer") })).status).toBe(403);
    expect((await listProfiles(robotId)).length).toBe(before);
  });
});

describe("the service", () => {
  test("two saves from the same revision at once: one wins, the other is told (409)", async () => {
    const created = await createProfile(actor, robotId, { name: uniqueName("SN-both"), joints: {} });
    const results = await Promise.allSettled(
      [1, 2].map((trim) => updateProfile(actor, robotId, created.id, { name: created.name, joints: { LF: { coxa: { trimDeg: trim } } } }, 1)),
    );
    expect(results.filter((result) => result.status === "fulfilled")).toHaveLength(1);
    const refused = results.find((result) => result.status === "rejected") as PromiseRejectedResult;
    expect(refused.reason).toBeInstanceOf(ServiceError);
    expect(refused.reason.status).toBe(409);
    expect((await auditEntries("calibration.updated", 5)).filter((entry) => (entry.details as { profileId?: string }).profileId === created.id)).toHaveLength(
      1,
    );
  });

  test("two creates of one name that both pass the name check: one wins, the other is told (409), never a 500", async () => {
    const name = uniqueName("SN-race");
    let locked!: () => void;
    let release!: () => void;
    const lockHeld = new Promise<void>((resolve) => (locked = resolve));
    const released = new Promise<void>((resolve) => (release = resolve));
    // SHARE mode lets both name checks read but holds both INSERTs, so neither
    // check can see the other's row: only the unique constraint tells them apart.
    const blocker = database().transaction(async (tx) => {
      await tx.execute(sql`lock table calibration_profiles in share mode`);
      locked();
      await released;
    });
    await lockHeld;
    const creates = [1, 2].map(() => createProfile(actor, robotId, { name, joints: {} }));
    const settled = Promise.allSettled(creates);
    for (let waiting = 0; waiting < 2;) {
      await new Promise((resolve) => setTimeout(resolve, 20));
      const [row] = await database().execute<{ count: number }>(
        sql`select count(*)::int as count from pg_locks where relation = 'calibration_profiles'::regclass and not granted`,
      );
      waiting = row.count;
    }
    release();
    await blocker;
    const results = await settled;
    expect(results.filter((result) => result.status === "fulfilled")).toHaveLength(1);
    const refused = results.find((result) => result.status === "rejected") as PromiseRejectedResult;
    expect(refused.reason).toBeInstanceOf(ServiceError);
    expect(refused.reason).toMatchObject({ status: 409, details: { field: "name" } });
    expect((await listProfiles(robotId)).filter((entry) => entry.name === name)).toHaveLength(1);
  });

  test("another workspace's actor cannot touch the robot (404)", async () => {
    const error = await thrown(() =>
      createProfile({ userId: actor.userId, workspaceId: "00000000-0000-4000-8000-000000000000" }, robotId, { name: "x", joints: {} }),
    );
    expect((error as ServiceError).status).toBe(404);
  });

  test("the checks: schema issues by path, and a name longer than 100 characters", async () => {
    const error = await thrown(() => createProfile(actor, robotId, { name: "x".repeat(101), joints: { LF: { knee: {} } } }));
    expect(error).toBeInstanceOf(ServiceError);
    expect(error).toMatchObject({ status: 422, code: "invalid" });
    expect((error as ServiceError).record.issues?.map((issue) => issue.path)).toContain("joints.LF.knee");
    const long = await thrown(() => createProfile(actor, robotId, { name: "x".repeat(101), joints: {} }));
    expect((long as ServiceError).record.issues).toEqual([{ path: "name", message: "must be at most 100 characters" }]);
  });

  test("delete by the service", async () => {
    const created = await createProfile(actor, robotId, { name: uniqueName("SN-gone"), joints: {} });
    expect(await deleteProfile(actor, robotId, created.id, 1)).toEqual({ name: created.name });
  });
});

describe("GET /api/v1/robots/:robotId/calibration-profiles", () => {
  test("lists the robot's profiles with their revisions, with a token", async () => {
    const created = await createProfile(actor, robotId, { name: uniqueName("SN-api"), joints: { RR: { femur: { reversed: true } } } });
    const token = await tokenFor(ids.workspaceId, ids.userIds.firmware);
    const answer = await responseOf<{ robot: unknown; profiles: { id: string }[] }>(() =>
      load(apiList, bearer(`/api/v1/robots/${robotId}/calibration-profiles`, token), { robotId }),
    );
    expect(answer.status).toBe(200);
    expect(answer.body.robot).toMatchObject({ id: robotId, name: "Quay walker" });
    expect(answer.body.profiles.find((entry) => entry.id === created.id)).toMatchObject({
      name: created.name,
      revision: 1,
      updatedBy: { login: "priya-sandoval" },
      profile: { joints: { RR: { femur: { reversed: true } } } },
    });
  });

  test("a robot of another workspace or a malformed id: 404 / 400", async () => {
    const token = await tokenFor(ids.workspaceId, ids.userIds.firmware);
    const missing = "00000000-0000-4000-8000-000000000000";
    expect((await responseOf(() => load(apiList, bearer(`/api/v1/robots/${missing}/calibration-profiles`, token), { robotId: missing }))).status).toBe(404);
    expect((await responseOf(() => load(apiList, bearer("/api/v1/robots/x/calibration-profiles", token), { robotId: "x" }))).status).toBe(400);
  });
});
