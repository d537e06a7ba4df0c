import { describe, expect, it } from "vitest";
import { frameCount, parseSequence, sequenceIssuesForRobot, sequenceJsonSchema } from "~/gait/index";
import { SEQUENCE_FORMAT, type SequenceInput } from "~/gait/sequence";
import { DEMO_ROBOTS, loadDemoRobot } from "../support/robots";

function minimal(): SequenceInput {
  return {
    format: SEQUENCE_FORMAT,
    cycleMs: 1200,
    fps: 50,
    loop: true,
    legs: {
      LF: {
        keys: [
          { t: 0, contact: "swing" },
          { t: 0.5, contact: "stance", foot: [150, 120, -90] },
        ],
      },
    },
  };
}

function issuesOf(json: unknown): { path: string; message: string }[] {
  const result = parseSequence(json);
  if (result.ok) throw new Error("expected the sequence to be refused, it was accepted");
  return result.issues;
}

describe("parseSequence (DESIGN.md, Gait sequence)", () => {
  it("accepts a minimal sequence and fills the defaults (no travel, default step height, empty body track)", () => {
    const result = parseSequence(minimal());
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.sequence.generator).toEqual({ strideMm: 0, directionDeg: 0, turnDegPerCycle: 0, stepHeightMm: 25 });
    expect(result.sequence.body.keys).toEqual([]);
  });

  it("reports a key time out of order at legs.LF.keys[2].t with both times", () => {
    const json = minimal() as { legs: Record<string, { keys: unknown[] }> };
    json.legs.LF.keys.push({ t: 0.3, contact: "swing" });
    expect(issuesOf(json)).toEqual([{ path: "legs.LF.keys[2].t", message: "must come after keys[1].t (got 0.3 ≤ 0.5)" }]);
  });

  it("reports t = 1 in a loop, a bad contact, a bad easing and an unknown field, each at its own path", () => {
    const json = {
      ...minimal(),
      legs: {
        LF: {
          keys: [
            { t: 0, contact: "hover" },
            { t: 0.5, contact: "stance", ease: [1.5, 0, 0.5, 1] },
            { t: 1, contact: "swing", apexMM: 3 },
          ],
        },
      },
    };
    const issues = issuesOf(json);
    expect(issues).toContainEqual({ path: "legs.LF.keys[0].contact", message: 'must be one of "stance", "swing" (got "hover")' });
    expect(issues).toContainEqual({ path: "legs.LF.keys[1].ease[0]", message: "must be at most 1 (got 1.5)" });
    expect(issues).toContainEqual({ path: "legs.LF.keys[2].apexMM", message: "is not a known field (check the spelling)" });
  });

  it("reports t = 1 in a loop (t = 1 is the next cycle's t = 0) but allows it in a one-shot move", () => {
    const json = {
      ...minimal(),
      legs: {
        LF: {
          keys: [
            { t: 0, contact: "stance" },
            { t: 1, contact: "swing" },
          ],
        },
      },
    };
    expect(issuesOf(json)).toEqual([{ path: "legs.LF.keys[1].t", message: "must be below 1 in a loop, where t = 1 is t = 0 of the next cycle (got 1)" }]);
    expect(parseSequence({ ...json, loop: false }).ok).toBe(true);
  });

  it("reports the wrong format, a missing cycle time and a frame rate that gives no frame", () => {
    expect(issuesOf({ ...minimal(), format: "gaitloom.sequence/2" })).toEqual([
      { path: "format", message: 'must be "gaitloom.sequence/1" (got "gaitloom.sequence/2")' },
    ]);
    const { cycleMs: _dropped, ...noCycle } = minimal();
    expect(issuesOf(noCycle)).toEqual([{ path: "cycleMs", message: "is required" }]);
    expect(issuesOf({ ...minimal(), cycleMs: 10, fps: 10 })).toEqual([
      { path: "fps", message: "gives no frame: cycleMs · fps / 1000 rounds to 0, at least 1 needed" },
    ]);
  });

  it("reports body keys by path too (body.keys[1].pose.pitch)", () => {
    const json = {
      ...minimal(),
      body: {
        keys: [
          { t: 0, pose: { z: -10 } },
          { t: 0.5, pose: { pitch: "5" } },
        ],
      },
    };
    expect(issuesOf(json)).toEqual([{ path: "body.keys[1].pose.pitch", message: 'must be a number (got "5")' }]);
  });

  it("N = round(cycleMs · fps / 1000)", () => {
    expect(frameCount({ cycleMs: 1200, fps: 50 })).toBe(60);
    expect(frameCount({ cycleMs: 1010, fps: 30 })).toBe(30);
  });

  it("checks the legs against a robot: every leg tracked, no unknown leg", () => {
    const robot = loadDemoRobot(DEMO_ROBOTS.six);
    const result = parseSequence({ ...minimal(), legs: { ...minimal().legs, XX: minimal().legs.LF } });
    if (!result.ok) throw new Error("fixture should parse");
    const issues = sequenceIssuesForRobot(robot, result.sequence);
    expect(issues).toContainEqual({ path: "legs.LM", message: 'is missing: robot "Pier crawler" has a leg LM' });
    expect(issues.find((issue) => issue.path === "legs.XX")?.message).toMatch(/^names no leg of robot "Pier crawler"/);
  });

  it("publishes a JSON Schema generated from the same zod schema", () => {
    const schema = sequenceJsonSchema() as { $schema: string; $defs: Record<string, { properties: object }> };
    expect(schema.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
    expect(Object.keys(schema.$defs["gaitloom.sequence/1"].properties)).toEqual(
      expect.arrayContaining(["format", "cycleMs", "fps", "loop", "generator", "legs", "body"]),
    );
  });
});
