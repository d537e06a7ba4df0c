// Every form action reads its body within a limit: an upload far beyond it,
// sent without a declared length, is refused with 413 once the limit is
// passed, without reading the rest.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { act, demoIds, outcome, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import { countedBody, FORM_ACTIONS, postAs, refusalText } from "./support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

const UPLOAD_BYTES = 8 * 1024 * 1024;
// The largest form limit (a URDF file and the form around it) with room for the chunks in flight.
const READ_AT_MOST_BYTES = 2 * 1024 * 1024;

describe("a form of 8 MB with no declared length is refused with 413 after reading at most 2 MB", () => {
  test.each(FORM_ACTIONS.map((entry) => [entry.name, entry] as const))("%s", async (_name, entry) => {
    const fields = new URLSearchParams({ ...entry.form(ids), [entry.textField]: "" }).toString();
    const { stream, counter } = countedBody(`${fields}&padding=`, UPLOAD_BYTES);
    const request = await postAs(entry.caller, ids, entry.path(ids), stream, "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(413);
    expect(refusalText(answer.body)).toMatch(/\w+ \w+/);
    expect(counter.pulled, `bytes read of ${UPLOAD_BYTES}`).toBeLessThanOrEqual(READ_AT_MOST_BYTES);
  });
});
