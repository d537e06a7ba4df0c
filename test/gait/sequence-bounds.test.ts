// The physical bounds of a gait sequence (app/gait/sequence.ts): every number
// has a range, and the parse refuses anything outside it — 1e7, 1e300,
// Infinity, NaN — with the field's path and a sentence. generateGait's flat
// parameters take the same ranges, and sequence.json publishes them.
import { describe, expect, it } from "vitest";
import { GaitInputError, generateGait, parseSequence, sequenceJsonSchema } from "~/gait/index";
import type { SequenceInput } from "~/gait/sequence";
import { formatPath, type DefinitionIssue } from "~/kinematics/index";
import { isBounded, numberSchemas, numericLeaves, withLeaf } from "../support/numbers";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";

const robot = loadDemoRobot(DEMO_ROBOTS.six);

// A sequence with every field of the format: generator with duty factor and
// phases, leg keys with foot, ease and apex, body keys with every pose field.
const sequence: SequenceInput = JSON.parse(
  JSON.stringify(
    generateGait(robot, {
      template: "tripod",
      strideMm: 40,
      directionDeg: 10,
      turnDegPerCycle: 5,
      stepHeightMm: 25,
      bodyHeightMm: 85,
      bodyKeys: [
        { t: 0, pose: { x: 1, y: 2, z: -3, roll: 1, pitch: 2, yaw: 3 }, ease: [0.42, 0, 0.58, 1] },
        { t: 0.5, pose: { x: -1, y: -2, z: 3, roll: -1, pitch: -2, yaw: -3 } },
      ],
    }),
  ),
);
const leaves = numericLeaves(sequence);

function issuesOf(json: unknown): DefinitionIssue[] {
  const parsed = parseSequence(json);
  return parsed.ok ? [] : parsed.issues;
}

describe("every number of a sequence is bounded", () => {
  it("the fixture has every kind of number and parses", () => {
    expect(issuesOf(sequence)).toEqual([]);
    const fields = new Set(leaves.map(({ path }) => path.filter((key) => typeof key === "string" && !/^[LR][FMR]$/.test(key)).join(".")));
    expect([...fields].sort()).toEqual(
      [
        "cycleMs",
        "fps",
        "generator.dutyFactor",
        "generator.phase",
        "generator.strideMm",
        "generator.directionDeg",
        "generator.turnDegPerCycle",
        "generator.stepHeightMm",
        "generator.bodyHeightMm",
        "legs.keys.t",
        "legs.keys.foot",
        "legs.keys.ease",
        "legs.keys.apexMm",
        "body.keys.t",
        "body.keys.pose.x",
        "body.keys.pose.y",
        "body.keys.pose.z",
        "body.keys.pose.roll",
        "body.keys.pose.pitch",
        "body.keys.pose.yaw",
        "body.keys.ease",
      ].sort(),
    );
  });

  it("every number schema of sequence.json has a lower and an upper bound", () => {
    const found = numberSchemas(sequenceJsonSchema());
    expect(found.length).toBeGreaterThan(15);
    expect(found.filter(({ schema }) => !isBounded(schema)).map(({ pointer }) => pointer)).toEqual([]);
  });

  it("the ranges, as refusals", () => {
    const at = (path: (string | number)[], value: unknown) => issuesOf(withLeaf(sequence, path, value));
    expect(at(["generator", "strideMm"], 1e7)).toEqual([{ path: "generator.strideMm", message: "must be at most 10000 (got 10000000)" }]);
    expect(at(["generator", "directionDeg"], 1e7)).toEqual([{ path: "generator.directionDeg", message: "must be at most 360 (got 10000000)" }]);
    expect(at(["generator", "turnDegPerCycle"], -1e7)).toEqual([{ path: "generator.turnDegPerCycle", message: "must be at least -360 (got -10000000)" }]);
    expect(at(["generator", "bodyHeightMm"], 1e7)).toEqual([{ path: "generator.bodyHeightMm", message: "must be at most 5000 (got 10000000)" }]);
    expect(at(["legs", "LF", "keys", 0, "foot", 0], 1e7)).toEqual([{ path: "legs.LF.keys[0].foot[0]", message: "must be at most 20000 (got 10000000)" }]);
    expect(at(["legs", "LF", "keys", 0, "ease", 1], 1e7)).toEqual([{ path: "legs.LF.keys[0].ease[1]", message: "must be at most 10 (got 10000000)" }]);
    expect(at(["body", "keys", 1, "pose", "z"], -1e7)).toEqual([{ path: "body.keys[1].pose.z", message: "must be at least -5000 (got -10000000)" }]);
    expect(at(["body", "keys", 1, "pose", "roll"], 1e7)).toEqual([{ path: "body.keys[1].pose.roll", message: "must be at most 180 (got 10000000)" }]);
    expect(at(["fps"], 0.5)).toEqual([{ path: "fps", message: "must be at least 1 (got 0.5)" }]);
  });

  const hostile: [string, unknown, RegExp][] = [
    ["1e7", 1e7, /^must be (at most|below) -?[\d.]+ \(got 10000000\)$/],
    ["-1e7", -1e7, /^must be (at least|above|positive) (-?[\d.]+ )?\(got -10000000\)$/],
    ["1e300", 1e300, /^must be (at most|below) -?[\d.]+ \(got 1e\+300\)$/],
    ["Infinity", Number.POSITIVE_INFINITY, /^must be a number \(got Infinity\)$/],
    ["NaN", Number.NaN, /^must be a number \(got NaN\)$/],
  ];
  for (const [name, value, message] of hostile) {
    it(`${name} in any of the ${leaves.length} numbers of a tripod with body keys`, () => {
      const missed: string[] = [];
      for (const leaf of leaves) {
        const path = formatPath(leaf.path);
        const issues = issuesOf(withLeaf(sequence, leaf.path, value));
        if (!issues.some((issue) => issue.path === path && message.test(issue.message))) missed.push(`${path}: ${JSON.stringify(issues)}`);
      }
      expect(missed).toEqual([]);
    });
  }
});

describe("generateGait takes its flat parameters in the same ranges", () => {
  const cases: [string, unknown, string, string][] = [
    ["strideMm", 1e7, "strideMm", "must be at most 10000 (got 10000000)"],
    ["directionDeg", 1e300, "directionDeg", "must be at most 360 (got 1e+300)"],
    ["turnDegPerCycle", Number.POSITIVE_INFINITY, "turnDegPerCycle", "must be a number (got Infinity)"],
    ["bodyHeightMm", 1e7, "bodyHeightMm", "must be at most 5000 (got 10000000)"],
    ["fps", 0.5, "fps", "must be at least 1 (got 0.5)"],
  ];
  for (const [field, value, path, message] of cases) {
    it(`${field} = ${String(value)}`, () => {
      let thrown: unknown;
      try {
        generateGait(robot, { template: "tripod", [field]: value } as Parameters<typeof generateGait>[1]);
      } catch (error) {
        thrown = error;
      }
      expect(thrown).toBeInstanceOf(GaitInputError);
      expect((thrown as GaitInputError).issues).toContainEqual({ path, message });
    });
  }
});
