// GET /api/v1/gaits/:gaitId/versions/:number/table against the seeded demo:
// formats, units, a rate that re-solves, `released`, ETag and 304, file names,
// the override rule, calibration profiles, refusals, and the audit log.
import { beforeAll, beforeEach, describe, expect, test } from "vitest";
import Papa from "papaparse";
import { seedDemo } from "../../../db/seed";
import { uniqueName } from "../../support/names";
import { bearer, demoIds, requestsAs, type ApiRefusal, type DemoIds } from "../../support/routes";
import type { JsonTable } from "../../support/tables";
import { EXPORTER_VERSION, TABLE_MEDIA_TYPES, buildAngleTable } from "~/export";
import { solveSequence } from "~/gait";
import { createProfile, updateProfile } from "~/features/robots/calibration.server";
import { database } from "~/platform/db.server";
import { resetRateLimits } from "~/platform/rate-limit.server";
import { SOLVER_VERSION } from "~/gait";
import { auditEntries, foreignOwnerToken, getTable, sha256, storedVersion, tablePath, tokenFor } from "./support";

let ids: DemoIds;
let token: string;
let tripod: string;
let crawl: string;
let waveCreep: string;

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  token = await tokenFor(ids.workspaceId, ids.userIds.firmware);
  tripod = ids.gaitIds["Tripod cruise"];
  crawl = ids.gaitIds["Crawl"];
  waveCreep = ids.gaitIds["Wave creep"];
});
beforeEach(() => resetRateLimits());

const get = <Answer = unknown>(gaitId: string, number: string | number, query = "", headers: Record<string, string> = {}) =>
  getTable<Answer>(bearer(tablePath(gaitId, number, query), token, headers), gaitId, number);

/** The pure exporter's bytes for a stored version: what the route must answer. */
async function expectedTable(
  gaitId: string,
  number: number,
  options: { format: "csv" | "json" | "c"; units: "deg" | "rad" | "us"; rateHz?: number; overrideReason?: string },
) {
  const version = await storedVersion(gaitId, number);
  return buildAngleTable(version.robot, version.sequence, {
    ...options,
    meta: {
      robotName: version.robotName,
      robotRevision: version.robotRevision,
      gaitName: version.gaitName,
      gaitVersion: number,
      contentHash: version.contentHash,
      solverVersion: SOLVER_VERSION,
      exporterVersion: EXPORTER_VERSION,
    },
  });
}

describe("formats and units", () => {
  test.each([
    ["csv", "deg", "tripod_cruise_v1_deg10_50hz_no-profile.csv"],
    ["json", "rad", "tripod_cruise_v1_rad10000_50hz_no-profile.json"],
    ["c", "us", "tripod_cruise_v1_us_50hz_no-profile.h"],
  ] as const)("%s in %s: the exporter's bytes, its media type and file name", async (format, units, fileName) => {
    const answer = await get(tripod, 1, `format=${format}&units=${units}`);
    expect(answer.status).toBe(200);
    expect(answer.headers.get("Content-Type")).toBe(TABLE_MEDIA_TYPES[format]);
    expect(answer.headers.get("Content-Disposition")).toBe(`attachment; filename="${fileName}"`);
    expect(answer.text).toBe(await expectedTable(tripod, 1, { format, units }));
    expect(answer.headers.get("Repr-Digest")).toBe(`sha-256=:${Buffer.from(sha256(answer.text), "hex").toString("base64")}:`);
    expect(answer.headers.get("Gaitloom-Gait")).toMatch(/^Tripod cruise; version=1; content-hash=[0-9a-f]{64}$/);
  });

  test("the defaults are CSV in degrees at the sequence's own rate", async () => {
    const answer = await get(tripod, 1);
    expect(answer.headers.get("Content-Disposition")).toBe('attachment; filename="tripod_cruise_v1_deg10_50hz_no-profile.csv"');
    const rows = Papa.parse<string[]>(answer.text.trim(), { skipEmptyLines: true, comments: "#" }).data;
    expect(rows[0].slice(0, 3)).toEqual(["frame", "time_ms", rows[0][2]]);
    expect(rows.length - 1, "frames: round(1200 ms × 50 Hz / 1000)").toBe(60);
  });

  test("the JSON table names the robot revision, version, hash, solver and exporter", async () => {
    const answer = await get<JsonTable>(tripod, 1, "format=json");
    const version = await storedVersion(tripod, 1);
    expect(answer.body.meta).toMatchObject({
      exporterVersion: EXPORTER_VERSION,
      solverVersion: SOLVER_VERSION,
      robot: { name: "Pier crawler", revision: 1 },
      gait: { name: "Tripod cruise", version: 1, contentHash: version.contentHash, loop: true },
      units: "deg",
      rateHz: 50,
      frameCount: 60,
      calibrationProfile: null,
      overrideReason: null,
      exportedAt: null,
    });
  });

  test("pulse widths lie inside each servo's minUs..maxUs", async () => {
    const answer = await get<JsonTable>(tripod, 1, "format=json&units=us");
    for (const frame of answer.body.frames) {
      frame.values.forEach((us, column) => {
        const channel = answer.body.channels[column];
        expect(us, `${channel.name} frame ${frame.index}`).toBeGreaterThanOrEqual(channel.minUs);
        expect(us, `${channel.name} frame ${frame.index}`).toBeLessThanOrEqual(channel.maxUs);
      });
    }
  });
});

