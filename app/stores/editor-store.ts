// The gait editor's state: the sequence and its browser-side preview solve,
// the selection, the playhead and playback, undo/redo, and where saving
// stands. One store per open editor (createEditorStore), read through
// selectors so that moving the playhead re-renders only what shows the frame.
//
// Every edit goes through `edit`, which keeps the previous sequence on the
// undo stack and solves the new one at once; a drag is one gesture, so it is
// one undo step however many moves it makes. Scrubbing never solves.
import { createStore, type StoreApi } from "zustand/vanilla";
import {
  generateGait,
  GaitInputError,
  solveSequence,
  type BodyKey,
  type BodyOffset,
  type GaitParams,
  type LegKey,
  type Sequence,
  type SolvedSequence,
} from "~/gait";
import type { Robot, Vec3 } from "~/kinematics";
import { bodyOffsetAt, plannedFoot } from "~/features/gaits/editor/body-offset";
import {
  EditRefusal,
  addBodyKey,
  addLegKey,
  copyKeyToLegs,
  deleteKey,
  duplicateKey,
  keyAt,
  keysOf,
  mirrorTrack,
  moveKey,
  updateBodyKey,
  updateLegKey,
  type KeyRef,
} from "~/features/gaits/editor/key-edits";
import { cycleFramesOf, frameOfTime, placeKeyTime, solvedFramesOf } from "~/features/gaits/editor/timing";

export type { KeyRef };

export type Snapshot = { sequence: Sequence; selection: KeyRef | null };

export type SaveStatus = "saved" | "pending" | "saving" | "offline" | "conflict" | "invalid" | "read-only";

export type Conflict = { message: string; currentRevision: number; updatedBy: { login: string; name: string } | null; updatedAt: string };

export type Notice = { id: number; text: string; tone: "info" | "error" };

/** Undo keeps this many steps; a day of work fits, memory stays bounded. */
export const UNDO_LIMIT = 300;

export const PLAYBACK_RATES = [0.25, 0.5, 1, 2] as const;

export type EditorData = {
  robot: Robot;
  readOnly: boolean;
  sequence: Sequence;
  /** Counts every change of the sequence; saving and the server check key on it. */
  sequenceVersion: number;
  preview: SolvedSequence | null;
  previewError: string | null;
  cycleFrames: number;
  solvedFrames: number;
  frame: number;
  selection: KeyRef | null;
  /** The leg whose joints the plots show. */
  focusLegId: string;
  playing: boolean;
  loopPlayback: boolean;
  playbackRate: number;
  past: Snapshot[];
  future: Snapshot[];
  gesture: Snapshot | null;
  notice: Notice | null;
  revision: number;
  /** The sequenceVersion last stored on the server. */
  savedVersion: number;
  saveStatus: SaveStatus;
  conflict: Conflict | null;
  saveMessage: string | null;
};

export type EditorActions = {
  setFrame(frame: number): void;
  stepFrame(delta: number): void;
  select(ref: KeyRef | null): void;
  focusLeg(legId: string): void;
  setPlaying(playing: boolean): void;
  togglePlaying(): void;
  setLoopPlayback(loop: boolean): void;
  setPlaybackRate(rate: number): void;
  beginGesture(): void;
  endGesture(): void;
  cancelGesture(): void;
  moveKey(ref: KeyRef, t: number, fine?: boolean): void;
  nudgeSelected(frames: number): void;
  addKeyAtPlayhead(legId: string | null): void;
  duplicateSelected(): void;
  deleteSelected(): void;
  copySelectedTo(targets: readonly string[], byPhase: boolean): void;
  mirrorLeg(legId: string): void;
  updateLegKey(ref: KeyRef, patch: Partial<Omit<LegKey, "t">>): void;
  updateBodyKey(index: number, patch: Partial<Omit<BodyKey, "t" | "pose">> & { pose?: Partial<BodyOffset> }): void;
  setKeyFoot(ref: KeyRef, foot: Vec3): void;
  regenerate(params: GaitParams): void;
  replaceSequence(sequence: Sequence, reason: string): void;
  undo(): void;
  redo(): void;
  announce(text: string, tone?: Notice["tone"]): void;
  markSaving(): void;
  markSaved(version: number, revision: number): void;
  markConflict(conflict: Conflict): void;
  markOffline(message: string): void;
  markInvalid(message: string): void;
  adoptRevision(revision: number): void;
};

