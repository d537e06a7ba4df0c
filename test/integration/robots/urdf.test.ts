// Importing a URDF file: the report of what was mapped and a new robot, or a
// refusal that names the joint and saves nothing.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { robots } from "../../../db/schema";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, multipart, outcome, requestsAs, type DemoIds, type FormRefusal } from "../../support/routes";
import { uniqueName } from "../../support/names";
import { fixtureText } from "../../support/robots";
import type { AddRefusalDetails, ImportedRobot } from "~/features/robots/results";
import { importUrdf } from "~/kinematics";
import { database } from "~/platform/db.server";
import * as list from "~/routes/robots/list";
import { revisionCount, revisionsOf, robotCount } from "./support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

type ImportRefusal = FormRefusal<AddRefusalDetails>;

async function importFile<Answer = ImportedRobot>(xml: string, fields: Record<string, string> = {}) {
  const request = await requestsAs("animator", ids);
  return outcome<Answer>(async () =>
    act(
      list,
      await multipart(request, "/robots?index", { intent: "import-urdf", file: new File([xml], "test-crab.urdf", { type: "application/xml" }), ...fields }),
    ),
  );
}

describe("URDF import", () => {
  test("the test fixture imports: the report says what was mapped and the robot is created as importUrdf maps it", async () => {
    const name = uniqueName("Imported crab");
    const answer = await importFile(fixtureText("test-crab.urdf"), { name });
    expect(answer.status).toBe(200);
    const expected = importUrdf(fixtureText("test-crab.urdf"), { name });
    if (!expected.ok) throw new Error("fixture does not import");
    expect(answer.body).toMatchObject({ ok: true, name, report: expected.report });
    expect(answer.body.report[0]).toBe('base link "base_link" is the body frame; 4 legs found');
    const [row] = await database().select().from(robots).where(eq(robots.name, name));
    expect(answer.body.robotId).toBe(row.id);
    const [revision] = await revisionsOf(row.id);
    expect(revision.definition).toEqual(expected.robot);
    expect(revision.message).toBe("Imported from URDF test-crab.urdf");
  });

  test("without a name the URDF robot's own name is used; importing it twice is a 409 with the report kept", async () => {
    const first = await importFile(fixtureText("test-crab.urdf"));
    expect(first.status).toBe(200);
    expect(first.body.name).toBe("test_crab");
    const count = await robotCount();
    const second = await importFile<ImportRefusal>(fixtureText("test-crab.urdf"));
    expect(second.status).toBe(409);
    expect(second.body.details?.report?.length).toBeGreaterThan(0);
    expect(await robotCount()).toBe(count);
  });

  test("an unsupported chain is refused naming the joint: 422, nothing saved", async () => {
    const continuous = fixtureText("test-crab.urdf").replace('<joint name="fr_femur" type="revolute">', '<joint name="fr_femur" type="continuous">');
    const [robotsBefore, revisionsBefore] = [await robotCount(), await revisionCount()];
    const answer = await importFile<ImportRefusal>(continuous, { name: uniqueName("Refused crab") });
    expect(answer.status).toBe(422);
    expect(answer.body).toMatchObject({ code: "invalid", error: "test-crab.urdf cannot be imported. Nothing was saved." });
    expect(answer.body.details?.issues).toEqual([
      { path: "joint.fr_femur.type", message: 'joint "fr_femur" (femur) is continuous: a leg joint must be revolute, with limits' },
    ]);
    expect([await robotCount(), await revisionCount()]).toEqual([robotsBefore, revisionsBefore]);
  });

  test("not XML: 422 with the parser's line and column", async () => {
    const answer = await importFile<ImportRefusal>("<robot name='x'><link name='a'></robot>", { name: uniqueName("Not XML") });
    expect(answer.status).toBe(422);
    expect(answer.body.details?.issues?.[0].message).toMatch(/^not well-formed XML: .+ \(line \d+, column \d+\)$/);
  });
});
