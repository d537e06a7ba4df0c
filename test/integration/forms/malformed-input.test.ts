// Harmless malformed input to every form action gets a 4xx with a sentence
// that names what is wrong, never a server error: a body of another content
// type, a NUL character (PostgreSQL's text cannot hold U+0000), bytes that are
// not UTF-8 (RFC 3629), in urlencoded and multipart forms alike; and numbers
// are read as decimal numbers only.
import { beforeAll, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { uniqueName } from "../../support/names";
import { demoRobotJson } from "../../support/robots";
import { act, demoIds, outcome, type DemoIds } from "../../support/routes";
import { database } from "~/platform/db.server";
import * as calibration from "~/routes/export/calibration";
import * as editor from "~/routes/gaits/editor";
import * as newGait from "~/routes/gaits/new";
import * as robotList from "~/routes/robots/list";
import * as robotPage from "~/routes/robots/robot";
import { FORM_ACTIONS, postAs, refusalText } from "./support";

let ids: DemoIds;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
});

const each = FORM_ACTIONS.map((entry) => [entry.name, entry] as const);
const FORM_TYPES = /application\/x-www-form-urlencoded.*multipart\/form-data|multipart\/form-data.*application\/x-www-form-urlencoded/;

describe("a body that is not a form is refused with 415 naming the form types", () => {
  test.each(each)("%s, sent as JSON", async (_name, entry) => {
    const request = await postAs(entry.caller, ids, entry.path(ids), JSON.stringify(entry.form(ids)), "application/json");
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(415);
    expect(refusalText(answer.body)).toMatch(FORM_TYPES);
    expect(refusalText(answer.body)).toContain("application/json");
  });

  test.each(each)("%s, sent as plain text", async (_name, entry) => {
    const request = await postAs(entry.caller, ids, entry.path(ids), new URLSearchParams(entry.form(ids)).toString(), "text/plain");
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(415);
    expect(refusalText(answer.body)).toMatch(FORM_TYPES);
  });

  test.each(each)("%s, sent with no Content-Type", async (_name, entry) => {
    const request = await postAs(entry.caller, ids, entry.path(ids), new URLSearchParams(entry.form(ids)).toString(), null);
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(415);
    expect(refusalText(answer.body)).toMatch(FORM_TYPES);
  });
});

