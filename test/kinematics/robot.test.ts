import { describe, expect, it } from "vitest";
import { JOINT_NAMES, legRow, legSide, parseRobot, robotJsonSchema, type Leg, type Robot } from "../../app/kinematics";
import { demoRobotJson, loadDemoRobots } from "../support/robots";

// A fresh, mutable copy of the six-legged demo robot's JSON.
const pierCrawler = () => demoRobotJson("pier-crawler");

function restOf(robot: Robot): NonNullable<Robot["rest"]> {
  if (!robot.rest) throw new Error("expected the demo robot to have a rest pose");
  return robot.rest;
}

function issuesOf(json: unknown) {
  const parsed = parseRobot(json);
  if (parsed.ok) throw new Error("expected the definition to be refused, it parsed");
  return parsed.issues;
}

describe("parseRobot: every problem as { path, field, message }, the message in the words of the robot form", () => {
  it("accepts the demo robots", () => {
    for (const name of ["pier-crawler", "quay-walker", "hull-climber"] as const) {
      const parsed = parseRobot(demoRobotJson(name));
      expect(parsed.ok ? [] : parsed.issues, name).toEqual([]);
    }
  });

  // Breaks the robot type cannot express (a wrong type, a misspelt or missing field) go through
  // Object.assign and Reflect.deleteProperty, as a hand-edited file would carry them.
  // Each message starts with the field's name as the robot form labels it; the path stays beside it for programs.
  const issue = (path: string, field: string, problem: string) => ({ path, field, message: `${field} ${problem}` });
  const cases: [string, (robot: Robot) => unknown, { path: string; field: string; message: string }[]][] = [
    [
      "minDeg not below maxDeg",
      (r) => ((r.legs[2].joints.femur.minDeg = 40), (r.legs[2].joints.femur.maxDeg = 30), r),
      [issue("legs[2].joints.femur.minDeg", "Leg LR, femur minimum", "must be below the maximum (got 40 ≥ 30)")],
    ],
    ["too few legs", (r) => ((r.legs = r.legs.slice(0, 3)), delete r.rest, r), [issue("legs", "The robot's legs", "must number 4 to 8 (got 3)")]],
    ["a repeated leg id", (r) => ((r.legs[3].id = "LF"), delete r.rest, r), [issue("legs[3].id", "Leg 4, name", 'must be unique (got "LF", also leg 1)')]],
    [
      "a repeated servo channel",
      (r) => ((r.legs[1].joints.tibia.servo.channel = 0), r),
      [issue("legs[1].joints.tibia.servo.channel", "Leg LM, tibia servo channel", "must be unique across the robot (got 0, also used by the LF coxa)")],
    ],
    [
      "a rest pose for no leg",
      (r) => ((restOf(r).XX = { coxa: 0, femur: 0, tibia: 0 }), r),
      [issue("rest.XX", "Rest pose, leg XX", 'must name a leg (no leg "XX")')],
    ],
    ["a rest pose missing a leg", (r) => (delete restOf(r).LM, r), [issue("rest.LM", "Rest pose, leg LM", "is missing: the rest pose gives every leg")]],
    [
      "a rest angle outside the limits",
      (r) => ((restOf(r).LM.tibia = -120), r),
      [issue("rest.LM.tibia", "Rest pose, leg LM, tibia", "must lie within the joint limits -85..80 (got -120)")],
    ],
    ["a missing field", (r) => (Reflect.deleteProperty(r.legs[0], "femur"), r), [issue("legs[0].femur", "Leg LF, femur length", "is required")]],
    [
      "a number given as text",
      (r) => (Object.assign(r.legs[0], { coxa: "30" }), r),
      [issue("legs[0].coxa", "Leg LF, coxa length", 'must be a number (got "30")')],
    ],
    ["a zero link length", (r) => ((r.legs[0].tibia = 0), r), [issue("legs[0].tibia", "Leg LF, tibia length", "must be at least 1 (got 0)")]],
    [
      "a misspelt field",
      (r) => (Object.assign(r.legs[0].joints.coxa, { zeroOffset: 1 }), r),
      [issue("legs[0].joints.coxa.zeroOffset", 'Leg LF, coxa joint "zeroOffset"', "is not a known field (check the spelling)")],
    ],
    [
      "another format",
      (r) => (Object.assign(r, { format: "gaitloom.robot/2" }), r),
      [issue("format", "Format", 'must be "gaitloom.robot/1" (got "gaitloom.robot/2")')],
    ],
    [
      "an unknown side",
      (r) => (Object.assign(r.legs[0], { side: "up" }), r),
      [issue("legs[0].side", "Leg LF, side", 'must be one of "left", "right" (got "up")')],
    ],
    [
      "a centre pulse outside the range",
      (r) => ((r.legs[0].joints.coxa.servo.centerUs = 2600), r),
      [
        issue(
          "legs[0].joints.coxa.servo.centerUs",
          "Leg LF, coxa servo centre pulse",
          "must lie within the minimum and maximum pulse (got 2600 outside 500..2500)",
        ),
      ],
    ],
    [
      "minUs not below maxUs",
      (r) => ((r.legs[0].joints.coxa.servo.minUs = 2600), r),
      [issue("legs[0].joints.coxa.servo.minUs", "Leg LF, coxa servo minimum pulse", "must be below the maximum pulse (got 2600 ≥ 2500)")],
    ],
    [
      "a fractional channel",
      (r) => ((r.legs[0].joints.coxa.servo.channel = 1.5), r),
      [issue("legs[0].joints.coxa.servo.channel", "Leg LF, coxa servo channel", "must be a whole number (got 1.5)")],
    ],
    ["two legs in one row", (r) => ((r.legs[1].row = 0), r), [issue("legs[1].row", "Leg LM, row", "clashes with LF: both are row 0 on the left side")]],
    [
      "a mount yaw past a half turn",
      (r) => ((r.legs[0].mount.yawDeg = 200), r),
      [issue("legs[0].mount.yawDeg", "Leg LF, mount yaw", "must be at most 180 (got 200)")],
    ],
    ["a short centre of mass", (r) => (Object.assign(r.body, { com: [0, 0] }), r), [issue("body.com", "Centre of mass", "must have at least 3 items (got 2)")]],
    [
      "a centre of mass given as text",
      (r) => (Object.assign(r.body, { com: [0, "up", 0] }), r),
      [issue("body.com[1]", "Centre of mass y", 'must be a number (got "up")')],
    ],
    [
      "a leg without a usable id, named by its place",
      (r) => (Object.assign(r.legs[2], { id: "3rd", tibia: 0 }), delete r.rest, r),
      [
        issue("legs[2].id", "Leg 3, name", 'must start with a letter and hold only letters, digits and _, 16 at most (got "3rd")'),
        issue("legs[2].tibia", "Leg 3, tibia length", "must be at least 1 (got 0)"),
      ],
    ],
    ["not an object at all", () => "hello", [issue("", "The definition", 'must be an object (got "hello")')]],
  ];
  for (const [what, breakIt, expected] of cases) {
    it(`refuses ${what}`, () => {
      expect(issuesOf(breakIt(pierCrawler()))).toEqual(expected);
    });
  }

  it("reports several problems at once", () => {
    const robot = pierCrawler();
    robot.legs[0].coxa = -1;
    robot.legs[4].joints.femur.maxSpeedDegS = 0;
    expect(issuesOf(robot)).toEqual([
      { path: "legs[0].coxa", field: "Leg LF, coxa length", message: "Leg LF, coxa length must be at least 1 (got -1)" },
      { path: "legs[4].joints.femur.maxSpeedDegS", field: "Leg RM, femur maximum speed", message: "Leg RM, femur maximum speed must be at least 1 (got 0)" },
    ]);
  });
});