describe("another rate solves the sequence again", () => {
  test("rate=20: round(1200 × 20 / 1000) = 24 frames, each a fresh solve at 20 Hz (not resampled from 50 Hz)", async () => {
    const answer = await get<JsonTable>(tripod, 1, "format=json&rate=20");
    expect(answer.status).toBe(200);
    expect(answer.headers.get("Content-Disposition")).toBe('attachment; filename="tripod_cruise_v1_deg10_20hz_no-profile.json"');
    expect(answer.body.meta.rateHz).toBe(20);
    expect(answer.body.meta.frameCount).toBe(24);
    expect(answer.text).toBe(await expectedTable(tripod, 1, { format: "json", units: "deg", rateHz: 20 }));
    // Frame 5 at 20 Hz is t = 250 ms: the solve at 20 Hz, rounded to 0.1°, whatever the 50 Hz frames around it hold.
    const version = await storedVersion(tripod, 1);
    const solved = solveSequence(version.robot, version.sequence, { fps: 20 });
    const firstChannel = answer.body.channels[0];
    const expectedDeg = Math.round(solved.frames[5].legs[firstChannel.leg].angles[firstChannel.joint as "coxa" | "femur" | "tibia"] * 10) / 10;
    expect(answer.body.frames[5].timeMs).toBe(250);
    expect(answer.body.frames[5].values[0]).toBeCloseTo(expectedDeg, 6);
  });

  test("a rate giving too many frames, or none, is a 400 naming rate", async () => {
    for (const rate of ["0", "1000.5", "abc", "0.0001"]) {
      const answer = await get<ApiRefusal>(tripod, 1, `rate=${rate}`);
      expect(answer.status, rate).toBe(400);
      expect(answer.body.error.details?.parameter, rate).toBe("rate");
    }
  });
});

describe("released", () => {
  test("`released` answers the gait's released version (Tripod cruise v1), byte for byte the same as /1", async () => {
    const released = await get(tripod, "released", "format=c");
    const byNumber = await get(tripod, 1, "format=c");
    expect(released.status).toBe(200);
    expect(released.text).toBe(byNumber.text);
    expect(released.headers.get("ETag")).toBe(byNumber.headers.get("ETag"));
    expect(released.headers.get("Content-Disposition")).toBe('attachment; filename="tripod_cruise_v1_deg10_50hz_no-profile.h"');
  });

  test("a gait with no released version: 404 JSON that says so", async () => {
    const answer = await get<ApiRefusal>(waveCreep, "released");
    expect(answer.status).toBe(404);
    expect(answer.body.error).toEqual({ code: "not_found", message: 'Gait "Wave creep" has no released version yet.' });
  });

  test("a version that does not exist: 404", async () => {
    const answer = await get<ApiRefusal>(tripod, 99);
    expect(answer.status).toBe(404);
    expect(answer.body.error.message).toBe('Gait "Tripod cruise" has no version 99.');
  });
});

