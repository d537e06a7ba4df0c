// A commit whose content (sequence and robot definition, by content hash) is
// the newest version's makes no new version: it is refused with 409 naming
// that version. The check is made where the next number is taken, inside the
// transaction that holds the gait, so racing commits cannot each pass it.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { gaitVersions } from "../../../db/schema";
import { changeDraft } from "../../support/drafts";
import { uniqueName } from "../../support/names";
import { act, outcome, refusal, requestsAs, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import { ServiceError } from "~/platform/errors.server";
import { commitDraft, restoreDraft, type Committer } from "~/features/versions/versions.server";
import * as gaitPage from "~/routes/gaits/gait";
import { draftRevisionOf, setUpCommitting } from "./support";

let ids: DemoIds;
let committer: Committer;

beforeAll(async () => ({ ids, committer } = await setUpCommitting()));
const versionsOf = (gaitId: string) => database().select().from(gaitVersions).where(eq(gaitVersions.gaitId, gaitId));

describe("a commit of the newest version's content", () => {
  test("20 concurrent commits of one draft make exactly one new version; the other 19 are refused with 409 naming it", async () => {
    const gaitId = ids.gaitIds["Ripple turn left"];
    await changeDraft(database(), gaitId);
    const before = (await versionsOf(gaitId)).length;
    const results = await Promise.allSettled(Array.from({ length: 20 }, (_, racer) => commitDraft(committer, gaitId, uniqueName(`Racer ${racer}`))));
    const made = results.filter((result) => result.status === "fulfilled").map((result) => result.value);
    expect(made, "commits that made a version").toHaveLength(1);
    const refusals = results.filter((result) => result.status === "rejected").map((result) => result.reason as unknown);
    expect(refusals).toHaveLength(19);
    for (const reason of refusals) {
      expect(reason).toBeInstanceOf(ServiceError);
      expect((reason as ServiceError).status).toBe(409);
      expect((reason as ServiceError).message).toContain(`version ${made[0].number}`);
    }
    expect(await versionsOf(gaitId)).toHaveLength(before + 1);
  });

  test("committing the seeded draft, which is the newest version's content, is refused with 409 naming that version", async () => {
    const gaitId = ids.gaitIds["Wave creep"];
    const rows = await versionsOf(gaitId);
    const newest = rows.reduce((a, b) => (a.number > b.number ? a : b));
    const refused = await refusal(() => commitDraft(committer, gaitId, uniqueName("Nothing new")));
    expect(refused.status).toBe(409);
    expect(refused.message).toContain(`version ${newest.number}`);
    expect(refused.record).toMatchObject({ versionId: newest.id, number: newest.number });
    expect(await versionsOf(gaitId)).toHaveLength(rows.length);
  });

  test("a draft changed since the newest version is committed", async () => {
    const gaitId = ids.gaitIds["Crawl"];
    const before = (await versionsOf(gaitId)).length;
    await changeDraft(database(), gaitId);
    await expect(commitDraft(committer, gaitId, uniqueName("Changed"))).resolves.toMatchObject({ number: before + 1 });
  });

  test("content equal to an older version, not the newest, is a new version (going back is a change)", async () => {
    const gaitId = ids.gaitIds["Trot"];
    const [first] = await database()
      .select()
      .from(gaitVersions)
      .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, 1)));
    const before = (await versionsOf(gaitId)).length;
    await restoreDraft(committer, gaitId, first.id, await draftRevisionOf(gaitId));
    const again = await commitDraft(committer, gaitId, uniqueName("Back to the first trot"));
    expect(again).toMatchObject({ number: before + 1, contentHash: first.contentHash });
  });

  test("the gait page's commit answers 409 with the sentence naming the version", async () => {
    const gaitId = ids.gaitIds["Alternating tetrapod"];
    await changeDraft(database(), gaitId);
    const request = await requestsAs("animator", ids);
    const commit = async () =>
      outcome<{ error?: string; version?: { number: number } }>(async () =>
        act(gaitPage, await request("POST", `/gaits/${gaitId}`, { form: { intent: "commit", message: uniqueName("From the page") } }), { gaitId }),
      );
    const done = await commit();
    expect(done.status).toBe(200);
    const again = await commit();
    expect(again.status).toBe(409);
    expect(again.body.error).toContain(`version ${done.body.version!.number}`);
  });
});