describe("a NUL character in a field is refused with 400 naming the field", () => {
  test.each(each)("%s", async (_name, entry) => {
    const fields = new URLSearchParams({ ...entry.form(ids), [entry.textField]: "before\u0000after" }).toString();
    const request = await postAs(entry.caller, ids, entry.path(ids), fields, "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toContain(`"${entry.textField}"`);
    expect(refusalText(answer.body)).toMatch(/NUL/);
  });

  test.each(each)("%s, in a multipart form", async (_name, entry) => {
    const form = new FormData();
    for (const [key, value] of Object.entries({ ...entry.form(ids), [entry.textField]: "before\u0000after" })) form.append(key, value);
    const request = await postAs(entry.caller, ids, entry.path(ids), form, null);
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toContain(`"${entry.textField}"`);
  });
});

/** A urlencoded form whose `field` holds the bytes "ab", 0xC3 0x28 (a lead byte without its continuation), "cd". */
const invalidUtf8Form = (fields: Record<string, string>, field: string) => {
  const others = new URLSearchParams(Object.entries(fields).filter(([key]) => key !== field)).toString();
  return `${others}&${field}=ab%C3%28cd`;
};

describe("bytes that are not UTF-8 in a field are refused with 400 naming the field, not stored as U+FFFD", () => {
  test.each(each)("%s, percent-encoded", async (_name, entry) => {
    const request = await postAs(entry.caller, ids, entry.path(ids), invalidUtf8Form(entry.form(ids), entry.textField), "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toContain(`"${entry.textField}"`);
    expect(refusalText(answer.body)).toMatch(/UTF-8/);
  });

  test.each(each)("%s, as raw bytes", async (_name, entry) => {
    const others = new URLSearchParams(Object.entries(entry.form(ids)).filter(([key]) => key !== entry.textField)).toString();
    const body = Buffer.concat([Buffer.from(`${others}&${entry.textField}=ab`), Buffer.from([0xff, 0xfe]), Buffer.from("cd")]);
    const request = await postAs(entry.caller, ids, entry.path(ids), body, "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toContain(`"${entry.textField}"`);
  });

  test.each(each)("%s, in a multipart text part", async (_name, entry) => {
    const boundary = "----gaitloom-test-boundary";
    const parts = Object.entries(entry.form(ids)).map(([key, value]) =>
      Buffer.concat([
        Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="${key}"\r\n\r\n`),
        key === entry.textField ? Buffer.from([0x61, 0xc3, 0x28, 0x62]) : Buffer.from(value),
        Buffer.from("\r\n"),
      ]),
    );
    const body = Buffer.concat([...parts, Buffer.from(`--${boundary}--\r\n`)]);
    const request = await postAs(entry.caller, ids, entry.path(ids), body, `multipart/form-data; boundary=${boundary}`);
    const answer = await outcome(async () => act(entry.module, request, entry.params(ids)));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toContain(`"${entry.textField}"`);
  });
});

// The numbers a browser's number field sends are HTML's valid floating-point
// numbers: no hexadecimal, binary or octal prefixes, no padding with spaces.
describe("number fields take decimal numbers only", () => {
  const robotId = () => ids.robotIds["Pier crawler"];

  test.each(["0x4B0", "0b10010110000", "0o2260", " 1200", "1200 ", "Infinity"])(
    "POST /gaits/new refuses cycleMs=%j with 422 naming cycleMs",
    async (cycleMs) => {
      const form = { intent: "create", robotId: robotId(), name: uniqueName("Hex walk"), template: "tripod", cycleMs };
      const request = await postAs("owner", ids, "/gaits/new", new URLSearchParams(form).toString(), "application/x-www-form-urlencoded");
      const answer = await outcome(async () => act(newGait, request));
      expect(answer.status, refusalText(answer.body)).toBe(422);
      expect(refusalText(answer.body)).toMatch(/cycle/i);
    },
  );

  test("POST /gaits/new still takes 1200, 1200.5, 1.2e3 and -40 where they fit", async () => {
    const form = { intent: "create", robotId: robotId(), name: uniqueName("Decimal walk"), template: "tripod", cycleMs: "1.2e3", strideMm: "-40", fps: "50" };
    const request = await postAs("owner", ids, "/gaits/new", new URLSearchParams(form).toString(), "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(newGait, request));
    expect(answer.status, refusalText(answer.body)).toBe(302);
  });

  test.each(["0x1", "0b1", " 1", "1.0"])("POST /gaits/:gaitId/edit refuses baseRevision=%j with 400 naming it", async (baseRevision) => {
    const gaitId = ids.gaitIds["Tripod cruise"];
    const request = await postAs(
      "owner",
      ids,
      `/gaits/${gaitId}/edit`,
      new URLSearchParams({ intent: "move-to-newest-robot", baseRevision }).toString(),
      "application/x-www-form-urlencoded",
    );
    const answer = await outcome(async () => act(editor, request, { gaitId }));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toContain("baseRevision");
  });

  test.each(["0x10", "0b110010", " 1.5"])("POST /export/calibration/:robotId refuses a trim of %j with 422 naming the joint's field", async (trim) => {
    const form = { intent: "create", name: uniqueName("Hex unit"), "joints.LF.coxa.trimDeg": trim };
    const request = await postAs("owner", ids, `/export/calibration/${robotId()}`, new URLSearchParams(form).toString(), "application/x-www-form-urlencoded");
    const answer = await outcome<{ details?: { issues?: { path: string }[] } }>(async () => act(calibration, request, { robotId: robotId() }));
    expect(answer.status, refusalText(answer.body)).toBe(422);
    expect(answer.body.details?.issues?.map((issue) => issue.path)).toContain("joints.LF.coxa.trimDeg");
  });
});

// JSON can carry U+0000 as the escape \u0000, which no form reader sees;
// PostgreSQL's jsonb refuses it, so the JSON is checked once parsed.
describe("a NUL character escaped in the JSON a form carries is refused with 400 naming where it is", () => {
  const robotId = () => ids.robotIds["Pier crawler"];
  const definition = () => JSON.stringify({ ...demoRobotJson("pier-crawler"), name: "Pier\u0000crawler" });

  test("POST /robots/:robotId (save) with a definition whose name holds it", async () => {
    const form = { intent: "save", baseRevision: "1", definition: definition(), message: "Renamed" };
    const request = await postAs("owner", ids, `/robots/${robotId()}`, new URLSearchParams(form).toString(), "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(robotPage, request, { robotId: robotId() }));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toMatch(/NUL/);
    expect(refusalText(answer.body)).toContain("name");
  });

  test("POST /robots (upload) with a file whose name holds it", async () => {
    const form = new FormData();
    form.append("intent", "upload");
    form.append("file", new File([definition()], "robot.json", { type: "application/json" }));
    const request = await postAs("owner", ids, "/robots", form, null);
    const answer = await outcome(async () => act(robotList, request));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toMatch(/NUL/);
    expect(refusalText(answer.body)).toContain("name");
  });

  test("POST /export/calibration/:robotId (import) with pasted JSON whose name holds it", async () => {
    const form = { intent: "import", json: JSON.stringify({ name: "Unit\u00007", joints: {} }) };
    const request = await postAs("owner", ids, `/export/calibration/${robotId()}`, new URLSearchParams(form).toString(), "application/x-www-form-urlencoded");
    const answer = await outcome(async () => act(calibration, request, { robotId: robotId() }));
    expect(answer.status, refusalText(answer.body)).toBe(400);
    expect(refusalText(answer.body)).toMatch(/NUL/);
    expect(refusalText(answer.body)).toContain("name");
  });
});