describe("ETag and If-None-Match", () => {
  test("the same request with the tag: 304, no body, no audit entry", async () => {
    const first = await get(tripod, 1, "format=json&units=us");
    const etag = first.headers.get("ETag")!;
    expect(etag).toMatch(/^"[0-9a-f]{40}"$/);
    const before = (await auditEntries("table.downloaded", 1))[0].id;
    const again = await get(tripod, 1, "format=json&units=us", { "If-None-Match": etag });
    expect(again.status).toBe(304);
    expect(again.text).toBe("");
    expect(again.headers.get("ETag")).toBe(etag);
    expect((await auditEntries("table.downloaded", 1))[0].id).toBe(before);
    // A weak form of the tag, or one in a list, matches too (RFC 9110 weak comparison).
    expect((await get(tripod, 1, "format=json&units=us", { "If-None-Match": `"other", W/${etag}` })).status).toBe(304);
  });

  test("every representation has its own tag: format, units, rate, version, override", async () => {
    const tags = await Promise.all(
      [
        [1, "format=csv&units=deg"],
        [1, "format=json&units=deg"],
        [1, "format=csv&units=rad"],
        [1, "format=csv&units=deg&rate=25"],
        [2, "format=csv&units=deg"],
        [1, "format=csv&units=deg&override=bench"],
      ].map(async ([number, query]) => (await get(tripod, number as number, query as string)).headers.get("ETag")),
    );
    expect(new Set(tags).size).toBe(tags.length);
    // `rate=` the sequence's own fps is the same representation as no rate.
    expect((await get(tripod, 1, "rate=50")).headers.get("ETag")).toBe(tags[0]);
  });

  test("a stale tag gets the full table", async () => {
    const answer = await get(tripod, 1, "", { "If-None-Match": '"0000"' });
    expect(answer.status).toBe(200);
    expect(answer.text.length).toBeGreaterThan(100);
  });
});

describe("error flags need an override reason", () => {
  test("Crawl v1 (com-outside errors) without override: 409 saying why and what to send", async () => {
    const answer = await get<ApiRefusal>(crawl, 1, "format=json");
    expect(answer.status).toBe(409);
    expect(answer.body.error.code).toBe("conflict");
    expect(answer.body.error.message).toMatch(/error flags .*com-outside/);
    expect(answer.body.error.message).toMatch(/`override` parameter/);
    expect(answer.body.error.details).toMatchObject({ parameter: "override", reason: "override-required", errorFlags: { "com-outside": 34 } });
  });

  test("with override: the reason is in the JSON meta, the C comment and the CSV's comment and headers", async () => {
    const reason = "Bench test on the stand: the support flags do not apply";
    const query = `override=${encodeURIComponent(reason)}`;
    const json = await get<JsonTable>(crawl, 1, `format=json&${query}`);
    expect(json.status).toBe(200);
    expect(json.body.meta.overrideReason).toBe(reason);
    expect(json.body.meta.flags.errors).toBe(34);
    const header = await get(crawl, 1, `format=c&${query}`);
    expect(header.text).toContain(reason);
    const csv = await get(crawl, 1, `format=csv&${query}`);
    expect(decodeURIComponent(csv.headers.get("Gaitloom-Override")!)).toBe(reason);
    expect(csv.text).toContain(`\r\n# Override: ${reason}\r\n`);
    expect(csv.headers.get("Gaitloom-Flags")).toBe("errors=34; warnings=66; clamped=0");
  });

  test("a blank override is a 400 naming override", async () => {
    const answer = await get<ApiRefusal>(crawl, 1, "override=%20%20");
    expect(answer.status).toBe(400);
    expect(answer.body.error.details?.parameter).toBe("override");
  });
});

