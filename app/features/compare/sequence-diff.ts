// A key-by-key diff of two gait sequences, track by track (each leg, and the
// body): which keys were added, removed, moved in time, or changed their
// easing, contact, foot, swing height or pose. Pure, so it runs in tests, on
// the server and in the browser alike.
//
// Keys carry no identity, so the two tracks are aligned like two strings
// (Needleman–Wunsch, an edit distance over the keys in time order): leaving a
// key unmatched costs 1, pairing two keys costs their distance in cycle time
// (a quarter cycle costs 1) plus 1.5 when their contact differs. Two keys are
// therefore paired only when that is cheaper than calling one removed and the
// other added. A key dragged across the seam of a loop (t 0.95 → 0.02) changes
// its place in the order and shows as removed and added.
import { CSS_EASE, type BodyKey, type Ease, type LegKey, type Sequence } from "../../gait/index";
import { changedFields, type FieldChange } from "../robots/index";

export type KeyChange = "time" | "contact" | "foot" | "ease" | "apex" | "pose" | "resting";
export type KeyStatus = "added" | "removed" | "changed" | "same";

export type KeySide<K> = { index: number; key: K };

export type KeyDiff<K = LegKey | BodyKey> = {
  status: KeyStatus;
  a: KeySide<K> | null;
  b: KeySide<K> | null;
  /** What differs between the paired keys (empty unless status is "changed"). */
  changes: KeyChange[];
};

export type DiffCounts = {
  added: number;
  removed: number;
  /** Paired keys whose time differs. */
  moved: number;
  /** Paired keys whose easing differs. */
  easing: number;
  /** Paired keys with any difference (moved, easing or another). */
  changed: number;
  same: number;
};

export type TrackDiff = {
  /** A leg id, or "body". */
  track: string;
  kind: "leg" | "body";
  /** Whether the track exists in A, in B, or both. */
  presence: "both" | "only-a" | "only-b";
  keys: KeyDiff[];
  counts: DiffCounts;
};

export type SequenceDiff = {
  /** Timing and generator settings that differ (cycleMs, fps, loop, generator.*). */
  settings: FieldChange[];
  tracks: TrackDiff[];
  counts: DiffCounts;
};

/** Below these, numbers count as equal: cycle fraction, mm, easing control points. */
export const DIFF_TOLERANCE = { t: 1e-9, mm: 1e-3, ease: 1e-9, deg: 1e-6 } as const;

const GAP_COST = 1;
const QUARTER_CYCLE_COST = 0.25;
const CONTACT_MISMATCH_COST = 1.5;
// Above this many pairings the alignment would take too long; keys are then paired by position.
const MAX_ALIGNMENT_CELLS = 4_000_000;

const emptyCounts = (): DiffCounts => ({ added: 0, removed: 0, moved: 0, easing: 0, changed: 0, same: 0 });

function addCounts(into: DiffCounts, from: DiffCounts): void {
  into.added += from.added;
  into.removed += from.removed;
  into.moved += from.moved;
  into.easing += from.easing;
  into.changed += from.changed;
  into.same += from.same;
}

function countKeys(keys: readonly KeyDiff[]): DiffCounts {
  const counts = emptyCounts();
  for (const entry of keys) {
    if (entry.status === "added") counts.added += 1;
    else if (entry.status === "removed") counts.removed += 1;
    else if (entry.status === "same") counts.same += 1;
    else {
      counts.changed += 1;
      if (entry.changes.includes("time")) counts.moved += 1;
      if (entry.changes.includes("ease")) counts.easing += 1;
    }
  }
  return counts;
}

const near = (a: number, b: number, tolerance: number) => Math.abs(a - b) <= tolerance;

function sameNumbers(a: readonly number[] | undefined, b: readonly number[] | undefined, tolerance: number): boolean {
  if (a === undefined || b === undefined) return a === b;
  return a.length === b.length && a.every((value, index) => near(value, b[index], tolerance));
}

/** Distance in cycle time; round the seam for a loop, where t = 1 is t = 0. */
function timeDistance(a: number, b: number, loop: boolean): number {
  const straight = Math.abs(a - b);
  return loop ? Math.min(straight, 1 - straight) : straight;
}

