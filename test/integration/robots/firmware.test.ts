// Firmware may change zero offsets and servo mappings and nothing else: the
// server compares the save with the newest definition and names the field it refuses.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, outcome, requestsAs, type DemoIds, type FormRefusal } from "../../support/routes";
import { robotOf } from "../../support/robots";
import type { Robot } from "~/kinematics";
import { database } from "~/platform/db.server";
import * as robotPage from "~/routes/robots/robot";
import { revisionCount, revisionsOf } from "./support";

let ids: DemoIds;
let walkerId: string;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  walkerId = ids.robotIds["Quay walker"];
});

async function saveAsFirmware<Answer = unknown>(change: (copy: Robot) => void) {
  const all = await revisionsOf(walkerId);
  const latest = all[all.length - 1];
  const copy = robotOf(latest.definition);
  change(copy);
  const request = await requestsAs("firmware", ids);
  return outcome<Answer>(async () =>
    act(
      robotPage,
      await request("POST", `/robots/${walkerId}`, { form: { intent: "save", baseRevision: String(latest.number), definition: JSON.stringify(copy) } }),
      {
        robotId: walkerId,
      },
    ),
  );
}

describe("firmware saves calibration only", () => {
  test("zero offsets and every servo field may change", async () => {
    const answer = await saveAsFirmware((copy) => {
      copy.legs[0].joints.femur.zeroOffsetDeg = 2.5;
      copy.legs[1].joints.tibia.servo.reversed = !copy.legs[1].joints.tibia.servo.reversed;
      copy.legs[2].joints.coxa.servo = { ...copy.legs[2].joints.coxa.servo, centerUs: 1490, usPerDeg: 10.8, minUs: 600, maxUs: 2400 };
      copy.legs[3].joints.tibia.servo.channel = 40;
    });
    expect(answer.status).toBe(200);
    expect(answer.body).toMatchObject({ ok: true, number: 2 });
    const [, second] = await revisionsOf(walkerId);
    expect(second.authorId).toBe(ids.userIds.firmware);
    expect(robotOf(second.definition).legs[3].joints.tibia.servo.channel).toBe(40);
  });

  test.each<[string, (copy: Robot) => unknown, RegExp]>([
    ["a link length", (copy) => (copy.legs[0].femur += 1), /this save also changes legs\[0\]\.femur \(82 → 83\)\. Nothing was saved\.$/],
    ["a joint limit", (copy) => (copy.legs[1].joints.coxa.maxDeg = 35), /legs\[1\]\.joints\.coxa\.maxDeg \(40 → 35\)/],
    ["a joint speed", (copy) => (copy.legs[1].joints.coxa.maxSpeedDegS = 100), /legs\[1\]\.joints\.coxa\.maxSpeedDegS \(350 → 100\)/],
    ["a mount", (copy) => (copy.legs[2].mount.yawDeg = -45), /legs\[2\]\.mount\.yawDeg \(-40 → -45\)/],
    ["the stand height", (copy) => (copy.standHeight = 100), /standHeight \(120 → 100\)/],
    ["the name", (copy) => (copy.name = "Quay walker 2"), /name \("Quay walker" → "Quay walker 2"\)/],
    [
      "the leg count",
      (copy) => {
        const extra = structuredClone(copy.legs[0]);
        extra.id = "X1";
        extra.joints.coxa.servo.channel = 20;
        extra.joints.femur.servo.channel = 21;
        extra.joints.tibia.servo.channel = 22;
        copy.legs.push(extra);
        if (copy.rest) copy.rest.X1 = copy.rest.LF;
      },
      /legs \(4 items → 5 items\) and 1 more field \(rest\.X1\)/,
    ],
    ["the rest pose", (copy) => delete copy.rest, /rest \(an object → nothing\)/],
  ])("changing %s is refused with 403 naming the field", async (_what, change, expected) => {
    const count = await revisionCount();
    const answer = await saveAsFirmware<FormRefusal>(change);
    expect(answer.status).toBe(403);
    expect(answer.body.code).toBe("forbidden");
    expect(answer.body.error).toMatch(/^Firmware can change only zero offsets and servo mapping; this save also changes /);
    expect(answer.body.error).toMatch(expected);
    expect(await revisionCount()).toBe(count);
  });

  test("a calibration change together with a forbidden one saves nothing, and counts the others", async () => {
    const answer = await saveAsFirmware<FormRefusal>((copy) => {
      copy.legs[0].joints.femur.zeroOffsetDeg = 4;
      copy.legs[0].tibia = 125;
      copy.legs[1].tibia = 125;
    });
    expect(answer.status).toBe(403);
    expect(answer.body.error).toBe(
      "Firmware can change only zero offsets and servo mapping; this save also changes legs[0].tibia (124 → 125) and 1 more field (legs[1].tibia). Nothing was saved.",
    );
  });

  test("the same geometry change by an animator is saved", async () => {
    const all = await revisionsOf(walkerId);
    const latest = all[all.length - 1];
    const copy = robotOf(latest.definition);
    copy.legs[0].femur = 84;
    const request = await requestsAs("animator", ids);
    const answer = await outcome(async () =>
      act(
        robotPage,
        await request("POST", `/robots/${walkerId}`, { form: { intent: "save", baseRevision: String(latest.number), definition: JSON.stringify(copy) } }),
        {
          robotId: walkerId,
        },
      ),
    );
    expect(answer.status).toBe(200);
  });
});
