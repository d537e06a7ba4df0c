// A URDF file the XML parser must not or cannot read (a DOCTYPE, nesting
// deeper than it goes) is refused through the robot list with 422 naming the
// problem, like any other import refusal; nothing is saved.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { fixtureText } from "../../support/robots";
import { act, demoIds, multipart, outcome, requestsAs, type DemoIds, type FormRefusal } from "../../support/routes";
import type { AddRefusalDetails } from "~/features/robots/results";
import { database } from "~/platform/db.server";
import * as list from "~/routes/robots/list";
import { revisionCount, robotCount } from "./support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

async function importFile(xml: string) {
  const request = await requestsAs("animator", ids);
  const file = new File([xml], "hostile.urdf", { type: "application/xml" });
  return outcome<FormRefusal<AddRefusalDetails>>(async () => act(list, await multipart(request, "/robots?index", { intent: "import-urdf", file })));
}

const crab = () => fixtureText("test-crab.urdf");

describe("URDF files the parser must not or cannot read: 422 naming the problem, nothing saved", () => {
  test.each([
    ["a DOCTYPE with an external entity", crab().replace("<robot", '<!DOCTYPE robot [<!ENTITY secret SYSTEM "file:///etc/passwd">]>\n<robot'), /DOCTYPE/],
    ["a DOCTYPE with an internal entity", crab().replace("<robot", '<!DOCTYPE robot [<!ENTITY crab "test_crab">]>\n<robot'), /DOCTYPE/],
    ["nesting 5000 elements deep", crab().replace("</robot>", `${"<gazebo>".repeat(5000)}${"</gazebo>".repeat(5000)}</robot>`), /nest/i],
  ])("%s", async (_label, xml, problem) => {
    const [robotsBefore, revisionsBefore] = [await robotCount(), await revisionCount()];
    const answer = await importFile(xml);
    expect(answer.status, JSON.stringify(answer.body).slice(0, 300)).toBe(422);
    expect(answer.body.details?.issues?.map((issue) => issue.message).join("; ")).toMatch(problem);
    expect(await robotCount()).toBe(robotsBefore);
    expect(await revisionCount()).toBe(revisionsBefore);
  });
});
