// Edits of a sequence's keys, each a pure function from one sequence to the
// next (the undo stack keeps the old ones). An edit that cannot be made throws
// an EditRefusal whose message the editor shows as it is.
import { legLayout, type BodyKey, type LegKey, type Sequence } from "../../../gait/index";
import type { Robot, Vec3 } from "../../../kinematics/index";
import { neutralFeet } from "./neutral";
import { FINE_STEPS_PER_FRAME, cycleFramesOf, snapTime, wrapTime } from "./timing";

export class EditRefusal extends Error {
  constructor(message: string) {
    super(message);
    this.name = "EditRefusal";
  }
}

/** A key on a track: legId null is the body track. */
export type KeyRef = { legId: string | null; index: number };

export const sameKey = (a: KeyRef | null, b: KeyRef | null) => !!a && !!b && a.legId === b.legId && a.index === b.index;

const trackName = (legId: string | null) => (legId === null ? "the body" : legId);

export function keysOf(sequence: Sequence, legId: string | null): readonly (LegKey | BodyKey)[] {
  if (legId === null) return sequence.body.keys;
  const track = sequence.legs[legId];
  if (!track) throw new EditRefusal(`There is no leg ${legId} in this gait.`);
  return track.keys;
}

export function keyAt(sequence: Sequence, ref: KeyRef): LegKey | BodyKey | undefined {
  return keysOf(sequence, ref.legId)[ref.index];
}

function withLegKeys(sequence: Sequence, legId: string, keys: LegKey[]): Sequence {
  return { ...sequence, legs: { ...sequence.legs, [legId]: { ...sequence.legs[legId], keys } } };
}

function withBodyKeys(sequence: Sequence, keys: BodyKey[]): Sequence {
  return { ...sequence, body: { ...sequence.body, keys } };
}

function withKeys(sequence: Sequence, legId: string | null, keys: (LegKey | BodyKey)[]): Sequence {
  return legId === null ? withBodyKeys(sequence, keys as BodyKey[]) : withLegKeys(sequence, legId, keys as LegKey[]);
}

const halfStep = (sequence: Sequence) => 0.5 / (cycleFramesOf(sequence) * FINE_STEPS_PER_FRAME);

/** Puts `key` into the track in time order, replacing a key at the same time; returns the new track and the key's index. */
function insertKey<K extends { t: number }>(keys: readonly K[], key: K, tolerance: number): { keys: K[]; index: number } {
  const same = keys.findIndex((candidate) => Math.abs(candidate.t - key.t) <= tolerance);
  if (same >= 0) {
    const next = [...keys];
    next[same] = key;
    return { keys: next, index: same };
  }
  const index = keys.findIndex((candidate) => candidate.t > key.t);
  const at = index < 0 ? keys.length : index;
  return { keys: [...keys.slice(0, at), key, ...keys.slice(at)], index: at };
}

/** Moves a key to a time already placed by placeKeyTime (so it keeps its order). */
export function moveKey(sequence: Sequence, ref: KeyRef, t: number): Sequence {
  const keys = keysOf(sequence, ref.legId);
  const key = keys[ref.index];
  if (!key) throw new EditRefusal("That key no longer exists.");
  if (key.t === t) return sequence;
  const next = [...keys];
  next[ref.index] = { ...key, t };
  return withKeys(sequence, ref.legId, next);
}

export function updateLegKey(sequence: Sequence, ref: KeyRef, patch: Partial<Omit<LegKey, "t">>): Sequence {
  if (ref.legId === null) throw new EditRefusal("That is a body key.");
  const keys = sequence.legs[ref.legId].keys;
  const key = keys[ref.index];
  if (!key) throw new EditRefusal("That key no longer exists.");
  const next = [...keys];
  const merged: LegKey = { ...key, ...patch };
  for (const name of Object.keys(merged) as (keyof LegKey)[]) if (merged[name] === undefined) delete merged[name];
  next[ref.index] = merged;
  return withLegKeys(sequence, ref.legId, next);
}