describe("calibration profiles", () => {
  let robotId: string;
  let profileId: string;
  const name = uniqueName("SN-PC");
  beforeAll(async () => {
    robotId = ids.robotIds["Pier crawler"];
    const created = await createProfile({ userId: ids.userIds.firmware, workspaceId: ids.workspaceId }, robotId, {
      name,
      joints: { LF: { coxa: { trimDeg: 2.5 } } },
    });
    profileId = created.id;
  });

  test("the profile's trim is applied and its name and revision are in the header", async () => {
    const plain = await get<JsonTable>(tripod, 1, "format=json");
    const trimmed = await get<JsonTable>(tripod, 1, `format=json&profile=${encodeURIComponent(name)}`);
    expect(trimmed.status).toBe(200);
    expect(trimmed.body.meta.calibrationProfile).toBe(`${name} (revision 1)`);
    const column = trimmed.body.channels.findIndex((channel) => channel.name === "LF.coxa");
    expect(trimmed.body.channels[column].trimDeg).toBe(2.5);
    for (let frame = 0; frame < 60; frame += 1) {
      expect(trimmed.body.frames[frame].values[column], `frame ${frame}, LF.coxa in degrees`).toBeCloseTo(plain.body.frames[frame].values[column] + 2.5, 6);
    }
    expect(decodeURIComponent(trimmed.headers.get("Gaitloom-Calibration")!)).toBe(`${name} (revision 1)`);
  });

  test("issue 16: the CSV names its profile in its file name and its comment header; without one it says so", async () => {
    const csv = await get(tripod, 1, `format=csv&profile=${encodeURIComponent(name)}`);
    expect(csv.status).toBe(200);
    const stem = name.toLowerCase().replace(/[^a-z0-9]+/g, "_");
    expect(csv.headers.get("Content-Disposition")).toBe(`attachment; filename="tripod_cruise_v1_deg10_50hz_profile-${stem}_revision_1.csv"`);
    const comment = csv.text.split("\r\n").filter((line) => line.startsWith("# "));
    expect(comment).toContain(`# Calibration profile: ${name} (revision 1)`);
    expect(comment).toContain("# Robot: Pier crawler, revision 1");
    expect(comment.some((line) => line.startsWith("# Units: deg. Each joint column is the servo angle in degrees"))).toBe(true);
    const plain = await get(tripod, 1, "format=csv");
    expect(plain.headers.get("Content-Disposition")).toBe('attachment; filename="tripod_cruise_v1_deg10_50hz_no-profile.csv"');
    expect(plain.text).toContain("\r\n# Calibration profile: none (the robot's own servo settings)\r\n");
  });

  test("saving the profile again changes the tag (its revision is part of it)", async () => {
    const before = (await get(tripod, 1, `profile=${encodeURIComponent(name)}`)).headers.get("ETag");
    await updateProfile(
      { userId: ids.userIds.firmware, workspaceId: ids.workspaceId },
      robotId,
      profileId,
      { name, joints: { LF: { coxa: { trimDeg: 3 } } } },
      1,
    );
    const after = await get(tripod, 1, `profile=${encodeURIComponent(name)}`, { "If-None-Match": before! });
    expect(after.status).toBe(200);
    expect(after.headers.get("ETag")).not.toBe(before);
  });

  test("a profile the robot does not have: 422 naming profile and listing the ones there are", async () => {
    const answer = await get<ApiRefusal>(tripod, 1, "profile=SN-none");
    expect(answer.status).toBe(422);
    expect(answer.body.error.details?.parameter).toBe("profile");
    expect(answer.body.error.message).toContain(name);
  });
});

describe("query and path checks", () => {
  test.each([
    ["units=mm", "units", 'units must be one of deg, rad, us (got "mm").'],
    ["format=xlsx", "format", 'format must be one of csv, json, c (got "xlsx").'],
    ["unit=deg", "unit", "Unknown parameter unit (parameters: format, units, rate, profile, override)."],
    ["format=csv&format=json", "format", "The parameter format is given 2 times; give it once."],
  ])("%s: 400 naming %s", async (query, parameter, message) => {
    const answer = await get<ApiRefusal>(tripod, 1, query);
    expect(answer.status).toBe(400);
    expect(answer.body.error).toEqual({ code: "bad_request", message, details: { parameter } });
  });

  test("a malformed gait id or version number: 400", async () => {
    expect((await getTable(bearer("/api/v1/gaits/nope/versions/1/table", token), "nope", 1)).status).toBe(400);
    const zero = await getTable<ApiRefusal>(bearer(tablePath(tripod, 0), token), tripod, "0");
    expect(zero.status).toBe(400);
    expect(zero.body.error.message).toBe('the version must be a number from 1 or "released" (got "0")');
  });
});

