// A leg's keys turned into pieces that sampling can walk through in time order.
// Keys are the source of truth (DESIGN.md, "Gait sequence"): a key's contact
// holds until the next key (half-open), a stance foot stays where it is in the
// world, a swing goes from where the foot is to the next key's foot. A key
// without a foot takes the generator's placement. Continuity decides where a
// segment starts: after a swing, at the key's foot; after a stance, wherever
// the world-fixed foot has come to. So a stance never jumps, and a loop is
// periodic in the body frame because its anchor is a key's own foot.
import type { Vec3 } from "../../kinematics/index";
import { CSS_EASE, type Contact, type LegKey } from "../sequence";
import { easingFor, type EasingFunction } from "./easing";
import { carryStance, placeStanceFoot } from "./stance";
import { createPlanar, headingToWorld, travelBy, type Travel } from "./travel";

/** Frames this close (cycle fraction) to a key take the key's state: round-off in key times never flips a contact. */
export const TIME_EPSILON = 1e-9;

export type LegPiece = {
  /** Sampled times in [from, to) use this piece. */
  from: number;
  to: number;
  contact: Contact;
  /** True for a stance, and for the hold before the first or after the last key of a one-shot move. */
  worldFixed: boolean;
  /** The segment's own start and end time (may lie outside [0, 1] for the wrap of a loop). */
  startTime: number;
  endTime: number;
  /** World points (mm) where the segment starts and, for a swing, ends. */
  worldFrom: Float64Array;
  worldTo: Float64Array;
  easing: EasingFunction;
  apexMm: number;
};

export type LegTrackPlan = {
  pieces: LegPiece[];
  /** Fraction of the cycle (or move) the foot is in stance, from the keys. */
  dutyFactor: number;
  /** Each key's foot in the neutral body frame, defaults filled in. */
  keyFeet: Vec3[];
};

export type LegTrackOptions = {
  loop: boolean;
  travel: Travel;
  /** The leg's neutral foot (neutral body frame, mm), where keys without a foot are placed around. */
  neutral: Readonly<Vec3>;
  defaultApexMm: number;
};

const frameScratch = createPlanar();

function worldPoint(travel: Travel, time: number, point: Readonly<Vec3>): Float64Array {
  const out = new Float64Array(3);
  headingToWorld(travelBy(travel, time, frameScratch), travel.bodyHeightMm, point[0], point[1], point[2], out, 0);
  return out;
}

/** Where keys without a foot go: stance keys ahead of neutral by half the travel of their stance, lift-off keys behind. */
function resolveKeyFeet(keys: readonly LegKey[], options: LegTrackOptions): Vec3[] {
  const { loop, travel, neutral } = options;
  const count = keys.length;
  const timeAt = (index: number): number => (loop ? keys[((index % count) + count) % count].t + Math.floor(index / count) : keys[index].t);
  const contactAt = (index: number): Contact => keys[((index % count) + count) % count].contact;
  return keys.map((key, index) => {
    if (key.foot) return [key.foot[0], key.foot[1], key.foot[2]];
    if (key.contact === "stance") {
      // Length of the stance that starts here: up to the next swing key.
      for (let next = index + 1; loop ? next <= index + count : next <= count; next += 1) {
        if (!loop && next === count) return placeStanceFoot(travel, neutral, 1 - key.t, "touch-down");
        if (contactAt(next) === "swing") return placeStanceFoot(travel, neutral, timeAt(next) - key.t, "touch-down");
      }
      return [neutral[0], neutral[1], neutral[2]];
    }
    // A lift-off: the stance that ends here started at the earliest stance key of the run before it.
    let first = index;
    while ((loop ? first > index - count + 1 : first > 0) && contactAt(first - 1) === "stance") first -= 1;
    if (first === index) return [neutral[0], neutral[1], neutral[2]];
    return placeStanceFoot(travel, neutral, key.t - timeAt(first), "lift-off");
  });
}

type Segment = { startTime: number; endTime: number; contact: Contact; worldFixed: boolean; key: LegKey; target: Vec3; start: Vec3 };

