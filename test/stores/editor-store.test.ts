// The editor store: every edit is one undo step (a drag too), keys snap to
// frames and keep their order, copy and mirror carry feet across legs, and
// scrubbing never solves again.
import { describe, expect, test } from "vitest";
import { createEditorStore } from "~/stores/editor-store";
import { crawler, tripod } from "../support/editor";

const storeWith = (sequence = tripod(), readOnly = false) => createEditorStore({ robot: crawler, sequence, revision: 3, readOnly });

describe("undo and redo", () => {
  test("each edit is one step back and forward, and a new edit clears the redo stack", () => {
    const store = storeWith();
    const original = store.getState().sequence;
    store.getState().setFrame(10);
    store.getState().addKeyAtPlayhead("LF");
    const withKey = store.getState().sequence;
    expect(withKey.legs.LF.keys).toHaveLength(3);
    store.getState().deleteSelected();
    expect(store.getState().sequence.legs.LF.keys).toHaveLength(2);

    store.getState().undo();
    expect(store.getState().sequence).toBe(withKey);
    store.getState().undo();
    expect(store.getState().sequence).toBe(original);
    store.getState().redo();
    expect(store.getState().sequence).toBe(withKey);

    store.getState().mirrorLeg("LF");
    expect(store.getState().future).toEqual([]);
    store.getState().redo();
    expect(store.getState().notice?.text).toBe("Nothing to redo.");
  });

  test("a drag of many moves is one undo step; a cancelled drag restores the key and leaves no step", () => {
    const store = storeWith();
    const original = store.getState().sequence;
    const ref = { legId: "LF", index: 1 };
    store.getState().beginGesture();
    for (const t of [0.52, 0.55, 0.6, 0.62]) store.getState().moveKey(ref, t);
    store.getState().endGesture();
    expect(store.getState().sequence.legs.LF.keys[1].t).toBeCloseTo(0.6167, 4);
    expect(store.getState().past).toHaveLength(1);
    store.getState().undo();
    expect(store.getState().sequence).toBe(original);

    store.getState().beginGesture();
    store.getState().moveKey(ref, 0.7);
    store.getState().cancelGesture();
    expect(store.getState().sequence).toBe(original);
    expect(store.getState().past).toHaveLength(0);
  });

  test("a read-only editor refuses edits with a sentence and keeps the sequence", () => {
    const store = storeWith(tripod(), true);
    const original = store.getState().sequence;
    store.getState().addKeyAtPlayhead("LF");
    expect(store.getState().sequence).toBe(original);
    expect(store.getState().notice).toMatchObject({ tone: "error", text: "Your role can view this gait but not change it." });
  });
});

describe("moving keys in time", () => {
  test("snaps to whole frames (N = 60), or to tenths of a frame with fine placement", () => {
    const store = storeWith();
    const ref = { legId: "LF", index: 1 };
    store.getState().moveKey(ref, 0.5123);
    expect(store.getState().sequence.legs.LF.keys[1].t * 60).toBeCloseTo(31, 9);
    store.getState().moveKey(ref, 0.5123, true);
    expect(store.getState().sequence.legs.LF.keys[1].t * 600).toBeCloseTo(307, 9);
  });

  test("a key stops one frame short of its neighbours and of a loop's end", () => {
    const store = storeWith();
    store.getState().moveKey({ legId: "LF", index: 1 }, 0.99);
    expect(store.getState().sequence.legs.LF.keys[1].t).toBeCloseTo(59 / 60, 9);
    store.getState().moveKey({ legId: "LF", index: 0 }, 0.995);
    expect(store.getState().sequence.legs.LF.keys[0].t).toBeCloseTo(58 / 60, 9);
  });

  test("the playhead follows the moved key; scrubbing afterwards reuses the same preview", () => {
    const store = storeWith();
    store.getState().moveKey({ legId: "LF", index: 1 }, 0.75);
    expect(store.getState().frame).toBe(45);
    const preview = store.getState().preview;
    for (let frame = 0; frame < 60; frame += 1) store.getState().setFrame(frame);
    expect(store.getState().preview).toBe(preview);
  });

  test("moving a touch-down key later shortens the stance: the preview's duty factor drops from 0.5 to 0.4", () => {
    const store = storeWith();
    expect(store.getState().preview?.summary.dutyFactor.LF).toBeCloseTo(0.5, 6);
    store.getState().moveKey({ legId: "LF", index: 1 }, 0.6);
    expect(store.getState().preview?.summary.dutyFactor.LF).toBeCloseTo(0.4, 6);
  });
});