export type EditorState = EditorData & EditorActions;
export type EditorStore = StoreApi<EditorState>;

export type EditorInit = { robot: Robot; sequence: Sequence; revision: number; readOnly: boolean; frame?: number };

function solvePreview(robot: Robot, sequence: Sequence): { preview: SolvedSequence | null; previewError: string | null } {
  try {
    return { preview: solveSequence(robot, sequence), previewError: null };
  } catch (error) {
    if (error instanceof GaitInputError) return { preview: null, previewError: error.message };
    throw error;
  }
}

/** The frame a key sits on; a loop's t just below 1 rounds to frame N, which is frame 0. */
const frameOfKey = (t: number, state: Pick<EditorData, "cycleFrames" | "sequence">) => {
  const frame = frameOfTime(t, state.cycleFrames);
  return state.sequence.loop ? frame % state.cycleFrames : frame;
};

const clampFrame = (frame: number, solvedFrames: number) => Math.max(0, Math.min(solvedFrames - 1, Math.round(frame)));

/** The selection if it still names a key of the sequence, else null. */
function validSelection(sequence: Sequence, selection: KeyRef | null): KeyRef | null {
  if (!selection) return null;
  if (selection.legId !== null && !sequence.legs[selection.legId]) return null;
  return keyAt(sequence, selection) ? selection : null;
}

