// The cases: for a target (a route's loader, its action or one intent), a
// family of hostile requests and a seeded generator, one request exactly as
// it goes on the wire. Values are bytes, so a field can hold invalid UTF-8;
// a "verbatim" value goes into a URL or form body as written, so it can hold
// malformed percent-encoding.
import { can, type Action } from "../../app/platform/permissions";
import type { Answer, Body, LargeBody, Sent } from "./http";
import type { Random } from "./prng";
import type { Identity, Ids, World } from "./setup";
import type { Field, Target } from "./targets";

export type Case = {
  family: string;
  target: Target;
  identity: string;
  /** What is hostile about it, in a few words. */
  note: string;
  sent: Sent;
  /** What the answer must be, beyond no 5xx, where a case knows it. */
  expect?: Expectation;
};

export type Expectation = { what: string; holds: (answer: Answer) => boolean };

const pathOf = (location: string | null) => (location && URL.canParse(location, "http://app") ? new URL(location, "http://app").pathname : "");

/** A request whose session has ended is a signed-out one: 401, or a page's redirect to sign in. */
const SIGNED_OUT: Expectation = {
  what: "refused as signed out (401, or a redirect to /sign-in)",
  holds: (answer) => answer.status === 401 || (answer.status !== null && answer.status >= 300 && answer.status < 400 && pathOf(answer.location) === "/sign-in"),
};

const FORBIDDEN: Expectation = { what: "refused with 403", holds: (answer) => answer.status === 403 };

type Value = { bytes: Buffer; verbatim?: boolean; json?: string };

const text = (value: string): Value => ({ bytes: Buffer.from(value, "utf8") });
const raw = (...bytes: (number | string)[]): Value => ({
  bytes: Buffer.concat(bytes.map((b) => (typeof b === "string" ? Buffer.from(b, "latin1") : Buffer.from([b])))),
});
const verbatim = (value: string): Value => ({ bytes: Buffer.from(value, "latin1"), verbatim: true });
const jsonToken = (token: string, fallback: Value): Value => ({ ...fallback, json: token });

// ---------------------------------------------------------------------------
// Hostile values

const NUL_AND_BAD_UTF8: Value[] = [
  text("\u0000"),
  text("probe\u0000name"),
  text("\u0000".repeat(64)),
  raw(0xff),
  raw("a", 0xfe, 0xff, "b"),
  raw(0xc0, 0xaf), // an overlong "/"
  raw(0xed, 0xa0, 0x80), // a UTF-16 surrogate in UTF-8
  raw(0xe2, 0x82), // cut short
  raw(0xf8, 0x88, 0x80, 0x80, 0x80), // five bytes
  raw(0xf4, 0x90, 0x80, 0x80), // beyond U+10FFFF
  jsonToken('"\\ud800"', raw(0xed, 0xa0, 0x80)),
  jsonToken('"a\\u0000b"', text("a\u0000b")),
  text("\u0001\u001f\u007f\u0085\u2028\u2029"),
  text("\ufeffprobe"),
];

const NUMBERS = ["0x10", "0b110010", "0o17", " 7", "7 ", "\t7", "007", "1e3", "1E3", "-1", "-0", "+1", "1.5", "1.", ".5", "NaN", "Infinity", "-Infinity"]
  .concat([
    "9".repeat(400),
    "2147483648",
    "4294967296",
    "9007199254740993",
    "1e309",
    "-1e309",
    "1e-400",
    "0",
    "",
    "٣",
    "１",
    "7_000",
    "1,5",
    "0.0.1",
    "undefined",
    "null",
    "true",
    "[]",
    "{}",
  ])
  .map(text);

const BAD_IDS = [
  "not-a-uuid",
  "00000000-0000-0000-0000-000000000000",
  "ffffffff-ffff-ffff-ffff-ffffffffffff",
  "12345678-1234-1234-1234-1234567890ab-extra",
  "12345678-1234-1234-1234-1234567890a",
  "12345678123412341234123456789012",
  "{12345678-1234-1234-1234-1234567890ab}",
  "urn:uuid:12345678-1234-1234-1234-1234567890ab",
  "G2345678-1234-1234-1234-1234567890ab",
  " 12345678-1234-1234-1234-1234567890ab",
  "12345678-1234-1234-1234-1234567890AB",
  "1",
  "-1",
  "' OR '1'='1",
  "../../etc/passwd",
  "x".repeat(5000),
].map(text);

const TEXTS = [
  "",
  " ",
  "\r\n",
  "x".repeat(12_000),
  "<script>alert(1)</script>",
  "' OR 1=1 --",
  "${7*7}{{7*7}}",
  "%s%n%x",
  "../../../../etc/passwd",
  "\u202eevil\u202c",
  "🦀".repeat(500),
  "Ω≈ç√∫˜µ≤≥÷",
  "a\u0301\u0301\u0301\u0301",
  "__proto__",
  "constructor",
].map(text);

const MALFORMED_PERCENT = ["%", "%zz", "%E0%A4%A", "%%", "%u0041", "%00", "%FF", "%C0%AF", "%ED%A0%80", "a%2", "%0", "%%32%30", "%25%", "%F0%9F%A6"].map(
  verbatim,
);

/** Where a redirect after sign-in or a workspace switch may be told to go: none of these may leave the site. */
const RETURN_TOS: Value[] = [
  verbatim("%2F%09%2Fevil.example"),
  text("/\t/evil.example"),
  text("//evil"),
  text("//evil.example/path"),
  text("\\\\evil"),
  text("/\\evil.example"),
  text("https://evil"),
  text("https://evil.example/"),
  text("http:evil.example"),
  text("javascript:alert(1)"),
  text("/\r\nSet-Cookie: a=b"),
  text("/\r\nLocation: https://evil.example"),
  verbatim("%0d%0aLocation:%20https://evil.example"),
  text("/übersicht/日本"),
  text("/\u2028"),
  raw("/", 0xff, 0xfe),
  text("/" + "a".repeat(5000)),
  text("/./..//evil.example"),
  text("/%2F%2Fevil.example"),
  text("///evil.example"),
  text("/\u0000evil"),
];

const OTHER_ORIGINS = ["https://evil.example", "null", "http://127.0.0.1:1", "http://localhost", "https://127.0.0.1.evil.example", "http://127.0.0.1", ""];

// ---------------------------------------------------------------------------
// Encodings

const UNRESERVED = /[A-Za-z0-9\-_.~]/;

function percentEncode(value: Value): Buffer {
  if (value.verbatim) return value.bytes;
  let out = "";
  for (const byte of value.bytes) {
    const char = String.fromCharCode(byte);
    out += byte < 0x80 && UNRESERVED.test(char) ? char : `%${byte.toString(16).toUpperCase().padStart(2, "0")}`;
  }
  return Buffer.from(out, "latin1");
}

const formBody = (pairs: [string, Value][]) =>
  Buffer.from(pairs.map(([name, value]) => `${percentEncode(text(name)).toString("latin1")}=${percentEncode(value).toString("latin1")}`).join("&"), "latin1");

/** A JSON string of raw bytes: control characters escaped, everything else (invalid UTF-8 too) as it is. */
function jsonString(value: Value): Buffer {
  if (value.json) return Buffer.from(value.json, "utf8");
  const parts: Buffer[] = [Buffer.from('"')];
  for (const byte of value.bytes) {
    if (byte < 0x20 || byte === 0x22 || byte === 0x5c)
      parts.push(Buffer.from(byte === 0x22 ? '\\"' : byte === 0x5c ? "\\\\" : `\\u${byte.toString(16).padStart(4, "0")}`));
    else parts.push(Buffer.from([byte]));
  }
  parts.push(Buffer.from('"'));
  return Buffer.concat(parts);
}

/** JSON text of an object whose leaves may be Values (written as strings) or JSON text already made. */
class JsonText {
  constructor(readonly text: string) {}
}