/** Compiles a leg's keys (strictly increasing t, as parseSequence guarantees) into pieces. */
export function compileLegTrack(keys: readonly LegKey[], options: LegTrackOptions): LegTrackPlan {
  const { loop, travel } = options;
  const feet = resolveKeyFeet(keys, options);
  const count = keys.length;
  const segments: Segment[] = [];
  const origin: Vec3 = [0, 0, 0];
  if (loop) {
    for (let index = 0; index < count; index += 1) {
      const key = keys[index];
      const next = (index + 1) % count;
      segments.push({
        startTime: key.t,
        endTime: index + 1 < count ? keys[next].t : keys[0].t + 1,
        contact: key.contact,
        worldFixed: key.contact === "stance",
        key,
        target: feet[next],
        start: origin,
      });
    }
  } else {
    if (keys[0].t > TIME_EPSILON) {
      segments.push({ startTime: keys[0].t, endTime: keys[0].t, contact: keys[0].contact, worldFixed: true, key: keys[0], target: feet[0], start: origin });
    }
    for (let index = 0; index < count; index += 1) {
      const key = keys[index];
      const last = index + 1 === count;
      segments.push({
        startTime: key.t,
        endTime: last ? 1 : keys[index + 1].t,
        contact: key.contact,
        worldFixed: last || key.contact === "stance",
        key,
        target: last ? feet[index] : feet[index + 1],
        start: origin,
      });
    }
  }

  // Starts by continuity, from an anchor that is a key's own foot.
  const keyIndexOf = (segment: Segment): number => keys.indexOf(segment.key);
  let anchor = 0;
  if (loop) {
    const afterSwing = segments.findIndex((_, index) => segments[(index - 1 + count) % count].contact === "swing");
    anchor = afterSwing < 0 ? 0 : afterSwing;
  }
  const total = segments.length;
  for (let step = 0; step < total; step += 1) {
    const index = loop ? (anchor + step) % total : step;
    const segment = segments[index];
    if (step === 0) {
      segment.start = feet[keyIndexOf(segment)];
      continue;
    }
    const previous = segments[loop ? (index - 1 + total) % total : index - 1];
    if (!previous.worldFixed) {
      segment.start = previous.target;
    } else {
      let delta = segment.startTime - previous.startTime;
      if (delta < 0) delta += 1;
      segment.start = carryStance(travel, previous.start, delta);
    }
  }

  const pieces: LegPiece[] = [];
  const makePiece = (segment: Segment, from: number, to: number, shift: number): LegPiece => ({
    from,
    to,
    contact: segment.contact,
    worldFixed: segment.worldFixed,
    startTime: segment.startTime + shift,
    endTime: segment.endTime + shift,
    worldFrom: worldPoint(travel, segment.startTime + shift, segment.start),
    worldTo: worldPoint(travel, segment.endTime + shift, segment.target),
    easing: easingFor(segment.key.ease ?? CSS_EASE),
    apexMm: segment.key.apexMm ?? options.defaultApexMm,
  });
  let dutyFactor = 0;
  if (loop) {
    const wrap = segments[count - 1];
    if (keys[0].t > TIME_EPSILON) pieces.push(makePiece(wrap, 0, keys[0].t, -1));
    segments.forEach((segment, index) => pieces.push(makePiece(segment, segment.startTime, index + 1 < count ? segment.endTime : 1, 0)));
    for (const segment of segments) if (segment.contact === "stance") dutyFactor += segment.endTime - segment.startTime;
  } else {
    segments.forEach((segment, index) => {
      const hold = index === 0 && segment.endTime === segment.startTime;
      const from = hold ? 0 : segment.startTime;
      const to = hold ? segment.startTime : index + 1 < segments.length ? segments[index + 1].startTime : Number.POSITIVE_INFINITY;
      pieces.push(makePiece(segment, from, to, 0));
      if (segment.contact === "stance") dutyFactor += Math.min(1, to) - from;
    });
  }
  return { pieces, dutyFactor, keyFeet: feet };
}

/** Plain time fraction s of the segment at time t (0 for a zero-length segment). */
export function pieceFraction(piece: LegPiece, time: number): number {
  const span = piece.endTime - piece.startTime;
  return span > 0 ? (time - piece.startTime) / span : 0;
}