describe("adding, duplicating, deleting", () => {
  test("a key added at the playhead takes the leg's contact and planned foot there, and a stance key leaves the path as it was", () => {
    const store = storeWith();
    const was = store.getState().preview!;
    store.getState().setFrame(45);
    const before = was.frames[45].legs.LF;
    store.getState().addKeyAtPlayhead("LF");
    const key = store.getState().sequence.legs.LF.keys[2];
    expect(key.t).toBeCloseTo(0.75, 9);
    expect(key.contact).toBe("stance");
    expect(key.foot![0]).toBeCloseTo(before.foot[0], 1);
    expect(key.foot![1]).toBeCloseTo(before.foot[1], 1);
    expect(store.getState().selection).toEqual({ legId: "LF", index: 2 });
    for (const frame of [40, 50, 55]) {
      const after = store.getState().preview!.frames[frame].legs.LF.foot;
      const old = was.frames[frame].legs.LF.foot;
      expect(Math.hypot(after[0] - old[0], after[1] - old[1], after[2] - old[2]), `frame ${frame}, mm`).toBeLessThan(0.05);
    }
  });

  test("a second key on the same frame is refused", () => {
    const store = storeWith();
    store.getState().setFrame(30);
    store.getState().addKeyAtPlayhead("LF");
    expect(store.getState().notice).toMatchObject({ tone: "error", text: "LF already has a key at this frame." });
  });

  test("duplicate lands halfway to the next key on a frame; the last key of a leg cannot be deleted", () => {
    const store = storeWith();
    store.getState().select({ legId: "LF", index: 0 });
    store.getState().duplicateSelected();
    expect(store.getState().sequence.legs.LF.keys.map((key) => Math.round(key.t * 60))).toEqual([0, 15, 30]);
    for (let i = 0; i < 3; i += 1) {
      store.getState().select({ legId: "LF", index: 0 });
      store.getState().deleteSelected();
    }
    expect(store.getState().sequence.legs.LF.keys).toHaveLength(1);
    expect(store.getState().notice?.text).toBe("LF needs at least one key; change this one instead.");
  });

  test("body keys: added at the playhead with the current offset, edited, deleted", () => {
    const store = storeWith();
    store.getState().setFrame(6);
    store.getState().addKeyAtPlayhead(null);
    expect(store.getState().sequence.body.keys).toEqual([{ t: 0.1, pose: { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 } }]);
    store.getState().updateBodyKey(0, { pose: { z: -10 } });
    expect(store.getState().preview!.frames[30].body.z).toBeCloseTo(80, 6);
    store.getState().deleteSelected();
    expect(store.getState().sequence.body.keys).toEqual([]);
  });
});

describe("copy and mirror", () => {
  test("mirror LF onto RF: feet mirrored in y about each leg's neutral foot, at RF's own lift-off time", () => {
    const store = storeWith();
    const lf = store.getState().sequence.legs.LF.keys;
    store.getState().mirrorLeg("LF");
    const rf = store.getState().sequence.legs.RF.keys;
    expect(rf).toHaveLength(2);
    // The demo crawler is symmetric: a mirrored foot is [x, −y, z].
    const lift = lf.find((key) => key.contact === "swing")!;
    const mirroredLift = rf.find((key) => key.contact === "swing")!;
    expect(mirroredLift.foot![0]).toBeCloseTo(lift.foot![0], 6);
    expect(mirroredLift.foot![1]).toBeCloseTo(-lift.foot![1], 6);
    expect(mirroredLift.foot![2]).toBeCloseTo(lift.foot![2], 6);
    expect(mirroredLift.t).toBeCloseTo(0.5, 9);
  });

  test("mirror after widening LF's touch-down by 20 mm widens RF's by 20 mm the other way", () => {
    const store = storeWith();
    const touch = store.getState().sequence.legs.LF.keys[1];
    store.getState().setKeyFoot({ legId: "LF", index: 1 }, [touch.foot![0], touch.foot![1] + 20, touch.foot![2]]);
    const rfBefore = store.getState().sequence.legs.RF.keys.find((key) => key.contact === "stance")!;
    store.getState().mirrorLeg("LF");
    const rfAfter = store.getState().sequence.legs.RF.keys.find((key) => key.contact === "stance")!;
    expect(rfAfter.foot![1] - rfBefore.foot![1]).toBeCloseTo(-20, 1);
  });

  test("copy a key to other legs at the same time, or shifted by each leg's phase", () => {
    const store = storeWith();
    store.getState().setFrame(12);
    store.getState().addKeyAtPlayhead("LF");
    store.getState().copySelectedTo(["LM", "RF"], false);
    expect(store.getState().sequence.legs.LM.keys.some((key) => Math.abs(key.t - 0.2) < 1e-9)).toBe(true);
    expect(store.getState().sequence.legs.RF.keys.some((key) => Math.abs(key.t - 0.2) < 1e-9)).toBe(true);
    store.getState().undo();
    store.getState().copySelectedTo(["LM"], true);
    // LM lifts off at 0.5 in a tripod, LF at 0: the copy lands at 0.7.
    expect(store.getState().sequence.legs.LM.keys.map((key) => Math.round(key.t * 60))).toEqual([0, 30, 42]);
  });

  test("copying needs a leg key and at least one target", () => {
    const store = storeWith();
    store.getState().copySelectedTo(["LM"], false);
    expect(store.getState().notice?.text).toBe("Select a leg key to copy.");
    store.getState().select({ legId: "LF", index: 0 });
    store.getState().copySelectedTo([], false);
    expect(store.getState().notice?.text).toBe("Choose the legs to copy to.");
  });
});

describe("regenerating and the preview", () => {
  test("regenerate replaces the keys from the template and is undoable", () => {
    const store = storeWith();
    const original = store.getState().sequence;
    store.getState().regenerate({ template: "wave", cycleMs: 2400, fps: 50, strideMm: 30 });
    expect(store.getState().sequence.generator.template).toBe("wave");
    expect(store.getState().solvedFrames).toBe(120);
    store.getState().undo();
    expect(store.getState().sequence).toBe(original);
    expect(store.getState().solvedFrames).toBe(60);
  });

  test("a foot moved far outside its reach gives unreachable flags for that leg in the preview", () => {
    const store = storeWith();
    const touch = store.getState().sequence.legs.LF.keys[1];
    store.getState().setKeyFoot({ legId: "LF", index: 1 }, [touch.foot![0] + 150, touch.foot![1] + 150, touch.foot![2]]);
    const flags = store.getState().preview!.flags.filter((flag) => flag.kind === "unreachable" && flag.leg === "LF");
    expect(flags.length).toBeGreaterThan(20);
    // The stance from touch-down (frame 30) to lift-off (frame 60 = 0) is where the foot stays out of reach.
    expect(flags.some((flag) => flag.frame === 45)).toBe(true);
  });
});
