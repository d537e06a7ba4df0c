// The audit log as people read it: each entry a sentence naming who did what
// to which object (names recorded when written, or resolved for older rows),
// filtered by person, object, kind and action or searched, and paged by id
// past any number of entries in a stable order.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { auditLog, robots } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { demoIds, loaderData, memberAs, requestsAs, type DemoIds } from "../../support/routes";
import { demoRobotJson } from "../../support/robots";
import { uniqueName } from "../../support/names";
import type { Member } from "~/platform/access.server";
import { auditSentence } from "~/platform/audit-labels";
import { readAuditLog, type AuditLogEntry } from "~/platform/audit-log.server";
import { database } from "~/platform/db.server";
import { changeRole } from "~/features/accounts/members.server";
import { createRobotFromDefinition, saveRevision } from "~/features/robots/robots.server";
import * as auditPage from "~/routes/settings/audit";

let ids: DemoIds;
let owner: Member;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  owner = await memberAs("owner", ids);
});

const sentences = (entries: AuditLogEntry[]) => entries.map((entry) => auditSentence(entry.sentence));

describe("an entry says who did what to which object, by name", () => {
  test("a role change says whose role it was (recorded when written)", async () => {
    await changeRole(owner, ids.userIds.animator, "lead");
    await changeRole(owner, ids.userIds.animator, "animator");
    const page = await readAuditLog(ids.workspaceId, { action: "member.role-changed" });
    expect(sentences(page.entries).slice(0, 2)).toEqual([
      "Ines Okafor changed Theo Brandt’s role from lead to animator",
      "Ines Okafor changed Theo Brandt’s role from animator to lead",
    ]);
    expect(page.entries[0].details).toMatchObject({ member: "Theo Brandt" });
  });

  test("a robot save names the robot and its revision", async () => {
    const name = uniqueName("Audit walker");
    const { robotId } = await createRobotFromDefinition(
      { ...demoRobotJson("quay-walker"), name },
      { workspaceId: ids.workspaceId, authorId: ids.userIds.animator, fileName: "walker.json" },
    );
    const definition = { ...demoRobotJson("quay-walker"), name, standHeight: 77 };
    await saveRevision({
      workspaceId: ids.workspaceId,
      robotId,
      author: { id: ids.userIds.animator, role: "animator" },
      baseRevision: 1,
      definition,
      message: "",
    });
    const page = await readAuditLog(ids.workspaceId, { object: { kind: "robot", id: robotId } });
    expect(sentences(page.entries)[0]).toBe(`Theo Brandt saved robot ${name} revision 2 (1 field changed)`);
    expect(page.entries[0].sentence).toContainEqual({ name, href: `/robots/${robotId}` });
    expect(page.entries[0].details).toMatchObject({ name, revision: 2 });
  });

  test("entries written before names were recorded are named from the object's row, or from another entry once the object is gone", async () => {
    const crawler = ids.robotIds["Pier crawler"];
    await database()
      .insert(auditLog)
      .values([
        {
          workspaceId: ids.workspaceId,
          actorId: ids.userIds.owner,
          action: "member.role-changed",
          targetType: "user",
          targetId: ids.userIds.viewer,
          details: { from: "viewer", to: "firmware" },
        },
        {
          workspaceId: ids.workspaceId,
          actorId: ids.userIds.animator,
          action: "robot.save",
          targetType: "robot",
          targetId: crawler,
          details: { revision: 9, changedFields: 2 },
        },
      ]);
    const gone = uniqueName("Scrapped rig");
    const [scrapped] = await database().insert(robots).values({ workspaceId: ids.workspaceId, name: gone }).returning();
    await database()
      .insert(auditLog)
      .values([
        {
          workspaceId: ids.workspaceId,
          actorId: ids.userIds.animator,
          action: "robot.save",
          targetType: "robot",
          targetId: scrapped.id,
          details: { revision: 3, changedFields: 1 },
        },
        {
          workspaceId: ids.workspaceId,
          actorId: ids.userIds.owner,
          action: "robot.deleted",
          targetType: "robot",
          targetId: scrapped.id,
          details: { name: gone, revisions: 3 },
        },
      ]);
    await database().delete(robots).where(eq(robots.id, scrapped.id));
    const page = await readAuditLog(ids.workspaceId, {}, {}, 4);
    expect(sentences(page.entries)).toEqual([
      `Ines Okafor deleted robot ${gone} and its 3 revisions`,
      `Theo Brandt saved robot ${gone} revision 3 (1 field changed)`,
      "Theo Brandt saved robot Pier crawler revision 9 (2 fields changed)",
      "Ines Okafor changed Kenji Wu’s role from viewer to firmware",
    ]);
    // A deleted robot's name is text, not a link to a page that is gone.
    expect(page.entries[1].sentence).toContainEqual({ name: gone, href: null });
  });

  test("a review step names the gait of the version", async () => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    const [version] = await database().execute<{ id: string }>(`select id from gait_versions where gait_id = '${gaitId}' and number = 1`);
    await database()
      .insert(auditLog)
      .values({
        workspaceId: ids.workspaceId,
        actorId: ids.userIds.lead,
        action: "version.sent-back",
        targetType: "gait_version",
        targetId: version.id,
        details: { gaitId, number: 1 },
      });
    const page = await readAuditLog(ids.workspaceId, { object: { kind: "gait", id: gaitId } }, {}, 1);
    expect(sentences(page.entries)).toEqual(["Mara Lindqvist sent version 1 of gait Tripod cruise back"]);
  });
});