function jsonBytes(data: unknown): Buffer {
  if (data instanceof JsonText) return Buffer.from(data.text, "utf8");
  if (data && typeof data === "object" && "bytes" in data && Buffer.isBuffer((data as Value).bytes)) return jsonString(data as Value);
  if (Array.isArray(data))
    return Buffer.concat([Buffer.from("["), ...data.flatMap((item, i) => (i ? [Buffer.from(","), jsonBytes(item)] : [jsonBytes(item)])), Buffer.from("]")]);
  if (data && typeof data === "object") {
    const entries = Object.entries(data);
    return Buffer.concat([
      Buffer.from("{"),
      ...entries.flatMap(([key, item], i) => [Buffer.from(i ? "," : ""), Buffer.from(JSON.stringify(key)), Buffer.from(":"), jsonBytes(item)]),
      Buffer.from("}"),
    ]);
  }
  return Buffer.from(JSON.stringify(data) ?? "null");
}

type Part = { name: string; value: Value; file?: { name: string; type: string } };

function multipartBody(parts: Part[], boundary: string): Buffer {
  const chunks: Buffer[] = [];
  for (const part of parts) {
    const disposition = `form-data; name="${part.name}"${part.file ? `; filename="${part.file.name}"` : ""}`;
    const type = part.file ? `\r\nContent-Type: ${part.file.type}` : "";
    chunks.push(Buffer.from(`--${boundary}\r\nContent-Disposition: ${disposition}${type}\r\n\r\n`, "latin1"), part.value.bytes, Buffer.from("\r\n"));
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  return Buffer.concat(chunks);
}

// ---------------------------------------------------------------------------
// Making a request for a target

export type Context = { world: World; random: Random; serial: () => number };

type Build = {
  identity: Identity;
  params?: Record<string, Value>;
  query?: [string, Value][];
  /** Form or JSON fields; a JSON target's body is an object of these. */
  fields?: [string, Value | JsonText | unknown][];
  /** A body as it is, instead of encoding the fields. */
  body?: Body;
  contentType?: string | null;
  method?: string;
  headers?: Record<string, string>;
  /** The framework's single-fetch address (`/robots.data`) instead of the page's. */
  dataUrl?: boolean;
  origin?: string | null;
};

const ownIds = (world: World, identity: Identity): Ids => (identity.as === "outsider" ? world.foreign : world.ids);
const otherIds = (world: World, identity: Identity): Ids => (identity.as === "outsider" ? world.ids : world.foreign);

function randomUuid(random: Random): string {
  const hex = () => random.int(16).toString(16);
  const group = (n: number) => Array.from({ length: n }, hex).join("");
  return `${group(8)}-${group(4)}-4${group(3)}-8${group(3)}-${group(12)}`;
}

/** A coherent set of valid path parameters for the pattern, from `ids`. */
function validParams(pattern: string, ids: Ids, random: Random): Record<string, string> {
  const params: Record<string, string> = {};
  const names = [...pattern.matchAll(/:([A-Za-z]+)/g)].map((match) => match[1]);
  if (names.includes("gaitId") && names.includes("number")) {
    const version = ids.versions.length ? random.pick(ids.versions) : null;
    params.gaitId = version?.gaitId ?? randomUuid(random);
    params.number = version ? (random.chance(0.15) ? "released" : String(version.number)) : "1";
  } else if (names.includes("robotId") && names.includes("number")) {
    const revision = ids.revisions.length ? random.pick(ids.revisions) : null;
    params.robotId = revision?.robotId ?? randomUuid(random);
    params.number = String(revision?.number ?? 1);
  }
  if (names.includes("robotId")) params.robotId ??= ids.robots.length ? random.pick(ids.robots) : randomUuid(random);
  if (names.includes("gaitId")) params.gaitId ??= ids.gaits.length ? random.pick(ids.gaits) : randomUuid(random);
  if (names.includes("token")) params.token = ids.invitationTokens.length && random.chance(0.5) ? random.pick(ids.invitationTokens) : `probe${random.int(1e9)}`;
  // Addresses no other route claims, so a request for the catch-all reaches its loader (whose handling other routes share is their own targets' concern).
  if (pattern.endsWith("*")) params["*"] = random.pick(["nowhere", "robotz/x/y/z", "a/b/c.txt", "no/such/page", "settingz"]);
  return params;
}

function fillPattern(pattern: string, params: Record<string, Value>): string {
  const path = pattern
    .split("/")
    .map((segment) => {
      if (segment === "*") return params["*"] ? params["*"].bytes.toString("latin1") : "nowhere";
      if (!segment.startsWith(":")) return segment;
      const value = params[segment.slice(1)];
      return value ? percentEncode(value).toString("latin1") : "x";
    })
    .join("/");
  return path || "/";
}

/** The framework's single-fetch address for a page path. */
const dataPath = (path: string) => (path === "/" ? "/_root.data" : `${path.replace(/\/$/, "")}.data`);

/** An identity that may do what the target needs (a session; a token for the API when the role may hold one). */
export function allowedIdentity(target: Target, world: World, random: Random): Identity {
  const legit = world.identities.filter((identity) => identity.as !== "hostile" && identity.as !== "signed-out");
  const needs = target.needs;
  const able = legit.filter((identity) => {
    if (!target.route.api && identity.authorization) return false;
    if (needs === "public" || needs === "signed-in") return true;
    if (identity.as === "outsider") return true; // the owner of their own workspace
    return can(identity.as as Exclude<Identity["as"], "outsider" | "signed-out" | "hostile">, needs as Action);
  });
  const demo = able.filter((identity) => identity.as !== "outsider");
  return random.pick(demo.length && random.chance(0.85) ? demo : able.length ? able : legit);
}

function anyIdentity(world: World, random: Random, hostileShare = 0.08): Identity {
  const hostile = world.identities.filter((identity) => identity.as === "hostile");
  const legit = world.identities.filter((identity) => identity.as !== "hostile");
  return random.chance(hostileShare) && hostile.length ? random.pick(hostile) : random.pick(legit);
}

/** A URDF of `legs` three-joint legs. */
function urdf(legs = 1, extra = ""): string {
  const parts = [`<?xml version="1.0"?>`, `<robot name="probe">${extra}`, `<link name="base"/>`];
  for (let leg = 0; leg < legs; leg++) {
    let parent = "base";
    for (const joint of ["coxa", "femur", "tibia"]) {
      const link = `leg${leg}_${joint}`;
      parts.push(
        `<link name="${link}"/>`,
        `<joint name="${link}_joint" type="revolute"><parent link="${parent}"/><child link="${link}"/><origin xyz="0.03 0 0" rpy="0 0 0"/><axis xyz="0 0 1"/><limit lower="-1" upper="1" effort="1" velocity="1"/></joint>`,
      );
      parent = link;
    }
  }
  parts.push("</robot>");
  return parts.join("\n");
}

/** A valid value for a field, from the identity's own workspace. */
function validValue(field: Field, target: Target, ids: Ids, params: Record<string, string>, context: Context): Value | JsonText | unknown {
  const { world, random } = context;
  const n = context.serial();
  const pickOr = (list: string[]) => (list.length ? random.pick(list) : randomUuid(random));
  const robotOfPath = params.robotId;
  const gaitOfPath = params.gaitId;
  switch (field.kind) {
    case "id":
      if (/^(robotId|robot)$/.test(field.name)) return text(pickOr(ids.robots));
      if (/^(gaitId|sourceGaitId|gait)$/.test(field.name)) return text(pickOr(ids.gaits));
      if (/^(versionId|compareWithId|a|b)$/.test(field.name)) {
        const versions = ids.versions.filter((version) => !gaitOfPath || version.gaitId === gaitOfPath);
        return text(pickOr(versions.map((version) => version.id)));
      }
      if (field.name === "profileId" || field.name === "edit")
        return text(pickOr(ids.profiles.filter((p) => !robotOfPath || p.robotId === robotOfPath).map((p) => p.id)));
      if (field.name === "reviewerId" || field.name === "author") return text(pickOr(ids.users));
      if (field.name === "workspaceId") return text(ids.workspace);
      if (field.name === "invitationId") return text(pickOr(ids.invitations));
      // Members' and tokens' ids: never a real one, so the probe removes, demotes and revokes no one.
      return text(randomUuid(random));
    case "number": {
      if (field.name === "baseRevision" && target.route.file.includes("calibration")) {
        return text(String(ids.profiles.find((profile) => profile.robotId === robotOfPath)?.revision ?? 1));
      }
      if (/draftRevision|baseRevision/.test(field.name) && gaitOfPath)
        return text(String(ids.drafts.find((draft) => draft.gaitId === gaitOfPath)?.revision ?? 0));
      if (field.name === "baseRevision" && robotOfPath)
        return text(String(Math.max(1, ...ids.revisions.filter((r) => r.robotId === robotOfPath).map((r) => r.number))));
      const defaults: Record<string, string> = {
        cycleMs: "1200",
        fps: "50",
        strideMm: "40",
        stepHeightMm: "25",
        bodyHeightMm: "80",
        dutyFactor: "0.5",
        rate: "50",
        speed: "0.25",
        dwell: "500",
        seconds: "2",
      };
      return text(defaults[field.name] ?? (/trimDeg/.test(field.name) ? "1.5" : random.pick(["0", "1", "2", "3"])));
    }
    case "email":
      return text(`probe-${n}@example.test`);
    case "role":
      return text(random.pick(["viewer", "animator", "firmware", "lead", "owner"]));
    case "returnTo":
      return text(random.pick(["/robots", "/gaits?robot=x", "/settings/members", "/"]));
    case "robot-json":
    case "robot-file":
      return target.body === "json"
        ? (world.definitions[pickOr(ids.robots)] ?? {})
        : text(JSON.stringify(world.definitions[robotOfPath ?? pickOr(ids.robots)] ?? {}));
    case "sequence-json": {
      const gait = gaitOfPath ?? pickOr(ids.gaits);
      return target.body === "json" ? (world.sequences[gait] ?? {}) : text(JSON.stringify(world.sequences[gait] ?? {}));
    }
    case "calibration-json":
      return text(JSON.stringify({ name: `probe import ${n}`, joints: {} }));
    case "urdf-file":
      return text(urdf(random.pick([4, 6])));
    case "robot-source":
      return text(random.chance(0.5) ? `starter-${random.pick([4, 6, 8])}` : `robot-${pickOr(ids.robots)}`);
    case "template":
    case "enum":
      return text(field.values?.length ? random.pick(field.values) : "x");
    case "text":
      if (field.name === "name") return text(`Probe ${n}`);
      return text(random.pick(["probe", "A short note.", `probe ${n}`]));
  }
}

const isValue = (value: unknown): value is Value => !!value && typeof value === "object" && "bytes" in value && Buffer.isBuffer((value as Value).bytes);

/** The solve, IK and draft APIs' JSON bodies: the fields as an object, valid where not given. */
function jsonFields(target: Target, ids: Ids, params: Record<string, string>, context: Context, given: Map<string, unknown>): Record<string, unknown> {
  const { world, random } = context;
  const body: Record<string, unknown> = {};
  const draft = ids.drafts.find((entry) => entry.gaitId === params.gaitId) ?? (ids.drafts.length ? random.pick(ids.drafts) : null);
  const robotId = draft?.robotId ?? (ids.robots.length ? random.pick(ids.robots) : "");
  const definition = world.definitions[robotId] as { legs?: { id: string; mount?: { x: number; y: number } }[] } | undefined;
  for (const field of target.fields) {
    if (given.has(field.name)) {
      body[field.name] = given.get(field.name);
      continue;
    }
    if (field.name === "robot") body.robot = definition ?? {};
    else if (field.name === "sequence") body.sequence = draft ? world.sequences[draft.gaitId] : {};
    else if (field.name === "baseRevision") body.baseRevision = draft?.revision ?? 0;
    else if (field.name === "feet") {
      body.feet = Object.fromEntries(
        (definition?.legs ?? []).map((leg) => [leg.id, [Math.round((leg.mount?.x ?? 0) * 1.6), Math.round((leg.mount?.y ?? 0) * 1.6), -90]]),
      );
    }
  }
  for (const [name, value] of given) if (!(name in body)) body[name] = value;
  return body;
}

export function build(target: Target, spec: Build, context: Context, family: string, note: string): Case {
  const { random } = context;
  let identity = spec.identity;
  // Signing out a session other callers go on using would sign them out too: such a request goes with the throwaway session.
  const cookie = identity.cookie;
  if (target.endsSession && cookie && context.world.liveSessions.some((value) => cookie.includes(value))) {
    identity = { ...identity, name: `${identity.name}, with the throwaway session`, cookie: context.world.throwaway };
  }
  const ids = ownIds(context.world, identity);
  const validParamText = validParams(target.route.pattern, ids, random);
  const params: Record<string, Value> = Object.fromEntries(Object.entries(validParamText).map(([name, value]) => [name, text(value)]));
  Object.assign(params, spec.params ?? {});
  let path = fillPattern(target.route.pattern, params);
  if (spec.dataUrl) path = dataPath(path);
  const query: [string, Value][] = [...(spec.query ?? [])];
  if (target.route.index && target.kind === "action") query.unshift(["index", text("")]);
  const search = query
    .map(([name, value]) =>
      name === "index" && value.bytes.length === 0 ? "index" : `${percentEncode(text(name)).toString("latin1")}=${percentEncode(value).toString("latin1")}`,
    )
    .join("&");
  const fullPath = search ? `${path}?${search}` : path;

  const headers: Record<string, string> = {};
  if (identity.cookie) headers.Cookie = identity.cookie;
  if (identity.authorization) headers.Authorization = identity.authorization;
  Object.assign(headers, spec.headers ?? {});
  const method = spec.method ?? target.method;
  const mutation = !["GET", "HEAD", "OPTIONS"].includes(method);
  const origin = spec.origin === undefined ? context.world.origin.origin : spec.origin;
  if (mutation && origin !== null) headers.Origin = origin;

  let body: Body | undefined = spec.body;
  let contentType: string | null | undefined = spec.contentType;
  if (body === undefined && target.kind === "action" && mutation) {
    const given = new Map((spec.fields ?? []).map(([name, value]) => [name, value]));
    if (target.body === "json") {
      body = jsonBytes(jsonFields(target, ids, validParamText, context, given));
      contentType ??= "application/json";
    } else {
      const pairs: [string, unknown][] = [];
      if (target.intent !== undefined) pairs.push(["intent", given.has("intent") ? given.get("intent") : text(target.intent)]);
      for (const field of target.fields)
        pairs.push([field.name, given.has(field.name) ? given.get(field.name) : validValue(field, target, ids, validParamText, context)]);
      for (const [name, value] of given) if (!pairs.some(([known]) => known === name)) pairs.push([name, value]);
      const asValue = (value: unknown): Value => (isValue(value) ? value : value instanceof JsonText ? text(value.text) : text(JSON.stringify(value)));
      if (target.body === "multipart") {
        const boundary = `----probe${random.int(1e9)}`;
        const fileKinds = new Set(["robot-file", "urdf-file"]);
        const parts = pairs.map(([name, value]) => {
          const kind = target.fields.find((field) => field.name === name)?.kind;
          const file =
            kind && fileKinds.has(kind)
              ? { name: kind === "urdf-file" ? "probe.urdf" : "probe.json", type: kind === "urdf-file" ? "application/xml" : "application/json" }
              : undefined;
          return { name, value: asValue(value), file };
        });
        body = multipartBody(parts, boundary);
        contentType ??= `multipart/form-data; boundary=${boundary}`;
      } else {
        body = formBody(pairs.map(([name, value]) => [name, asValue(value)]));
        contentType ??= "application/x-www-form-urlencoded";
      }
    }
  }
  if (contentType) headers["Content-Type"] = contentType;
  return { family, target, identity: identity.name, note, sent: { method, path: fullPath, headers, body } };
}

// ---------------------------------------------------------------------------
// Families

export type Family = {
  name: string;
  /** How often it is drawn, against the others. */
  weight: number;
  applies(target: Target): boolean;
  make(target: Target, context: Context): Case;
};

const isAction = (target: Target) => target.kind === "action";
/** A family that applies to every action, sent as a caller allowed to reach it. */
const everyAction = (name: string, weight: number, make: (target: Target, context: Context & { identity: Identity }) => Case): Family => ({
  name,
  weight,
  applies: isAction,
  make: (target, context) => make(target, asAllowed(target, context)),
});
/** The context with an identity allowed to reach `target`: most families send as a caller who may. */
const asAllowed = (target: Target, context: Context) => ({ ...context, identity: allowedIdentity(target, context.world, context.random) });
const isLoader = (target: Target) => target.kind === "loader";
const fieldsOf = (target: Target, kinds: Field["kind"][]) => [...target.fields, ...target.query].filter((field) => kinds.includes(field.kind));
const hasParam = (target: Target) => /[:*]/.test(target.route.pattern);

/** A hostile value in one field, one query parameter or one path parameter of the target. */
function hostileSomewhere(target: Target, context: Context, family: string, values: Value[], kinds?: Field["kind"][]): Case {
  const { random, world } = context;
  const identity = random.chance(0.6) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
  const value = random.pick(values);
  const shown = value.bytes.length > 40 ? `${value.bytes.length} bytes` : JSON.stringify(value.bytes.toString("latin1"));
  const fields = kinds ? fieldsOf(target, kinds) : [...target.fields, ...target.query];
  const params = [...target.route.pattern.matchAll(/:([A-Za-z]+)/g)].map((match) => match[1]);
  const where = random.weighted<"field" | "param" | "unknown">([
    [fields.length ? 6 : 0, "field"],
    [params.length ? 3 : 0, "param"],
    [1, "unknown"],
  ]);
  if (where === "field") {
    const field = random.pick(fields);
    if (target.query.includes(field)) return build(target, { identity, query: [[field.name, value]] }, context, family, `?${field.name}=${shown}`);
    return build(target, { identity, fields: [[field.name, value]] }, context, family, `${field.name}=${shown}`);
  }
  if (where === "param") {
    const name = random.pick(params);
    return build(target, { identity, params: { [name]: value } }, context, family, `:${name}=${shown}`);
  }
  const name = random.pick(["intent", "x", "__proto__", "constructor", "a[b]", "returnTo"]);
  return isAction(target) && name === "intent" && target.intent
    ? build(target, { identity, fields: [["intent", value]] }, context, family, `intent=${shown}`)
    : isAction(target)
      ? build(target, { identity, fields: [[name, value]] }, context, family, `${name}=${shown}`)
      : build(target, { identity, query: [[name, value]] }, context, family, `?${name}=${shown}`);
}

function largeBody(target: Target, size: number, chunked: boolean, random: Random): { body: LargeBody; contentType: string } {
  if (target.body === "json")
    return { body: { prefix: Buffer.from('{"robot":{"name":"'), chunk: Buffer.alloc(64 * 1024, "a"), size, chunked }, contentType: "application/json" };
  if (target.body === "multipart" || random.chance(0.3)) {
    const boundary = "----probelarge";
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="intent"\r\n\r\n${target.intent ?? "x"}\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.json"\r\nContent-Type: application/json\r\n\r\n`;
    return {
      body: { prefix: Buffer.from(head), chunk: Buffer.alloc(64 * 1024, "a"), size, chunked },
      contentType: `multipart/form-data; boundary=${boundary}`,
    };
  }
  return {
    body: { prefix: Buffer.from(`intent=${target.intent ?? "x"}&name=`), chunk: Buffer.alloc(64 * 1024, "a"), size, chunked },
    contentType: "application/x-www-form-urlencoded",
  };
}

function deepJson(random: Random): { text: string; note: string } {
  const depth = random.pick([1_000, 10_000, 100_000]);
  switch (random.int(6)) {
    case 0:
      return { text: "[".repeat(depth) + "]".repeat(depth), note: `${depth} nested arrays` };
    case 1:
      return { text: '{"a":'.repeat(depth) + "1" + "}".repeat(depth), note: `${depth} nested objects` };
    case 2:
      return { text: `[${Array.from({ length: depth }, (_, i) => i).join(",")}]`, note: `an array of ${depth} numbers` };
    case 3:
      return { text: `{${Array.from({ length: Math.min(depth, 50_000) }, (_, i) => `"k${i}":${i}`).join(",")}}`, note: `${Math.min(depth, 50_000)} keys` };
    case 4:
      return { text: `{"robot":"${"x".repeat(depth * 10)}"}`, note: `a string of ${depth * 10} characters` };
    default:
      return {
        text: `{"robot":{"legs":[${Array.from({ length: Math.min(depth, 20_000) }, () => '{"id":"L"}').join(",")}]}}`,
        note: `${Math.min(depth, 20_000)} legs`,
      };
  }
}

const INVALID_JSON = [
  "{",
  "}",
  '{"robot":}',
  "[1,2",
  "nul",
  "tru",
  "{'robot':1}",
  '{"a":1,}',
  "[1,]",
  "NaN",
  '{"a":NaN}',
  '{"a":Infinity}',
  "// comment\n{}",
  '{"a":1} {"b":2}',
  "\ufeff{}",
  '{"a":"\\x41"}',
  '{"a":"\\u12"}',
  "\u0000{}",
  '{"a":01}',
  '{"a":1e}',
  "[".repeat(3) + "]",
  '"unterminated',
  "{}garbage",
];

/** Robot definitions whose numbers go beyond any physical robot. */
function hostileRobot(definition: unknown, random: Random): { robot: unknown; note: string } {
  const copy = JSON.parse(JSON.stringify(definition ?? {})) as { legs?: Record<string, unknown>[]; body?: Record<string, unknown>; standHeight?: unknown };
  const number = random.pick<unknown>([1e7, 1e300, -1e300, 1e-300, -1, 0, 5e-324, 1.7976931348623157e308, "NaN", "1e7", null, [], {}, true]);
  const legs = copy.legs ?? [];
  switch (random.int(7)) {
    case 0:
      for (const leg of legs) leg[random.pick(["coxa", "femur", "tibia"])] = number;
      return { robot: copy, note: `link lengths ${JSON.stringify(number)} mm` };
    case 1:
      for (const leg of legs) leg.mount = { ...(leg.mount as object), x: number, yawDeg: number };
      return { robot: copy, note: `mounts at ${JSON.stringify(number)}` };
    case 2:
      copy.body = { ...(copy.body ?? {}), massKg: number, com: [number, number, number] };
      return { robot: copy, note: `body mass and centre ${JSON.stringify(number)}` };
    case 3:
      copy.standHeight = number;
      return { robot: copy, note: `stand height ${JSON.stringify(number)}` };
    case 4: {
      const count = random.pick([0, 1, 100, 1000]);
      copy.legs = Array.from({ length: count }, (_, i) => ({ ...(legs[i % Math.max(1, legs.length)] ?? {}), id: `L${i}` }));
      return { robot: copy, note: `${count} legs` };
    }
    case 5:
      for (const leg of legs) {
        const joints = leg.joints as Record<string, Record<string, unknown>> | undefined;
        for (const joint of Object.values(joints ?? {})) {
          joint.minDeg = number;
          joint.maxDeg = typeof number === "number" ? -number : number;
          joint.servo = { ...(joint.servo as object), usPerDeg: number, centerUs: number };
        }
      }
      return { robot: copy, note: `joint limits and servo mapping ${JSON.stringify(number)}` };
    default:
      for (const leg of legs) leg.id = random.pick(["", "\u0000", "x".repeat(10_000), legs[0]?.id ?? "L"]);
      return { robot: copy, note: "leg ids empty, NUL, huge or repeated" };
  }
}

/** Sequences far beyond any gait: huge frame counts, rates and durations. */
function hostileSequence(sequence: unknown, random: Random): { sequence: unknown; note: string } {
  const copy = JSON.parse(JSON.stringify(sequence ?? {})) as Record<string, unknown>;
  const number = random.pick<unknown>([1e6, 1e9, 1e300, -1, 0, 1e-9, "NaN", null]);
  switch (random.int(4)) {
    case 0:
      copy.fps = number;
      return { sequence: copy, note: `fps ${JSON.stringify(number)}` };
    case 1:
      copy.cycleMs = number;
      return { sequence: copy, note: `cycleMs ${JSON.stringify(number)}` };
    case 2: {
      const keys = Array.isArray(copy.keys) ? (copy.keys as unknown[]) : [];
      const count = random.pick([10_000, 100_000]);
      copy.keys = Array.from({ length: count }, (_, i) => keys[i % Math.max(1, keys.length)] ?? {});
      return { sequence: copy, note: `${count} keys` };
    }
    default:
      copy.fps = 1000;
      copy.cycleMs = 600_000;
      return { sequence: copy, note: "fps 1000 over a 600 s cycle (600 000 frames)" };
  }
}

const URDFS: { text: string; note: string }[] = [
  {
    text: `<?xml version="1.0"?><!DOCTYPE robot [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;"><!ENTITY c "&b;&b;&b;&b;&b;&b;&b;&b;&b;&b;"><!ENTITY d "&c;&c;&c;&c;&c;&c;&c;&c;&c;&c;"><!ENTITY e "&d;&d;&d;&d;&d;&d;&d;&d;&d;&d;"><!ENTITY f "&e;&e;&e;&e;&e;&e;&e;&e;&e;&e;">]><robot name="&f;"><link name="&f;"/></robot>`,
    note: "nested entities (a billion laughs)",
  },
  {
    text: `<?xml version="1.0"?><!DOCTYPE robot [<!ENTITY x SYSTEM "file:///etc/passwd">]><robot name="x"><link name="&x;"/></robot>`,
    note: "an external entity (file)",
  },
  {
    text: `<?xml version="1.0"?><!DOCTYPE robot [<!ENTITY x SYSTEM "http://127.0.0.1:9/">]><robot name="x"><link name="&x;"/></robot>`,
    note: "an external entity (http)",
  },
  { text: `<?xml version="1.0"?><!DOCTYPE robot SYSTEM "http://127.0.0.1:9/robot.dtd"><robot name="x"/>`, note: "an external DTD" },
  { text: `<?xml version="1.0"?><!DOCTYPE robot [<!ELEMENT robot ANY>]>${urdf(4).replace(/^<\?xml[^>]*>/, "")}`, note: "a DOCTYPE before a valid robot" },
  { text: `<robot name="deep">${"<link>".repeat(50_000)}${"</link>".repeat(50_000)}</robot>`, note: "50 000 nested elements" },
  { text: `<robot name="wide">${'<link name="l"/>'.repeat(60_000)}</robot>`, note: "60 000 links" },
  { text: urdf(300), note: "300 legs" },
  { text: urdf(4).replaceAll('xyz="0.03 0 0"', 'xyz="1e300 1e300 -1e300"'), note: "joint origins at 1e300 m" },
  { text: urdf(4).replaceAll('lower="-1" upper="1"', 'lower="NaN" upper="Infinity"'), note: "NaN and infinite limits" },
  { text: urdf(4).replaceAll('xyz="0.03 0 0"', 'xyz="0x10 0b11 1e"'), note: "non-decimal origins" },
  {
    text: `<robot name="x"><link name="a"/><joint name="j" type="revolute"><parent link="a"/><child link="a"/></joint></robot>`,
    note: "a joint that is its own parent",
  },
  {
    text: `<robot name="x"><link name="a"/><link name="b"/><joint name="j1" type="revolute"><parent link="a"/><child link="b"/></joint><joint name="j2" type="revolute"><parent link="b"/><child link="a"/></joint></robot>`,
    note: "a cycle of joints",
  },
  { text: `<?xml version="1.0" encoding="UTF-16"?><robot name="x"/>`, note: "declared UTF-16" },
  {
    text: `<robot name="x"><![CDATA[${"]".repeat(1000)}]]><?pi data?><!-- ${"-".repeat(1000)} --></robot>`,
    note: "CDATA, a processing instruction, a long comment",
  },
  { text: `<robot name="\u0000"><link name="\u0000"/></robot>`, note: "NUL in names" },
  { text: `<html><body>not a robot</body></html>`, note: "not a robot" },
  { text: `<robot`, note: "cut short" },
  { text: `<robot name="x" xmlns:xi="http://www.w3.org/2001/XInclude"><xi:include href="file:///etc/passwd"/></robot>`, note: "an XInclude" },
];

const WRONG_METHODS = ["PUT", "PATCH", "DELETE", "OPTIONS", "HEAD", "TRACE", "POST", "GET", "PROPFIND"];

const UNKNOWN_API_PATHS = [
  "/api/v1/nope",
  "/api/v1/",
  "/api/v1",
  "/api/v2/robots",
  "/api/v1/robots/{robot}/nope",
  "/api/v1/robots/{robot}/revisions/1/extra",
  "/api/v1/gaits",
  "/api/v1/gaits/{gait}",
  "/api/v1/gaits/{gait}/versions/1",
  "/api/v1//robots",
  "/api/v1/ROBOTS",
  "/api/v1/robots/%2e%2e/%2e%2e/healthz",
  "/api/v1/../../etc/passwd",
  "/api/v1/%zz",
  "/api/v1/robots/%E0%A4%A",
  "/api/v1/schema/nope.json",
  "/api/v1/openapi.yaml",
];

const UNKNOWN_PAGE_PATHS = [
  "/nope",
  "/.env",
  "/%00",
  "/robots/%ff",
  "/robots/{robot}/nope",
  "/gaits/{gait}/versions/1/x",
  "/gaits/new/edit",
  "/settings/nope",
  "//evil.example",
  "/%2e%2e/%2e%2e/etc/passwd",
  "/api/v2/robots",
  "/" + "x".repeat(4000),
];

const CROSS_CONTENT_TYPES_FOR_FORMS = [
  {
    contentType: "application/json",
    body: (target: Target) => Buffer.from(JSON.stringify({ intent: target.intent ?? "x", name: "probe" })),
    note: "JSON to a form action",
  },
  { contentType: "text/plain", body: (target: Target) => Buffer.from(`intent=${target.intent ?? "x"}&name=probe`), note: "a form as text/plain" },
  { contentType: null, body: (target: Target) => Buffer.from(`intent=${target.intent ?? "x"}&name=probe`), note: "a form without a Content-Type" },
  {
    contentType: "multipart/form-data",
    body: () => Buffer.from('--x\r\nContent-Disposition: form-data; name="intent"\r\n\r\nx\r\n--x--\r\n'),
    note: "multipart without a boundary",
  },
  {
    contentType: "multipart/form-data; boundary=abc",
    body: () => Buffer.from('--xyz\r\nContent-Disposition: form-data; name="a"\r\n\r\nb\r\n--xyz--\r\n'),
    note: "multipart with the wrong boundary",
  },
  {
    contentType: "multipart/form-data; boundary=abc",
    body: () => Buffer.from('--abc\r\nContent-Disposition: form-data; name="a"\r\n\r\nnever closed'),
    note: "multipart cut short",
  },
  { contentType: "application/x-www-form-urlencoded; charset=utf-16", body: () => Buffer.from("intent=create", "utf16le"), note: "a UTF-16 form" },
  { contentType: "application/xml", body: () => Buffer.from("<intent>create</intent>"), note: "XML to a form action" },
  { contentType: "application/x-www-form-urlencoded", body: () => Buffer.from([0xff, 0xfe, 0x00, 0x3d, 0x26]), note: "binary bytes as a form" },
  { contentType: "application/x-www-form-urlencoded", body: () => Buffer.from("&&&==&=&a"), note: "a form of separators" },
  {
    contentType: "multipart/form-data; boundary=abc",
    body: () => Buffer.from(`${'--abc\r\nContent-Disposition: form-data; name="f"\r\n\r\nv\r\n'.repeat(2000)}--abc--\r\n`),
    note: "2000 multipart parts",
  },
  {
    contentType: "multipart/form-data; boundary=abc",
    body: () => Buffer.from(`--abc\r\nContent-Disposition: form-data; name="intent"; filename="${"x".repeat(8000)}"\r\n\r\nv\r\n--abc--\r\n`),
    note: "a file where a field belongs, with a long file name",
  },
];

const CROSS_CONTENT_TYPES_FOR_JSON = [
  { contentType: "application/x-www-form-urlencoded", body: () => Buffer.from("robot=x&sequence=y"), note: "a form to a JSON API" },
  {
    contentType: "multipart/form-data; boundary=abc",
    body: () => Buffer.from('--abc\r\nContent-Disposition: form-data; name="robot"\r\n\r\n{}\r\n--abc--\r\n'),
    note: "multipart to a JSON API",
  },
  { contentType: "text/plain", body: () => Buffer.from("{}"), note: "JSON as text/plain" },
  { contentType: null, body: () => Buffer.from("{}"), note: "JSON without a Content-Type" },
  { contentType: "application/json; charset=utf-16", body: () => Buffer.from('{"robot":{}}', "utf16le"), note: "UTF-16 JSON" },
  { contentType: "application/json", body: () => Buffer.from('\ufeff{"robot":{}}'), note: "JSON with a byte-order mark" },
  { contentType: "application/json", body: () => Buffer.from("null"), note: "null" },
  { contentType: "application/json", body: () => Buffer.from("[]"), note: "an array" },
  { contentType: "application/json", body: () => Buffer.from('"robot"'), note: "a string" },
  { contentType: "application/json", body: () => Buffer.from("12"), note: "a number" },
  {
    contentType: "application/json",
    body: () => Buffer.from('{"__proto__":{"polluted":1},"constructor":{"prototype":{"polluted":1}}}'),
    note: "__proto__ and constructor keys",
  },
];

const HOSTILE_HEADERS: { headers: (origin: URL) => Record<string, string>; note: string }[] = [
  { headers: () => ({ Cookie: `a=${"x".repeat(7000)}` }), note: "a 7 KB cookie" },
  { headers: () => ({ Cookie: Array.from({ length: 200 }, (_, i) => `c${i}=${i}`).join("; ") }), note: "200 cookies" },
  { headers: () => ({ Accept: "application/json" }), note: "Accept: application/json" },
  { headers: () => ({ Accept: "*/*;q=abc, text/html;q=-1" }), note: "a malformed Accept" },
  { headers: () => ({ "Accept-Encoding": "gzip;q=2, br, zstd, *;q=0, \u00ff" }), note: "a hostile Accept-Encoding" },
  { headers: () => ({ Range: "bytes=0-1,2-3,-5" }), note: "a Range" },
  { headers: () => ({ "If-None-Match": '"x", *, W/"", garbage' }), note: "a malformed If-None-Match" },
  { headers: () => ({ "If-None-Match": "*" }), note: "If-None-Match: *" },
  { headers: () => ({ "If-Modified-Since": "yesterday" }), note: "a malformed If-Modified-Since" },
  { headers: () => ({ "Content-Encoding": "gzip" }), note: "Content-Encoding: gzip on plain bytes" },
  { headers: () => ({ "X-Forwarded-Host": "evil.example", "X-Forwarded-Proto": "https", Forwarded: "host=evil.example" }), note: "forwarded to another host" },
  { headers: () => ({ Host: "evil.example" }), note: "Host: evil.example" },
  { headers: (origin) => ({ Host: `${origin.host}@evil.example` }), note: "a Host with credentials" },
  { headers: () => ({ Host: "[::1" }), note: "a malformed Host" },
  { headers: () => ({ "Cache-Control": "no-cache, max-age=-1, \u00ff" }), note: "a hostile Cache-Control" },
  { headers: () => ({ Authorization: "Bearer " + "A".repeat(6000) }), note: "a 6 KB bearer token" },
  { headers: () => ({ Authorization: "Bearer gl_\u00ff\u00fe" }), note: "a token of Latin-1 bytes" },
];

const roll = (target: Target) => target.fields.length + target.query.length > 0 || hasParam(target) || isAction(target);

/**
 * NUL or bytes that are not UTF-8 in each field, query parameter and path
 * parameter of the target once, as one allowed to use it: the pass that
 * reaches every field, before the families draw at random.
 */
export function everyField(target: Target, context: Context): Case[] {
  const { random, world } = context;
  const family = "NUL and invalid UTF-8";
  const params = [...target.route.pattern.matchAll(/:([A-Za-z]+)/g)].map((match) => match[1]);
  const cases: Case[] = [];
  for (const field of [...target.fields, ...target.query]) {
    const value = random.pick(NUL_AND_BAD_UTF8);
    const identity = allowedIdentity(target, world, random);
    const shown = value.bytes.length > 40 ? `${value.bytes.length} bytes` : JSON.stringify(value.bytes.toString("latin1"));
    cases.push(
      target.query.includes(field)
        ? build(target, { identity, query: [[field.name, value]] }, context, family, `?${field.name}=${shown}`)
        : build(target, { identity, fields: [[field.name, value]] }, context, family, `${field.name}=${shown}`),
    );
  }
  for (const name of params) {
    const value = random.pick(NUL_AND_BAD_UTF8);
    const shown = JSON.stringify(value.bytes.toString("latin1"));
    cases.push(build(target, { identity: allowedIdentity(target, world, random), params: { [name]: value } }, context, family, `:${name}=${shown}`));
  }
  return cases;
}

export const FAMILIES: Family[] = [
  {
    name: "well-formed",
    weight: 6,
    applies: () => true,
    make(target, context) {
      const { random, world } = context;
      const identity = random.chance(0.7) ? allowedIdentity(target, world, random) : anyIdentity(world, random, 0);
      const ids = ownIds(world, identity);
      const query: [string, Value][] = target.query
        .filter(() => random.chance(0.4))
        .map((field) => [field.name, validValue(field, target, ids, {}, context) as Value]);
      return build(target, { identity, query }, context, "well-formed", "as its own pages or clients send it");
    },
  },
  {
    name: "credentials",
    weight: 5,
    applies: () => true,
    make(target, context) {
      const identity = context.random.pick(context.world.identities);
      return build(target, { identity }, context, "credentials", identity.name);
    },
  },
  {
    name: "cross-origin",
    weight: 4,
    applies: isAction,
    make(target, context) {
      const { random, world } = context;
      const sessions = world.identities.filter((identity) => identity.cookie && identity.as !== "hostile");
      const identity = random.pick(sessions);
      const origin = random.pick([...OTHER_ORIGINS, null]);
      const headers: Record<string, string> = random.chance(0.5) ? { Referer: "https://evil.example/page", "Sec-Fetch-Site": "cross-site" } : {};
      return build(target, { identity, origin, headers }, context, "cross-origin", origin === null ? "no Origin" : `Origin: ${origin || "(empty)"}`);
    },
  },
  everyAction("content-type", 5, (target, context) => {
    const { random, identity } = context;
    const choice = target.body === "json" ? random.pick(CROSS_CONTENT_TYPES_FOR_JSON) : random.pick(CROSS_CONTENT_TYPES_FOR_FORMS);
    return build(target, { identity, body: choice.body(target), contentType: choice.contentType }, context, "content-type", choice.note);
  }),
  everyAction("empty body", 3, (target, context) => {
    const { random, identity } = context;
    const choice = random.pick([
      { body: Buffer.alloc(0), contentType: target.body === "json" ? "application/json" : "application/x-www-form-urlencoded", note: "an empty body" },
      { body: Buffer.alloc(0), contentType: null, note: "no body and no Content-Type" },
      { body: Buffer.from(" \n\t"), contentType: target.body === "json" ? "application/json" : "application/x-www-form-urlencoded", note: "whitespace only" },
      { body: Buffer.from(`intent=${target.intent ?? ""}`), contentType: "application/x-www-form-urlencoded", note: "only the intent" },
      { body: Buffer.alloc(0), contentType: "multipart/form-data; boundary=abc", note: "an empty multipart body" },
    ]);
    return build(target, { identity, body: choice.body, contentType: choice.contentType }, context, "empty body", choice.note);
  }),
  everyAction("over the limit", 3, (target, context) => {
    const { random, identity } = context;
    const size = random.weighted([
      [5, 17 * 1024],
      [4, 70 * 1024],
      [3, 290 * 1024],
      [2, 1200 * 1024],
      [2, 2200 * 1024],
      [1, 9 * 1024 * 1024],
      [1, 17 * 1024 * 1024],
    ]);
    const chunked = random.chance(0.5);
    const { body, contentType } = largeBody(target, size, chunked, random);
    return build(target, { identity, body, contentType }, context, "over the limit", `${Math.round(size / 1024)} KB ${chunked ? "chunked" : "declared"}`);
  }),
  {
    name: "invalid JSON",
    weight: 3,
    applies: (target) => target.body === "json" || fieldsOf(target, ["robot-json", "sequence-json", "calibration-json"]).length > 0,
    make(target, context) {
      const { random, identity } = asAllowed(target, context);
      const bad = random.pick(INVALID_JSON);
      if (target.body === "json") return build(target, { identity, body: Buffer.from(bad) }, context, "invalid JSON", JSON.stringify(bad));
      const field = random.pick(fieldsOf(target, ["robot-json", "sequence-json", "calibration-json"]));
      return build(target, { identity, fields: [[field.name, text(bad)]] }, context, "invalid JSON", `${field.name}=${JSON.stringify(bad)}`);
    },
  },
  {
    name: "deep or huge JSON",
    weight: 3,
    applies: (target) => target.body === "json" || fieldsOf(target, ["robot-json", "sequence-json", "calibration-json", "robot-file"]).length > 0,
    make(target, context) {
      const { random, identity } = asAllowed(target, context);
      const { text: json, note } = deepJson(random);
      if (target.body === "json") {
        if (random.chance(0.5) || !target.fields.length) return build(target, { identity, body: Buffer.from(json) }, context, "deep or huge JSON", note);
        const field = random.pick(target.fields);
        return build(target, { identity, fields: [[field.name, new JsonText(json)]] }, context, "deep or huge JSON", `${field.name}: ${note}`);
      }
      const field = random.pick(fieldsOf(target, ["robot-json", "sequence-json", "calibration-json", "robot-file"]));
      return build(target, { identity, fields: [[field.name, text(json)]] }, context, "deep or huge JSON", `${field.name}: ${note}`);
    },
  },
  {
    name: "NUL and invalid UTF-8",
    weight: 7,
    applies: roll,
    make: (target, context) => hostileSomewhere(target, context, "NUL and invalid UTF-8", NUL_AND_BAD_UTF8),
  },
  {
    name: "numbers",
    weight: 6,
    applies: (target) => fieldsOf(target, ["number"]).length > 0 || /:number/.test(target.route.pattern),
    make(target, context) {
      if (/:number/.test(target.route.pattern) && context.random.chance(0.4)) {
        const value = context.random.pick(NUMBERS);
        const identity = allowedIdentity(target, context.world, context.random);
        return build(target, { identity, params: { number: value } }, context, "numbers", `:number=${JSON.stringify(value.bytes.toString())}`);
      }
      if (!fieldsOf(target, ["number"]).length) return hostileSomewhere(target, context, "numbers", NUMBERS);
      return hostileSomewhere(target, context, "numbers", NUMBERS, ["number"]);
    },
  },
  {
    name: "ids",
    weight: 6,
    applies: (target) => fieldsOf(target, ["id"]).length > 0 || /:(robotId|gaitId|token)/.test(target.route.pattern),
    make(target, context) {
      const { random, world } = context;
      const identity = random.chance(0.7) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
      const other = otherIds(world, identity);
      const foreignParams = validParams(target.route.pattern, other, random);
      const kind = random.weighted([
        [4, "bad"],
        [3, "unknown"],
        [4, "other workspace's"],
        [1, "another kind's"],
      ] as const);
      const mine = ownIds(world, identity);
      const valueFor = (name: string): Value => {
        if (kind === "bad") return random.pick(BAD_IDS);
        if (kind === "unknown") return text(randomUuid(random));
        if (kind === "another kind's") return text(random.pick([...mine.users, ...mine.robots, ...mine.gaits, mine.workspace]));
        if (name in foreignParams) return text(foreignParams[name]);
        const pools: Record<string, string[]> = {
          robotId: other.robots,
          robot: other.robots,
          gaitId: other.gaits,
          sourceGaitId: other.gaits,
          gait: other.gaits,
          versionId: other.versions.map((v) => v.id),
          compareWithId: other.versions.map((v) => v.id),
          a: other.versions.map((v) => v.id),
          b: other.versions.map((v) => v.id),
          profileId: other.profiles.map((p) => p.id),
          edit: other.profiles.map((p) => p.id),
          userId: other.users,
          reviewerId: other.users,
          author: other.users,
          invitationId: other.invitations,
          workspaceId: [other.workspace],
        };
        const pool = pools[name] ?? [];
        return text(pool.length ? random.pick(pool) : randomUuid(random));
      };
      const idFields = fieldsOf(target, ["id"]);
      const params = [...target.route.pattern.matchAll(/:(robotId|gaitId|token)/g)].map((match) => match[1]);
      if (params.length && (!idFields.length || random.chance(0.5))) {
        // The whole address from the other workspace, or one parameter changed.
        const changed: Record<string, Value> = {};
        if (kind === "other workspace's") for (const [name, value] of Object.entries(foreignParams)) changed[name] = text(value);
        else changed[random.pick(params)] = valueFor(random.pick(params));
        const note = Object.entries(changed)
          .map(([name, value]) => `:${name}=${value.bytes.length > 40 ? `${value.bytes.length} bytes` : value.bytes.toString()}`)
          .join(" ");
        return build(target, { identity, params: changed }, context, "ids", `${kind} ${note}`);
      }
      const field = random.pick(idFields);
      const value = valueFor(field.name);
      const shown = value.bytes.length > 40 ? `${value.bytes.length} bytes` : value.bytes.toString();
      if (target.query.includes(field)) return build(target, { identity, query: [[field.name, value]] }, context, "ids", `${kind} ?${field.name}=${shown}`);
      return build(target, { identity, fields: [[field.name, value]] }, context, "ids", `${kind} ${field.name}=${shown}`);
    },
  },
  {
    name: "percent-encoding",
    weight: 4,
    applies: roll,
    make: (target, context) => hostileSomewhere(target, context, "percent-encoding", MALFORMED_PERCENT),
  },
  {
    name: "odd text",
    weight: 3,
    applies: (target) => target.fields.length + target.query.length > 0,
    make: (target, context) => hostileSomewhere(target, context, "odd text", TEXTS),
  },
  {
    name: "query string",
    weight: 3,
    applies: isLoader,
    make(target, context) {
      const { random, world } = context;
      const identity = random.chance(0.6) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
      const known = target.query.length ? random.pick(target.query).name : "q";
      const choice = random.pick<{ query: [string, Value][]; note: string }>([
        { query: [["unknown", text("1")]], note: "an unknown parameter" },
        {
          query: [
            [known, text("1")],
            [known, text("2")],
          ],
          note: `${known} twice`,
        },
        { query: Array.from({ length: 1000 }, (_, i): [string, Value] => [`p${i}`, text(String(i))]), note: "1000 parameters" },
        { query: [[known, text("x".repeat(16_000))]], note: "a 16 KB parameter" },
        {
          query: [
            ["", text("")],
            ["", text("x")],
          ],
          note: "empty names",
        },
        {
          query: [
            ["__proto__[polluted]", text("1")],
            ["constructor[prototype][x]", text("1")],
          ],
          note: "prototype keys",
        },
        {
          query: [
            [`${known}[]`, text("1")],
            [`${known}[a]`, text("2")],
          ],
          note: "bracketed names",
        },
        { query: [[known, verbatim("a+b%20c%2")]], note: "a mix of + and bad escapes" },
        { query: [["_routes", text("routes/nope,root")]], note: "a _routes parameter" },
        { query: [["_data", text("routes/nope")]], note: "a _data parameter" },
        { query: [["index", text("")]], note: "?index" },
      ]);
      return build(target, { identity, query: choice.query }, context, "query string", choice.note);
    },
  },
  {
    name: "wrong method",
    weight: 3,
    applies: () => true,
    make(target, context) {
      const { random, world } = context;
      const method = random.pick(WRONG_METHODS.filter((candidate) => candidate !== target.method));
      const identity = random.chance(0.5) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
      const body = ["GET", "HEAD", "OPTIONS", "TRACE"].includes(method)
        ? undefined
        : Buffer.from(target.body === "json" ? "{}" : `intent=${target.intent ?? "x"}`);
      const contentType = body ? (target.body === "json" ? "application/json" : "application/x-www-form-urlencoded") : undefined;
      return build(target, { identity, method, body, contentType }, context, "wrong method", method);
    },
  },
  {
    name: "unknown path",
    weight: 2,
    applies: (target) => target.route.pattern.endsWith("*") && isLoader(target),
    make(target, context) {
      const { random, world } = context;
      const identity = random.chance(0.5) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
      const ids = ownIds(world, identity);
      const path = random
        .pick(target.route.api ? UNKNOWN_API_PATHS : UNKNOWN_PAGE_PATHS)
        .replace("{robot}", ids.robots[0] ?? "x")
        .replace("{gait}", ids.gaits[0] ?? "x");
      const method = random.pick(["GET", "GET", "POST", "PUT", "DELETE"]);
      const built = build(
        target,
        { identity, method, body: method === "GET" ? undefined : Buffer.from("{}"), contentType: method === "GET" ? undefined : "application/json" },
        context,
        "unknown path",
        `${method} ${path}`,
      );
      built.sent.path = path;
      return built;
    },
  },
  {
    name: "return address",
    weight: 4,
    applies: (target) => fieldsOf(target, ["returnTo"]).length > 0,
    make: (target, context) => hostileSomewhere(target, context, "return address", RETURN_TOS, ["returnTo"]),
  },
  {
    name: "URDF",
    weight: 3,
    applies: (target) => fieldsOf(target, ["urdf-file"]).length > 0,
    make(target, context) {
      const { random, identity } = asAllowed(target, context);
      const choice = random.pick(URDFS);
      return build(target, { identity, fields: [["file", text(choice.text)]] }, context, "URDF", choice.note);
    },
  },
  {
    name: "hostile robot",
    weight: 4,
    applies: (target) => fieldsOf(target, ["robot-json", "robot-file"]).length > 0,
    make(target, context) {
      const { random, world, identity } = asAllowed(target, context);
      const ids = ownIds(world, identity);
      const robotId = ids.robots.length ? random.pick(ids.robots) : "";
      const { robot, note } = hostileRobot(world.definitions[robotId], random);
      const field = random.pick(fieldsOf(target, ["robot-json", "robot-file"]));
      return build(target, { identity, fields: [[field.name, target.body === "json" ? robot : text(JSON.stringify(robot))]] }, context, "hostile robot", note);
    },
  },
  {
    name: "huge sequence",
    weight: 3,
    applies: (target) => fieldsOf(target, ["sequence-json"]).length > 0 || target.fields.some((field) => field.name === "cycleMs"),
    make(target, context) {
      const { random, world, identity } = asAllowed(target, context);
      if (!fieldsOf(target, ["sequence-json"]).length) {
        const fields: [string, Value][] = [
          ["cycleMs", text(random.pick(["600000", "1e9", "99999999999"]))],
          ["fps", text(random.pick(["1000", "1e6", "100000"]))],
        ];
        return build(target, { identity, fields }, context, "huge sequence", fields.map(([name, value]) => `${name}=${value.bytes}`).join(" "));
      }
      const ids = ownIds(world, identity);
      const gaitId = ids.gaits.length ? random.pick(ids.gaits) : "";
      const { sequence, note } = hostileSequence(world.sequences[gaitId], random);
      return build(
        target,
        { identity, fields: [["sequence", target.body === "json" ? sequence : text(JSON.stringify(sequence))]] },
        context,
        "huge sequence",
        note,
      );
    },
  },
  {
    name: "single fetch",
    weight: 3,
    applies: (target) => !target.route.api && !target.route.pattern.endsWith("*"),
    make(target, context) {
      const { random, world } = context;
      const identity = random.chance(0.7) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
      const query: [string, Value][] = random.chance(0.3) ? [["_routes", random.chance(0.5) ? text(target.route.id) : random.pick(MALFORMED_PERCENT)]] : [];
      return build(target, { identity, dataUrl: true, query }, context, "single fetch", "through the .data address");
    },
  },
  {
    name: "ended session",
    weight: 3,
    applies: (target) => target.needs !== "public",
    make(target, context) {
      const identity = context.random.pick(context.world.endedSessions);
      return { ...build(target, { identity }, context, "ended session", identity.name), expect: SIGNED_OUT };
    },
  },
  {
    name: "another's invitation",
    weight: 2,
    applies: (target) => target.acceptsInvitation,
    make(target, context) {
      const { random, world } = context;
      const callers = world.identities.filter((identity) => identity.cookie && !identity.authorization && identity.as !== "hostile");
      const identity = random.pick(callers);
      const invitation = world.foreignInvitation;
      if (!invitation) return build(target, { identity }, context, "another's invitation", "none set aside (the app shows no local inbox)");
      const spec = /:token/.test(target.route.pattern)
        ? { identity, params: { token: text(invitation.token) } }
        : { identity, fields: [["invitationId", text(invitation.id)] as [string, Value]] };
      return { ...build(target, spec, context, "another's invitation", `accepted as ${identity.name}`), expect: FORBIDDEN };
    },
  },
  {
    name: "headers",
    weight: 3,
    applies: () => true,
    make(target, context) {
      const { random, world } = context;
      const identity = random.chance(0.6) ? allowedIdentity(target, world, random) : anyIdentity(world, random);
      const choice = random.pick(HOSTILE_HEADERS);
      return build(target, { identity, headers: choice.headers(world.origin) }, context, "headers", choice.note);
    },
  },
];