export function updateBodyKey(sequence: Sequence, index: number, patch: Partial<Omit<BodyKey, "t">>): Sequence {
  const key = sequence.body.keys[index];
  if (!key) throw new EditRefusal("That key no longer exists.");
  const next = [...sequence.body.keys];
  const merged: BodyKey = { ...key, ...patch, pose: { ...key.pose, ...patch.pose } };
  if (merged.resting === false) delete merged.resting;
  next[index] = merged;
  return withBodyKeys(sequence, next);
}

/** A new leg key at t; the foot is where the leg is planned to be then (neutral body frame). */
export function addLegKey(sequence: Sequence, legId: string, key: LegKey): { sequence: Sequence; ref: KeyRef } {
  const keys = sequence.legs[legId]?.keys;
  if (!keys) throw new EditRefusal(`There is no leg ${legId} in this gait.`);
  if (keys.some((candidate) => Math.abs(candidate.t - key.t) <= halfStep(sequence))) throw new EditRefusal(`${legId} already has a key at this frame.`);
  if (sequence.loop && key.t >= 1) throw new EditRefusal("A loop's last frame is the first one again; add the key at frame 0.");
  const placed = insertKey(keys, key, 0);
  return { sequence: withLegKeys(sequence, legId, placed.keys), ref: { legId, index: placed.index } };
}

export function addBodyKey(sequence: Sequence, key: BodyKey): { sequence: Sequence; ref: KeyRef } {
  const keys = sequence.body.keys;
  if (keys.some((candidate) => Math.abs(candidate.t - key.t) <= halfStep(sequence))) throw new EditRefusal("The body already has a key at this frame.");
  if (sequence.loop && key.t >= 1) throw new EditRefusal("A loop's last frame is the first one again; add the key at frame 0.");
  const placed = insertKey(keys, key, 0);
  return { sequence: withBodyKeys(sequence, placed.keys), ref: { legId: null, index: placed.index } };
}

/** A copy of the key halfway to the next one (snapped to a frame), to reshape a segment without retyping it. */
export function duplicateKey(sequence: Sequence, ref: KeyRef): { sequence: Sequence; ref: KeyRef } {
  const keys = keysOf(sequence, ref.legId);
  const key = keys[ref.index];
  if (!key) throw new EditRefusal("That key no longer exists.");
  const frames = cycleFramesOf(sequence);
  const nextT = ref.index + 1 < keys.length ? keys[ref.index + 1].t : sequence.loop ? 1 + (keys[0]?.t ?? 0) : 1;
  let t = snapTime((key.t + nextT) / 2, frames);
  if (sequence.loop) t = wrapTime(t);
  const step = 1 / frames;
  const clash = (time: number) => keys.some((candidate) => Math.abs(candidate.t - time) < step / 2);
  if (clash(t) || (!sequence.loop && t > 1)) throw new EditRefusal(`No free frame between this key and the next on ${trackName(ref.legId)}.`);
  const copy = structuredClone(key);
  copy.t = t;
  const placed = insertKey(keys, copy, 0);
  return { sequence: withKeys(sequence, ref.legId, placed.keys), ref: { legId: ref.legId, index: placed.index } };
}

export function deleteKey(sequence: Sequence, ref: KeyRef): Sequence {
  const keys = keysOf(sequence, ref.legId);
  if (!keys[ref.index]) throw new EditRefusal("That key no longer exists.");
  if (ref.legId !== null && keys.length <= 1) throw new EditRefusal(`${ref.legId} needs at least one key; change this one instead.`);
  return withKeys(
    sequence,
    ref.legId,
    keys.filter((_, index) => index !== ref.index),
  );
}

/** The leg's lift-off time: its first swing key (the generator's phase), or null. */
export function liftOffTime(sequence: Sequence, legId: string): number | null {
  return sequence.legs[legId]?.keys.find((key) => key.contact === "swing")?.t ?? null;
}

/** The leg on the other side in the same row (front with front), or null. */
export function partnerLeg(robot: Robot, legId: string): string | null {
  const layout = legLayout(robot);
  const seat = layout.seat[legId];
  if (!seat) return null;
  return (seat.side === "left" ? layout.right : layout.left)[seat.row] ?? null;
}

