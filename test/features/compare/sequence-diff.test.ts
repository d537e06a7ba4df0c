import { describe, expect, it } from "vitest";
import { generateGait, parseSequence, type Sequence } from "~/gait/index";
import { alignKeys, describeKeyChanges, diffSequences } from "~/features/compare";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";

const robot = loadDemoRobot(DEMO_ROBOTS.six);

function sequence(
  legs: Record<string, { t: number; contact: "stance" | "swing"; foot?: [number, number, number]; ease?: [number, number, number, number]; apexMm?: number }[]>,
  extra: Record<string, unknown> = {},
): Sequence {
  const parsed = parseSequence({
    format: "gaitloom.sequence/1",
    cycleMs: 1000,
    fps: 50,
    loop: true,
    legs: Object.fromEntries(Object.entries(legs).map(([id, keys]) => [id, { keys }])),
    ...extra,
  });
  if (!parsed.ok) throw new Error(parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; "));
  return parsed.sequence;
}

const clone = <T>(value: T): T => structuredClone(value);

describe("diffSequences: key by key", () => {
  it("finds nothing between a sequence and its copy", () => {
    const a = generateGait(robot, { template: "tripod", strideMm: 40 });
    const diff = diffSequences(a, clone(a));
    expect(diff.settings).toEqual([]);
    expect(diff.counts).toMatchObject({ added: 0, removed: 0, moved: 0, easing: 0, changed: 0 });
    expect(diff.counts.same).toBe(12); // six legs, a lift-off and a touch-down key each
    expect(diff.tracks.map((track) => track.track)).toEqual(["LF", "LM", "LR", "RF", "RM", "RR"]);
  });

  it("reports a key added and a key removed, pairing the others", () => {
    const a = sequence({
      LF: [
        { t: 0, contact: "swing" },
        { t: 0.5, contact: "stance" },
      ],
    });
    const b = sequence({
      LF: [
        { t: 0, contact: "swing" },
        { t: 0.25, contact: "swing", foot: [100, 50, -60] },
        { t: 0.5, contact: "stance" },
      ],
    });
    const diff = diffSequences(a, b);
    expect(diff.tracks[0].keys.map((key) => key.status)).toEqual(["same", "added", "same"]);
    expect(diff.tracks[0].keys[1].b?.index).toBe(1);
    const back = diffSequences(b, a);
    expect(back.tracks[0].keys.map((key) => key.status)).toEqual(["same", "removed", "same"]);
    expect(back.counts).toMatchObject({ added: 0, removed: 1 });
  });

  it("calls a key moved when its time shifts (a touch-down 0.05 of a cycle later) and names a changed easing", () => {
    const a = sequence({
      LF: [
        { t: 0, contact: "swing", ease: [0.25, 0.1, 0.25, 1] },
        { t: 0.5, contact: "stance" },
      ],
    });
    const b = sequence({
      LF: [
        { t: 0, contact: "swing", ease: [0.42, 0, 0.58, 1] },
        { t: 0.55, contact: "stance" },
      ],
    });
    const [first, second] = diffSequences(a, b).tracks[0].keys;
    expect(first).toMatchObject({ status: "changed", changes: ["ease"] });
    expect(second).toMatchObject({ status: "changed", changes: ["time"] });
    expect(describeKeyChanges(second.changes)).toBe("moved");
    expect(describeKeyChanges(first.changes)).toBe("changed easing");
    expect(diffSequences(a, b).counts).toMatchObject({ moved: 1, easing: 1, changed: 2 });
  });

  it("treats an omitted easing as CSS ease (its default), so writing the default out is no change", () => {
    const a = sequence({ LF: [{ t: 0, contact: "swing" }] });
    const b = sequence({ LF: [{ t: 0, contact: "swing", ease: [0.25, 0.1, 0.25, 1] }] });
    expect(diffSequences(a, b).counts.changed).toBe(0);
  });

  it("compares a swing's height with the generator's step height as its default, and ignores it on stance keys", () => {
    const a = sequence(
      {
        LF: [
          { t: 0, contact: "swing" },
          { t: 0.5, contact: "stance" },
        ],
      },
      { generator: { stepHeightMm: 25 } },
    );
    const b = sequence(
      {
        LF: [
          { t: 0, contact: "swing", apexMm: 25 },
          { t: 0.5, contact: "stance" },
        ],
      },
      { generator: { stepHeightMm: 30 } },
    );
    const diff = diffSequences(a, b);
    expect(diff.tracks[0].keys.map((key) => key.status)).toEqual(["same", "same"]);
    expect(diff.settings).toEqual([{ path: "generator.stepHeightMm", before: 25, after: 30 }]);
  });

  it("sees a foot moved by more than a micrometre, not less", () => {
    const a = sequence({ LF: [{ t: 0, contact: "stance", foot: [100, 50, -90] }] });
    const b = sequence({ LF: [{ t: 0, contact: "stance", foot: [100.0004, 50, -90] }] });
    const c = sequence({ LF: [{ t: 0, contact: "stance", foot: [101, 50, -90] }] });
    expect(diffSequences(a, b).counts.changed).toBe(0);
    expect(diffSequences(a, c).tracks[0].keys[0].changes).toEqual(["foot"]);
  });

  it("pairs keys round the seam of a loop by the shorter way (t 0.98 is 0.04 of a cycle from t 0.02)", () => {
    const a = sequence({
      LF: [
        { t: 0.02, contact: "swing" },
        { t: 0.5, contact: "stance" },
      ],
    });
    const b = sequence({
      LF: [
        { t: 0, contact: "swing" },
        { t: 0.52, contact: "stance" },
      ],
    });
    const keys = diffSequences(a, b).tracks[0].keys;
    expect(keys.map((key) => key.status)).toEqual(["changed", "changed"]);
    expect(keys.every((key) => key.changes.join() === "time")).toBe(true);
  });

  it("does not pair keys of different contact far apart in time: removed and added instead", () => {
    const a = sequence({ LF: [{ t: 0.1, contact: "swing" }] });
    const b = sequence({ LF: [{ t: 0.6, contact: "stance" }] });
    expect(diffSequences(a, b).tracks[0].keys.map((key) => key.status)).toEqual(["removed", "added"]);
  });

  it("lists a leg only one side has with all its keys added or removed", () => {
    const a = sequence({ LF: [{ t: 0, contact: "swing" }] });
    const b = sequence({
      LF: [{ t: 0, contact: "swing" }],
      RF: [
        { t: 0, contact: "stance" },
        { t: 0.5, contact: "swing" },
      ],
    });
    const diff = diffSequences(a, b);
    expect(diff.tracks.find((track) => track.track === "RF")).toMatchObject({ presence: "only-b", counts: { added: 2 } });
    expect(diffSequences(b, a).tracks.find((track) => track.track === "RF")).toMatchObject({ presence: "only-a", counts: { removed: 2 } });
  });

  it("diffs the body track: a pitch added to a pose is a changed pose", () => {
    const pose = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
    const a = sequence({ LF: [{ t: 0, contact: "stance" }] }, { body: { keys: [{ t: 0, pose }] } });
    const b = sequence(
      { LF: [{ t: 0, contact: "stance" }] },
      {
        body: {
          keys: [
            { t: 0, pose: { ...pose, pitch: 5 } },
            { t: 0.5, pose },
          ],
        },
      },
    );
    const body = diffSequences(a, b).tracks.find((track) => track.kind === "body")!;
    expect(body.keys.map((key) => [key.status, key.changes.join()])).toEqual([
      ["changed", "pose"],
      ["added", ""],
    ]);
  });

  it("between two demo tripods of different stride and step height, every key changes its foot, swing keys their height, and the settings say why", () => {
    const a = generateGait(robot, { template: "tripod", cycleMs: 1200, strideMm: 40, stepHeightMm: 25 });
    const b = generateGait(robot, { template: "tripod", cycleMs: 1000, strideMm: 55, stepHeightMm: 30 });
    const diff = diffSequences(a, b);
    expect(diff.settings.map((change) => change.path)).toEqual(["cycleMs", "generator.strideMm", "generator.stepHeightMm"]);
    expect(diff.counts).toMatchObject({ added: 0, removed: 0, moved: 0, changed: 12 });
    for (const track of diff.tracks) {
      for (const key of track.keys) {
        expect(key.changes).toContain("foot");
        if (key.a?.key && "contact" in key.a.key && key.a.key.contact === "swing") expect(key.changes).toContain("apex");
      }
    }
  });

  it("between a tripod and a ripple (duty factor 1/2 against 3/4), touch-downs move", () => {
    const a = generateGait(robot, { template: "tripod", strideMm: 40 });
    const b = generateGait(robot, { template: "ripple", strideMm: 40 });
    const diff = diffSequences(a, b);
    expect(diff.counts.moved).toBeGreaterThan(0);
    expect(diff.settings.some((change) => change.path === "generator.template")).toBe(true);
  });
});

describe("alignKeys", () => {
  it("pairs equal tracks one to one, in order", () => {
    const keys = [
      { t: 0, contact: "swing" },
      { t: 0.3, contact: "stance" },
      { t: 0.6, contact: "swing" },
    ];
    expect(alignKeys(keys, keys, true)).toEqual([
      [0, 0],
      [1, 1],
      [2, 2],
    ]);
  });

  it("handles empty tracks", () => {
    expect(alignKeys([], [{ t: 0, contact: "swing" }], true)).toEqual([[null, 0]]);
    expect(alignKeys([], [], true)).toEqual([]);
  });
});
