// The physical bounds of a robot definition: every number has a range, wide
// enough for four- to eight-legged walkers from tabletop size to large
// machines (links up to 2 000 mm), and the parse refuses anything outside it
// — 1e7 mm, 1e300, Infinity, NaN — with the field's path and a sentence. The
// JSON Schema published from the same zod schema says every range.
import { describe, expect, it } from "vitest";
import { formatPath, parseRobot, robotJsonSchema, type DefinitionIssue } from "../../app/kinematics";
import { isBounded, numberSchemas, numericLeaves, withLeaf } from "../support/numbers";
import { DEMO_ROBOT_FILES, demoRobotJson } from "../support/robots";

/** The issues with what is wrong after the field's name (the robot test holds the names): `{ path, message: "must be at most 2000 (got …)" }`. */
function issuesOf(json: unknown): DefinitionIssue[] {
  const parsed = parseRobot(json);
  if (parsed.ok) return [];
  return parsed.issues.map(({ path, field, message }) => {
    if (!field || !message.startsWith(`${field} `)) throw new Error(`the message of ${path} does not start with its field's name: ${message}`);
    return { path, message: message.slice(field.length + 1) };
  });
}

const pier = demoRobotJson("pier-crawler");
// Every number of the demo hexapod, from body.massKg to the last servo's maxUs and the rest pose.
const leaves = numericLeaves(pier);

describe("every number of a robot is bounded (JSON Schema draft 2020-12 minimum/maximum)", () => {
  it("the demo robots lie inside every bound", () => {
    for (const file of DEMO_ROBOT_FILES) expect(issuesOf(demoRobotJson(file)), file).toEqual([]);
  });

  it("every number schema of robot.json has a lower and an upper bound", () => {
    const found = numberSchemas(robotJsonSchema());
    expect(found.length).toBeGreaterThan(20);
    expect(found.filter(({ schema }) => !isBounded(schema)).map(({ pointer }) => pointer)).toEqual([]);
  });

  it("the link lengths: 1 to 2 000 mm, with the unit and the range in the description", () => {
    const schema = robotJsonSchema() as { properties: { legs: { items: { properties: Record<string, Record<string, unknown>> } } } };
    const leg = schema.properties.legs.items.properties;
    for (const link of ["coxa", "femur", "tibia"]) {
      expect(leg[link], link).toMatchObject({ type: "number", minimum: 1, maximum: 2000 });
      expect(leg[link].description, link).toMatch(/mm.*1.*2 ?000/);
    }
  });
});

describe("the parse refuses values no robot has, at the field's path, with a sentence", () => {
  it("the probe's robot: femur and tibia of 1e7 mm", () => {
    const robot = structuredClone(pier);
    for (const leg of robot.legs) [leg.femur, leg.tibia] = [1e7, 1e7];
    const issues = issuesOf(robot);
    expect(issues).toContainEqual({ path: "legs[0].femur", message: "must be at most 2000 (got 10000000)" });
    expect(issues).toContainEqual({ path: "legs[5].tibia", message: "must be at most 2000 (got 10000000)" });
    expect(issues).toHaveLength(12);
  });

  it("1e300 mm links, and the rest of the examples", () => {
    expect(issuesOf(withLeaf(pier, ["legs", 0, "femur"], 1e300))).toEqual([{ path: "legs[0].femur", message: "must be at most 2000 (got 1e+300)" }]);
    expect(issuesOf(withLeaf(pier, ["standHeight"], 1e7))).toEqual([{ path: "standHeight", message: "must be at most 5000 (got 10000000)" }]);
    expect(issuesOf(withLeaf(pier, ["legs", 2, "mount", "x"], -1e7))).toEqual([{ path: "legs[2].mount.x", message: "must be at least -5000 (got -10000000)" }]);
    expect(issuesOf(withLeaf(pier, ["body", "com", 2], 1e7))).toEqual([{ path: "body.com[2]", message: "must be at most 5000 (got 10000000)" }]);
    expect(issuesOf(withLeaf(pier, ["body", "massKg"], 1e7))).toEqual([{ path: "body.massKg", message: "must be at most 10000 (got 10000000)" }]);
    expect(issuesOf(withLeaf(pier, ["legs", 1, "joints", "tibia", "maxSpeedDegS"], 1e7))).toEqual([
      { path: "legs[1].joints.tibia.maxSpeedDegS", message: "must be at most 36000 (got 10000000)" },
    ]);
    expect(issuesOf(withLeaf(pier, ["legs", 1, "joints", "tibia", "servo", "usPerDeg"], 1e7))).toEqual([
      { path: "legs[1].joints.tibia.servo.usPerDeg", message: "must be at most 100 (got 10000000)" },
    ]);
  });

  it("JSON's way of writing Infinity (1e999 parses to Infinity) and NaN-like values", () => {
    const text = JSON.stringify(pier).replace('"femur":60', '"femur":1e999');
    expect(JSON.parse(text).legs[0].femur).toBe(Number.POSITIVE_INFINITY);
    expect(issuesOf(JSON.parse(text))).toEqual([{ path: "legs[0].femur", message: "must be a number (got Infinity)" }]);
    expect(issuesOf(withLeaf(pier, ["legs", 0, "tibia"], Number.NEGATIVE_INFINITY))).toEqual([
      { path: "legs[0].tibia", message: "must be a number (got -Infinity)" },
    ]);
    expect(issuesOf(withLeaf(pier, ["legs", 0, "tibia"], Number.NaN))).toEqual([{ path: "legs[0].tibia", message: "must be a number (got NaN)" }]);
    expect(issuesOf(withLeaf(pier, ["legs", 0, "tibia"], "NaN"))).toEqual([{ path: "legs[0].tibia", message: 'must be a number (got "NaN")' }]);
    expect(issuesOf(withLeaf(pier, ["legs", 0, "tibia"], null))).toEqual([{ path: "legs[0].tibia", message: "must be a number (got null)" }]);
  });

  // Each of the demo hexapod's numbers in turn (every field of the format, most of them many times).
  const hostile: [string, unknown, RegExp][] = [
    ["1e7", 1e7, /^must be (at most|below) -?[\d.]+ \(got 10000000\)$/],
    ["-1e7", -1e7, /^must be (at least|above) -?[\d.]+ \(got -10000000\)$/],
    ["1e300", 1e300, /^must be (at most|below) -?[\d.]+ \(got 1e\+300\)$/],
    ["Infinity", Number.POSITIVE_INFINITY, /^must be a (whole )?number \(got Infinity\)$/],
    ["NaN", Number.NaN, /^must be a (whole )?number \(got NaN\)$/],
  ];
  for (const [name, value, message] of hostile) {
    it(`${name} in any of the ${leaves.length} numbers of the demo hexapod`, () => {
      const missed: string[] = [];
      for (const leaf of leaves) {
        const path = formatPath(leaf.path);
        const issues = issuesOf(withLeaf(pier, leaf.path, value));
        if (!issues.some((issue) => issue.path === path && message.test(issue.message))) missed.push(`${path}: ${JSON.stringify(issues)}`);
      }
      expect(missed).toEqual([]);
    });
  }
});