/** A foot carried from one leg to another: the same offset from each leg's neutral foot, mirrored in y across sides. */
function carryFoot(robot: Robot, sequence: Sequence, fromLeg: string, toLeg: string, foot: Vec3 | undefined): Vec3 | undefined {
  if (!foot) return undefined;
  const neutral = neutralFeet(robot, sequence.generator.bodyHeightMm ?? robot.standHeight);
  const layout = legLayout(robot);
  const flip = layout.seat[fromLeg]?.side !== layout.seat[toLeg]?.side ? -1 : 1;
  const from = neutral[fromLeg];
  const to = neutral[toLeg];
  return [to[0] + (foot[0] - from[0]), to[1] + flip * (foot[1] - from[1]), to[2] + (foot[2] - from[2])];
}

function shiftFor(sequence: Sequence, fromLeg: string, toLeg: string, byPhase: boolean): number {
  if (!byPhase || !sequence.loop) return 0;
  const from = liftOffTime(sequence, fromLeg);
  const to = liftOffTime(sequence, toLeg);
  return from === null || to === null ? 0 : to - from;
}

/**
 * Copies a leg key to other legs: the foot keeps its offset from each leg's
 * neutral foot (mirrored across sides); with `byPhase` the time moves by the
 * legs' difference in lift-off time, so each leg does it at its own moment.
 */
export function copyKeyToLegs(robot: Robot, sequence: Sequence, ref: KeyRef, targets: readonly string[], byPhase: boolean): Sequence {
  if (ref.legId === null) throw new EditRefusal("Body keys have no other track to go to.");
  const key = sequence.legs[ref.legId].keys[ref.index];
  if (!key) throw new EditRefusal("That key no longer exists.");
  const frames = cycleFramesOf(sequence);
  let next = sequence;
  for (const target of targets) {
    if (target === ref.legId || !next.legs[target]) continue;
    let t = key.t + shiftFor(sequence, ref.legId, target, byPhase);
    t = sequence.loop ? wrapTime(snapTime(wrapTime(t), frames, true)) : Math.min(1, Math.max(0, t));
    const copy: LegKey = { ...structuredClone(key), t, foot: carryFoot(robot, sequence, ref.legId, target, key.foot) };
    if (!copy.foot) delete copy.foot;
    next = withLegKeys(next, target, insertKey(next.legs[target].keys, copy, halfStep(sequence)).keys);
  }
  return next;
}

/** Writes the leg's keys, mirrored left↔right, onto its partner on the other side, at the partner's own phase. */
export function mirrorTrack(robot: Robot, sequence: Sequence, legId: string): { sequence: Sequence; partner: string } {
  const partner = partnerLeg(robot, legId);
  if (!partner || !sequence.legs[partner]) throw new EditRefusal(`${legId} has no partner leg on the other side in the same row.`);
  const frames = cycleFramesOf(sequence);
  const shift = shiftFor(sequence, legId, partner, true);
  const keys = sequence.legs[legId].keys.map((key) => {
    const t = sequence.loop ? wrapTime(snapTime(wrapTime(key.t + shift), frames, true)) : key.t;
    const copy: LegKey = { ...structuredClone(key), t, foot: carryFoot(robot, sequence, legId, partner, key.foot) };
    if (!copy.foot) delete copy.foot;
    return copy;
  });
  keys.sort((a, b) => a.t - b.t);
  // Two keys wrapped onto one time would break the order: keep the first.
  const ordered = keys.filter((key, index) => index === 0 || key.t > keys[index - 1].t);
  return { sequence: withLegKeys(sequence, partner, ordered), partner };
}

/**
 * Whether the key's foot shapes the path. A stance keeps the foot where it
 * touched down, so only a key that follows a swing (a touch-down, or a point
 * the swing passes through) places the foot; the others follow by continuity.
 */
export function keyPlacesFoot(sequence: Sequence, ref: KeyRef): boolean {
  if (ref.legId === null) return false;
  const keys = sequence.legs[ref.legId]?.keys ?? [];
  if (!keys[ref.index]) return false;
  if (sequence.loop) {
    if (!keys.some((key) => key.contact === "swing")) return ref.index === 0;
    return keys[(ref.index - 1 + keys.length) % keys.length].contact === "swing";
  }
  return ref.index === 0 || keys[ref.index - 1].contact === "swing";
}