describe("leg side and row (DESIGN.md: y > 0 is left, rows by mount x from the front)", () => {
  it("derives them from the mounts", () => {
    const [pier, quay, hull] = loadDemoRobots();
    const seats = (robot: typeof pier) => Object.fromEntries(robot.legs.map((leg) => [leg.id, `${legSide(robot, leg)} ${legRow(robot, leg)}`]));
    expect(seats(pier)).toEqual({ LF: "left 0", LM: "left 1", LR: "left 2", RF: "right 0", RM: "right 1", RR: "right 2" });
    expect(seats(quay)).toEqual({ LF: "left 0", LR: "left 1", RF: "right 0", RR: "right 1" });
    expect(seats(hull)).toEqual({ L1: "left 0", L2: "left 1", L3: "left 2", L4: "left 3", R1: "right 0", R2: "right 1", R3: "right 2", R4: "right 3" });
  });

  it("takes side and row from the leg when it gives them", () => {
    const [pier] = loadDemoRobots();
    const leg: Leg = { ...pier.legs[0], side: "right", row: 3 };
    expect(legSide(pier, leg)).toBe("right");
    expect(legRow(pier, leg)).toBe(3);
  });

  it("names the joints coxa, femur, tibia in that order", () => {
    expect(JOINT_NAMES).toEqual(["coxa", "femur", "tibia"]);
  });
});

/** The JSON Schema (draft 2020-12) keywords zod emits that these tests read. */
type JsonSchema =
  | boolean
  | {
      $schema?: string;
      title?: string;
      type?: string;
      const?: unknown;
      enum?: unknown[];
      required?: string[];
      properties?: Record<string, JsonSchema>;
      additionalProperties?: JsonSchema;
      prefixItems?: JsonSchema[];
      items?: JsonSchema;
      exclusiveMinimum?: number;
      minimum?: number;
      maximum?: number;
    };