describe("who may download", () => {
  test("no credentials, a bad token, a malformed header: 401", async () => {
    const request = await requestsAs("signed-out", ids);
    expect((await getTable(await request("GET", tablePath(tripod, 1)), tripod, 1)).status).toBe(401);
    expect((await getTable(bearer(tablePath(tripod, 1), "gl_not_a_token"), tripod, 1)).status).toBe(401);
    const malformed = new Request(`http://127.0.0.1:3000${tablePath(tripod, 1)}`, { headers: { Authorization: "Token abc" } });
    expect((await getTable(malformed, tripod, 1)).status).toBe(401);
  });

  test("another workspace's token: 404, as if the gait did not exist", async () => {
    const other = await foreignOwnerToken();
    const answer = await getTable<ApiRefusal>(bearer(tablePath(tripod, "released"), other), tripod, "released");
    expect(answer.status).toBe(404);
    expect(answer.body.error.code).toBe("not_found");
  });

  test("a viewer's session: 403", async () => {
    const request = await requestsAs("viewer", ids);
    const answer = await getTable<ApiRefusal>(await request("GET", tablePath(tripod, 1)), tripod, 1);
    expect(answer.status).toBe(403);
    expect(answer.body.error.message).toBe("The viewer role cannot download angle tables.");
  });

  test("an animator's session downloads; the bytes are the token's", async () => {
    const request = await requestsAs("animator", ids);
    const session = await getTable(await request("GET", tablePath(tripod, "released", "format=c")), tripod, "released");
    const withToken = await get(tripod, "released", "format=c");
    expect(session.status).toBe(200);
    expect(session.text).toBe(withToken.text);
  });
});

describe("the audit log", () => {
  test("a token download: who, which version, format, units, rate, profile, override, via token", async () => {
    const answer = await get(tripod, "released", "format=json&units=us&rate=25");
    const [entry] = await auditEntries("table.downloaded", 1);
    const version = await storedVersion(tripod, 1);
    expect(entry).toMatchObject({ workspaceId: ids.workspaceId, actorId: ids.userIds.firmware, targetType: "gait_version", targetId: version.id });
    expect(entry.details).toMatchObject({
      gaitId: tripod,
      gait: "Tripod cruise",
      number: 1,
      requested: "released",
      state: "released",
      format: "json",
      units: "us",
      rateHz: 25,
      profile: null,
      override: null,
      via: "token",
      sha256: sha256(answer.text),
    });
  });

  test("a session download says session", async () => {
    const request = await requestsAs("lead", ids);
    await getTable(await request("GET", tablePath(tripod, 2, "format=csv")), tripod, 2);
    const [entry] = await auditEntries("table.downloaded", 1);
    expect(entry.actorId).toBe(ids.userIds.lead);
    expect(entry.details).toMatchObject({ number: 2, requested: 2, via: "session", tokenId: null, format: "csv", units: "deg" });
  });

  test("a HEAD request answers the headers and is not recorded as a download", async () => {
    const before = (await auditEntries("table.downloaded", 1))[0].id;
    const head = new Request(`http://127.0.0.1:3000${tablePath(tripod, 1)}`, { method: "HEAD", headers: { Authorization: `Bearer ${token}` } });
    const answer = await getTable(head, tripod, 1);
    expect(answer.status).toBe(200);
    expect(answer.headers.get("Content-Disposition")).toBe('attachment; filename="tripod_cruise_v1_deg10_50hz_no-profile.csv"');
    expect((await auditEntries("table.downloaded", 1))[0].id).toBe(before);
  });

  test("a refused download writes nothing", async () => {
    const before = (await auditEntries("table.downloaded", 1))[0].id;
    await get(crawl, 1);
    await get(tripod, 1, "units=mm");
    expect((await auditEntries("table.downloaded", 1))[0].id).toBe(before);
  });
});