type TrackContext = { loop: boolean; stepHeightA: number; stepHeightB: number };

const easeOf = (key: { ease?: Ease }): readonly number[] => key.ease ?? CSS_EASE;

function legKeyChanges(a: LegKey, b: LegKey, context: TrackContext): KeyChange[] {
  const changes: KeyChange[] = [];
  if (!near(a.t, b.t, DIFF_TOLERANCE.t)) changes.push("time");
  if (a.contact !== b.contact) changes.push("contact");
  if (!sameNumbers(a.foot, b.foot, DIFF_TOLERANCE.mm)) changes.push("foot");
  if (!sameNumbers(easeOf(a), easeOf(b), DIFF_TOLERANCE.ease)) changes.push("ease");
  // The swing height only shapes a swing; it defaults to the generator's step height.
  if (a.contact === "swing" || b.contact === "swing") {
    const apexA = a.apexMm ?? context.stepHeightA;
    const apexB = b.apexMm ?? context.stepHeightB;
    if (!near(apexA, apexB, DIFF_TOLERANCE.mm)) changes.push("apex");
  }
  return changes;
}

const POSE_FIELDS = ["x", "y", "z", "roll", "pitch", "yaw"] as const;

function bodyKeyChanges(a: BodyKey, b: BodyKey): KeyChange[] {
  const changes: KeyChange[] = [];
  if (!near(a.t, b.t, DIFF_TOLERANCE.t)) changes.push("time");
  if (
    !POSE_FIELDS.every((field) =>
      near(a.pose[field] ?? 0, b.pose[field] ?? 0, field === "x" || field === "y" || field === "z" ? DIFF_TOLERANCE.mm : DIFF_TOLERANCE.deg),
    )
  ) {
    changes.push("pose");
  }
  if (!sameNumbers(easeOf(a), easeOf(b), DIFF_TOLERANCE.ease)) changes.push("ease");
  if (Boolean(a.resting) !== Boolean(b.resting)) changes.push("resting");
  return changes;
}

/** Pairs the keys of two tracks (indices into a and b; null where a key has no partner), in time order. */
export function alignKeys<K extends { t: number; contact?: string }>(a: readonly K[], b: readonly K[], loop: boolean): [number | null, number | null][] {
  const n = a.length;
  const m = b.length;
  if (n * m > MAX_ALIGNMENT_CELLS) {
    const pairs: [number | null, number | null][] = [];
    for (let index = 0; index < Math.max(n, m); index += 1) pairs.push([index < n ? index : null, index < m ? index : null]);
    return pairs;
  }
  const pairCost = (i: number, j: number) =>
    timeDistance(a[i].t, b[j].t, loop) / QUARTER_CYCLE_COST + (a[i].contact !== b[j].contact ? CONTACT_MISMATCH_COST : 0);
  // cost[i][j]: the cheapest alignment of a[0..i) with b[0..j).
  const width = m + 1;
  const cost = new Float64Array((n + 1) * width);
  for (let i = 1; i <= n; i += 1) cost[i * width] = i * GAP_COST;
  for (let j = 1; j <= m; j += 1) cost[j] = j * GAP_COST;
  for (let i = 1; i <= n; i += 1) {
    for (let j = 1; j <= m; j += 1) {
      const pair = cost[(i - 1) * width + j - 1] + pairCost(i - 1, j - 1);
      const removed = cost[(i - 1) * width + j] + GAP_COST;
      const added = cost[i * width + j - 1] + GAP_COST;
      cost[i * width + j] = Math.min(pair, removed, added);
    }
  }
  const pairs: [number | null, number | null][] = [];
  let i = n;
  let j = m;
  while (i > 0 || j > 0) {
    const here = cost[i * width + j];
    // Prefer a pairing on ties, so equal keys always pair up.
    if (i > 0 && j > 0 && Math.abs(here - (cost[(i - 1) * width + j - 1] + pairCost(i - 1, j - 1))) < 1e-12) {
      pairs.push([i - 1, j - 1]);
      i -= 1;
      j -= 1;
    } else if (i > 0 && Math.abs(here - (cost[(i - 1) * width + j] + GAP_COST)) < 1e-12) {
      pairs.push([i - 1, null]);
      i -= 1;
    } else {
      pairs.push([null, j - 1]);
      j -= 1;
    }
  }
  pairs.reverse();
  // Within a run of unpaired keys, list them in time order, removed before added at equal times.
  const timeOf = ([i, j]: [number | null, number | null]) => (i !== null ? a[i].t : b[j!].t);
  for (let start = 0; start < pairs.length;) {
    let end = start;
    while (end < pairs.length && (pairs[end][0] === null || pairs[end][1] === null)) end += 1;
    if (end - start > 1) {
      const run = pairs.slice(start, end).sort((x, y) => timeOf(x) - timeOf(y) || (x[0] === null ? 1 : 0) - (y[0] === null ? 1 : 0));
      pairs.splice(start, run.length, ...run);
    }
    start = Math.max(end, start + 1);
  }
  return pairs;
}