/** The schema of a property, and of its properties down the path; fails the test where one is missing. */
function subSchema(schema: Exclude<JsonSchema, boolean>, ...path: string[]): Exclude<JsonSchema, boolean> {
  let at = schema;
  for (const [index, key] of path.entries()) {
    const next = at.properties?.[key];
    if (typeof next !== "object") throw new Error(`the schema has no object schema at ${path.slice(0, index + 1).join(".")}`);
    at = next;
  }
  return at;
}

// A small JSON Schema (draft 2020-12) checker for the keywords zod emits; the
// schema is checked against the demo robots and a broken one.
function schemaProblems(schema: JsonSchema, value: unknown, path = ""): string[] {
  if (schema === false) return [`${path}: not allowed`];
  if (schema === true) return [];
  if (schema.const !== undefined && value !== schema.const) return [`${path}: not the constant`];
  if (schema.enum && !schema.enum.includes(value)) return [`${path}: not in the enum`];
  const type = schema.type;
  if (type === "object") {
    if (typeof value !== "object" || value === null || Array.isArray(value)) return [`${path}: not an object`];
    const record = value as Record<string, unknown>;
    const problems = (schema.required ?? []).filter((key) => !(key in record)).map((key) => `${path}.${key}: required`);
    for (const [key, item] of Object.entries(record)) {
      const itemSchema = schema.properties?.[key] ?? schema.additionalProperties;
      if (itemSchema === undefined) continue;
      problems.push(...schemaProblems(itemSchema, item, `${path}.${key}`));
    }
    return problems;
  }
  if (type === "array") {
    if (!Array.isArray(value)) return [`${path}: not an array`];
    const problems: string[] = [];
    value.forEach((item, index) => {
      const itemSchema = schema.prefixItems?.[index] ?? schema.items;
      if (itemSchema !== undefined) problems.push(...schemaProblems(itemSchema, item, `${path}[${index}]`));
    });
    return problems;
  }
  if (type === "number" || type === "integer") {
    if (typeof value !== "number") return [`${path}: not a number`];
    if (type === "integer" && !Number.isInteger(value)) return [`${path}: not an integer`];
    if (schema.exclusiveMinimum !== undefined && !(value > schema.exclusiveMinimum)) return [`${path}: too small`];
    if (schema.minimum !== undefined && value < schema.minimum) return [`${path}: too small`];
    if (schema.maximum !== undefined && value > schema.maximum) return [`${path}: too big`];
    return [];
  }
  if (type === "string") return typeof value === "string" ? [] : [`${path}: not a string`];
  if (type === "boolean") return typeof value === "boolean" ? [] : [`${path}: not a boolean`];
  return [];
}

describe("robotJsonSchema: the JSON Schema generated from the zod schema (JSON Schema draft 2020-12)", () => {
  // The generated document read as the keywords zod emits.
  const schema = robotJsonSchema() as Exclude<JsonSchema, boolean>;

  it("is a draft 2020-12 schema of our format, with the fixed field names", () => {
    expect(schema.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
    expect(schema.title).toBe("Gaitloom robot definition");
    expect(subSchema(schema, "format").const).toBe("gaitloom.robot/1");
    expect(schema.required).toEqual(["format", "name", "body", "standHeight", "legs"]);
    const leg = subSchema(schema, "legs").items;
    if (typeof leg !== "object") throw new Error("legs has no item schema");
    expect(leg.required).toEqual(["id", "mount", "coxa", "femur", "tibia", "joints"]);
    expect(Object.keys(subSchema(leg, "joints").properties ?? {})).toEqual(["coxa", "femur", "tibia"]);
    expect(Object.keys(subSchema(leg, "joints", "femur").properties ?? {})).toEqual(["minDeg", "maxDeg", "zeroOffsetDeg", "maxSpeedDegS", "servo"]);
    expect(Object.keys(subSchema(leg, "joints", "femur", "servo").properties ?? {})).toEqual(["channel", "reversed", "centerUs", "usPerDeg", "minUs", "maxUs"]);
    expect(leg.additionalProperties).toBe(false);
    expect(JSON.parse(JSON.stringify(schema))).toEqual(schema);
  });

  it("accepts the demo robots and refuses a misspelt field", () => {
    for (const name of ["pier-crawler", "quay-walker", "hull-climber"] as const) {
      expect(schemaProblems(schema, demoRobotJson(name)), name).toEqual([]);
    }
    const robot = pierCrawler();
    Object.assign(robot.legs[0].joints.coxa, { zeroOffset: 1 });
    expect(schemaProblems(schema, robot)).toEqual([".legs[0].joints.coxa.zeroOffset: not allowed"]);
  });
});