export function createEditorStore(init: EditorInit): EditorStore {
  let noticeId = 0;
  return createStore<EditorState>()((set, get) => {
    const derived = (sequence: Sequence) => {
      const cycleFrames = cycleFramesOf(sequence);
      const solvedFrames = solvedFramesOf(sequence);
      return { cycleFrames, solvedFrames, ...solvePreview(init.robot, sequence) };
    };

    const announce = (text: string, tone: Notice["tone"] = "info") => set({ notice: { id: ++noticeId, text, tone } });

    /** Runs an edit: refusals become a notice, read-only refuses, undo keeps the previous state. */
    const edit = (change: (state: EditorState) => { sequence: Sequence; selection?: KeyRef | null; message?: string } | null) => {
      const state = get();
      if (state.readOnly) return announce("Your role can view this gait but not change it.", "error");
      let result;
      try {
        result = change(state);
      } catch (error) {
        if (error instanceof EditRefusal) return announce(error.message, "error");
        throw error;
      }
      if (!result || result.sequence === state.sequence) return;
      const selection = result.selection === undefined ? validSelection(result.sequence, state.selection) : result.selection;
      const next = derived(result.sequence);
      const past = state.gesture ? state.past : [...state.past, { sequence: state.sequence, selection: state.selection }].slice(-UNDO_LIMIT);
      set({
        ...next,
        sequence: result.sequence,
        sequenceVersion: state.sequenceVersion + 1,
        selection,
        frame: clampFrame(state.frame, next.solvedFrames),
        past,
        future: [],
        saveStatus: state.saveStatus === "conflict" ? "conflict" : "pending",
      });
      if (result.message) announce(result.message);
    };

    const restore = (snapshot: Snapshot, stacks: Pick<EditorData, "past" | "future">) => {
      const state = get();
      const next = derived(snapshot.sequence);
      set({
        ...next,
        ...stacks,
        sequence: snapshot.sequence,
        sequenceVersion: state.sequenceVersion + 1,
        selection: validSelection(snapshot.sequence, snapshot.selection),
        frame: clampFrame(state.frame, next.solvedFrames),
        gesture: null,
        saveStatus: state.saveStatus === "conflict" ? "conflict" : "pending",
      });
    };

    const first = solvePreview(init.robot, init.sequence);
    const solvedFrames = solvedFramesOf(init.sequence);
    return {
      robot: init.robot,
      readOnly: init.readOnly,
      sequence: init.sequence,
      sequenceVersion: 0,
      ...first,
      cycleFrames: cycleFramesOf(init.sequence),
      solvedFrames,
      frame: clampFrame(init.frame ?? 0, solvedFrames),
      selection: null,
      focusLegId: init.robot.legs[0]?.id ?? "",
      playing: false,
      loopPlayback: true,
      playbackRate: 1,
      past: [],
      future: [],
      gesture: null,
      notice: null,
      revision: init.revision,
      savedVersion: 0,
      saveStatus: init.readOnly ? "read-only" : "saved",
      conflict: null,
      saveMessage: null,

      setFrame(frame) {
        const { solvedFrames: total, frame: current } = get();
        const next = clampFrame(frame, total);
        if (next !== current) set({ frame: next });
      },
      stepFrame(delta) {
        const { solvedFrames: total, frame, sequence } = get();
        const next = sequence.loop ? (((frame + delta) % total) + total) % total : clampFrame(frame + delta, total);
        if (next !== frame) set({ frame: next, playing: false });
      },
      select(ref) {
        const state = get();
        if (!ref) return set({ selection: null });
        const key = keyAt(state.sequence, ref);
        if (!key) return;
        const frame = clampFrame(frameOfKey(key.t, state), state.solvedFrames);
        set({ selection: ref, frame, focusLegId: ref.legId ?? state.focusLegId, playing: false });
      },
      focusLeg(legId) {
        if (get().focusLegId !== legId) set({ focusLegId: legId });
      },
      setPlaying(playing) {
        set({ playing });
      },
      togglePlaying() {
        set({ playing: !get().playing });
      },
      setLoopPlayback(loop) {
        set({ loopPlayback: loop });
      },
      setPlaybackRate(rate) {
        set({ playbackRate: rate });
      },

      beginGesture() {
        const state = get();
        if (state.readOnly || state.gesture) return;
        set({
          gesture: { sequence: state.sequence, selection: state.selection },
          past: [...state.past, { sequence: state.sequence, selection: state.selection }].slice(-UNDO_LIMIT),
        });
      },
      endGesture() {
        const state = get();
        if (!state.gesture) return;
        // A gesture that changed nothing leaves no undo step.
        if (state.gesture.sequence === state.sequence) set({ gesture: null, past: state.past.slice(0, -1) });
        else set({ gesture: null });
      },
      cancelGesture() {
        const state = get();
        if (!state.gesture) return;
        restore(state.gesture, { past: state.past.slice(0, -1), future: state.future });
      },

      moveKey(ref, t, fine = false) {
        edit((state) => {
          const keys = keysOf(state.sequence, ref.legId);
          const placed = placeKeyTime(keys, ref.index, t, state.cycleFrames, state.sequence.loop, fine);
          return { sequence: moveKey(state.sequence, ref, placed), selection: ref };
        });
        // The playhead follows the key, so the views show the pose being placed.
        const key = keyAt(get().sequence, ref);
        if (key) get().setFrame(frameOfKey(key.t, get()));
      },
      nudgeSelected(frames) {
        const { selection, sequence, cycleFrames } = get();
        if (!selection) return announce("Select a key first.", "error");
        const key = keyAt(sequence, selection);
        if (key) get().moveKey(selection, key.t + frames / cycleFrames);
      },
      addKeyAtPlayhead(legId) {
        edit((state) => {
          const t = state.frame / state.cycleFrames;
          if (legId === null) {
            const pose = bodyOffsetAt(state.sequence, t);
            const added = addBodyKey(state.sequence, { t, pose: roundPose(pose) });
            return { ...added, selection: added.ref, message: `Body key added at frame ${state.frame}.` };
          }
          const contact = state.preview?.frames[state.frame]?.legs[legId]?.contact ?? "stance";
          const foot = state.preview ? plannedFoot(state.sequence, state.preview, legId, state.frame, state.cycleFrames) : undefined;
          const key: LegKey = { t, contact, ...(foot ? { foot } : {}) };
          const added = addLegKey(state.sequence, legId, key);
          return { ...added, selection: added.ref, message: `${legId} key added at frame ${state.frame} (${contact}).` };
        });
      },
      duplicateSelected() {
        edit((state) => {
          if (!state.selection) throw new EditRefusal("Select a key to duplicate.");
          const copy = duplicateKey(state.sequence, state.selection);
          return { ...copy, selection: copy.ref, message: "Key duplicated." };
        });
        const { selection } = get();
        if (selection) get().select(selection);
      },
      deleteSelected() {
        edit((state) => {
          if (!state.selection) throw new EditRefusal("Select a key to delete.");
          return { sequence: deleteKey(state.sequence, state.selection), selection: null, message: "Key deleted." };
        });
      },
      copySelectedTo(targets, byPhase) {
        edit((state) => {
          if (!state.selection) throw new EditRefusal("Select a leg key to copy.");
          if (targets.length === 0) throw new EditRefusal("Choose the legs to copy to.");
          return { sequence: copyKeyToLegs(state.robot, state.sequence, state.selection, targets, byPhase), message: `Key copied to ${targets.join(", ")}.` };
        });
      },
      mirrorLeg(legId) {
        edit((state) => {
          const mirrored = mirrorTrack(state.robot, state.sequence, legId);
          return { sequence: mirrored.sequence, message: `${legId} mirrored onto ${mirrored.partner}.` };
        });
      },
      updateLegKey(ref, patch) {
        edit((state) => ({ sequence: updateLegKey(state.sequence, ref, patch) }));
      },
      updateBodyKey(index, patch) {
        edit((state) => ({ sequence: updateBodyKey(state.sequence, index, patch as Partial<BodyKey>) }));
      },
      setKeyFoot(ref, foot) {
        edit((state) => ({ sequence: updateLegKey(state.sequence, ref, { foot: foot.map((value) => Math.round(value * 10) / 10) as Vec3 }) }));
      },
      regenerate(params) {
        edit((state) => {
          try {
            const sequence = generateGait(state.robot, { ...params, name: state.sequence.name, bodyKeys: state.sequence.body.keys });
            return {
              sequence: { ...sequence, ...(state.sequence.description ? { description: state.sequence.description } : {}) },
              selection: null,
              message: `Regenerated from the ${params.template} template.`,
            };
          } catch (error) {
            if (error instanceof GaitInputError)
              throw new EditRefusal(error.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ") || error.message);
            throw error;
          }
        });
      },
      replaceSequence(sequence, reason) {
        edit(() => ({ sequence, selection: null, message: reason }));
      },
      undo() {
        const state = get();
        if (state.readOnly) return;
        const previous = state.past[state.past.length - 1];
        if (!previous) return announce("Nothing to undo.");
        restore(previous, { past: state.past.slice(0, -1), future: [{ sequence: state.sequence, selection: state.selection }, ...state.future] });
        announce("Undone.");
      },
      redo() {
        const state = get();
        if (state.readOnly) return;
        const [next, ...rest] = state.future;
        if (!next) return announce("Nothing to redo.");
        restore(next, { past: [...state.past, { sequence: state.sequence, selection: state.selection }], future: rest });
        announce("Redone.");
      },
      announce,

      markSaving() {
        set({ saveStatus: "saving", saveMessage: null });
      },
      markSaved(version, revision) {
        const state = get();
        set({ savedVersion: version, revision, saveStatus: state.sequenceVersion === version ? "saved" : "pending", saveMessage: null });
      },
      markConflict(conflict) {
        set({ saveStatus: "conflict", conflict, saveMessage: conflict.message });
      },
      markOffline(message) {
        set({ saveStatus: "offline", saveMessage: message });
      },
      markInvalid(message) {
        set({ saveStatus: "invalid", saveMessage: message });
      },
      adoptRevision(revision) {
        const state = get();
        set({ revision, conflict: null, saveStatus: state.sequenceVersion === state.savedVersion ? "saved" : "pending", saveMessage: null });
      },
    };
  });
}

function roundPose(pose: BodyOffset): BodyOffset {
  const round = (value: number) => Math.round(value * 100) / 100;
  return { x: round(pose.x), y: round(pose.y), z: round(pose.z), roll: round(pose.roll), pitch: round(pose.pitch), yaw: round(pose.yaw) };
}