describe("filters", () => {
  test("by person, by object, by kind, by action and by words", async () => {
    const crawler = ids.robotIds["Pier crawler"];
    const byFirmware = await readAuditLog(ids.workspaceId, { actor: ids.userIds.firmware });
    expect(byFirmware.entries.every((entry) => entry.actor?.id === ids.userIds.firmware)).toBe(true);

    const aboutCrawler = await readAuditLog(ids.workspaceId, { object: { kind: "robot", id: crawler } });
    expect(aboutCrawler.entries.length).toBeGreaterThan(0);
    expect(aboutCrawler.entries.every((entry) => entry.target.id === crawler)).toBe(true);

    const robotsOnly = await readAuditLog(ids.workspaceId, { object: { kind: "robot" } });
    expect(new Set(robotsOnly.entries.map((entry) => entry.target.type))).toEqual(new Set(["robot"]));

    const saves = await readAuditLog(ids.workspaceId, { action: "robot.save" });
    expect(new Set(saves.entries.map((entry) => entry.action))).toEqual(new Set(["robot.save"]));

    // "pier" names no entry's details, but the robot it names is called Pier crawler.
    const searched = await readAuditLog(ids.workspaceId, { q: "pier" });
    expect(sentences(searched.entries)).toContain("Theo Brandt saved robot Pier crawler revision 9 (2 fields changed)");
    // A wildcard typed is a letter.
    expect((await readAuditLog(ids.workspaceId, { q: "%" })).total).toBe(0);
  });
});

describe("paging", () => {
  test("past 200 entries, newest first, every entry once, and the pages hold still while new entries arrive", async () => {
    const marker = uniqueName("paging");
    await database()
      .insert(auditLog)
      .values(
        Array.from({ length: 260 }, (_, index) => ({
          workspaceId: ids.workspaceId,
          actorId: ids.userIds.firmware,
          action: "table.downloaded",
          targetType: "gait_version",
          targetId: null,
          details: { gait: marker, number: index + 1, format: "csv", units: "deg" },
        })),
      );
    const filter = { q: marker };
    const first = await readAuditLog(ids.workspaceId, filter);
    expect(first.total).toBe(260);
    expect(first.entries).toHaveLength(50);
    expect(first.newer).toBeNull();
    const seen = [...first.entries];
    let page = first;
    // A new entry while someone reads: it goes on top, and the older pages do not shift.
    await database()
      .insert(auditLog)
      .values({ workspaceId: ids.workspaceId, actorId: ids.userIds.firmware, action: "table.downloaded", details: { gait: marker, number: 261 } });
    while (page.older !== null) {
      page = await readAuditLog(ids.workspaceId, filter, { before: page.older });
      seen.push(...page.entries);
    }
    expect(seen).toHaveLength(260);
    const numbers = seen.map((entry) => (entry.details as { number: number }).number);
    expect(numbers).toEqual(Array.from({ length: 260 }, (_, index) => 260 - index));
    expect(page.total).toBe(261);
    expect(page.newerCount).toBe(261 - 10);

    // And back: the page newer than the last one is the one before it.
    const back = await readAuditLog(ids.workspaceId, filter, { after: page.newer! });
    expect(back.entries.map((entry) => entry.id)).toEqual(seen.slice(200, 250).map((entry) => entry.id));
  });

  test("the page reads its filter and page from the address, and ignores what does not read", async () => {
    const request = await requestsAs("viewer", ids);
    const data = await loaderData(auditPage, await request("GET", `/settings/audit?who=${ids.userIds.owner}&object=robot&action=nonsense!&before=abc`));
    expect(data.filtered).toBe(true);
    expect(data.page.entries.every((entry) => entry.actor?.id === ids.userIds.owner && entry.target.type === "robot")).toBe(true);
    expect(data.choices.people.map((person) => person.name)).toContain("Ines Okafor");
  });
});