function diffTrack<K extends LegKey | BodyKey>(a: readonly K[], b: readonly K[], loop: boolean, changesOf: (a: K, b: K) => KeyChange[]): KeyDiff[] {
  return alignKeys(a as readonly (K & { contact?: string })[], b as readonly (K & { contact?: string })[], loop).map(([i, j]): KeyDiff => {
    if (i === null) return { status: "added", a: null, b: { index: j!, key: b[j!] }, changes: [] };
    if (j === null) return { status: "removed", a: { index: i, key: a[i] }, b: null, changes: [] };
    const changes = changesOf(a[i], b[j]);
    return { status: changes.length > 0 ? "changed" : "same", a: { index: i, key: a[i] }, b: { index: j, key: b[j] }, changes };
  });
}

/** The settings of a sequence that are not keys: timing and the generator's parameters. */
const settingsOf = (sequence: Sequence) => ({ cycleMs: sequence.cycleMs, fps: sequence.fps, loop: sequence.loop, generator: sequence.generator });

/** Everything that differs from A to B: settings, then each track's keys (legs in A's order, then B's new legs, then the body). */
export function diffSequences(a: Sequence, b: Sequence): SequenceDiff {
  // A one-shot move against a loop: the seam only counts when both loop.
  const loop = a.loop && b.loop;
  const context: TrackContext = {
    loop,
    stepHeightA: a.generator.stepHeightMm,
    stepHeightB: b.generator.stepHeightMm,
  };
  const legIds = [...Object.keys(a.legs), ...Object.keys(b.legs).filter((id) => !(id in a.legs))];
  const tracks: TrackDiff[] = legIds.map((legId) => {
    const keysA = a.legs[legId]?.keys ?? [];
    const keysB = b.legs[legId]?.keys ?? [];
    const keys = diffTrack<LegKey>(keysA, keysB, loop, (x, y) => legKeyChanges(x, y, context));
    const presence = !(legId in b.legs) ? "only-a" : !(legId in a.legs) ? "only-b" : "both";
    return { track: legId, kind: "leg", presence, keys, counts: countKeys(keys) };
  });
  const bodyKeys = diffTrack<BodyKey>(a.body.keys, b.body.keys, loop, bodyKeyChanges);
  if (a.body.keys.length > 0 || b.body.keys.length > 0) {
    tracks.push({ track: "body", kind: "body", presence: "both", keys: bodyKeys, counts: countKeys(bodyKeys) });
  }
  const counts = emptyCounts();
  for (const track of tracks) addCounts(counts, track.counts);
  return { settings: changedFields(settingsOf(a), settingsOf(b)), tracks, counts };
}

const CHANGE_LABELS: Record<KeyChange, string> = {
  time: "moved",
  contact: "changed contact",
  foot: "changed foot",
  ease: "changed easing",
  apex: "changed swing height",
  pose: "changed pose",
  resting: "changed resting",
};

/** "moved, changed easing" */
export function describeKeyChanges(changes: readonly KeyChange[]): string {
  return changes.map((change) => CHANGE_LABELS[change]).join(", ");
}
