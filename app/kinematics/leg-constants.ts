// What a leg solve needs, computed once per leg: trigonometry of the mount
// yaw, squared lengths, offsets in radians. The hot-path solver keeps these for
// a whole sequence; the one-off solveLeg builds them per call.
import { RAD_PER_DEG } from "./angles";
import { legProblem } from "./definition-check";
import type { Leg } from "./robot";

export type LegConstants = {
  id: string;
  /**
   * Null for a leg within the format's ranges, as parseRobot returns it; else
   * the first number outside, in words. The solve refuses such a leg (its
   * squares may overflow, its offsets be NaN) rather than answer NaN.
   */
  problem: string | null;
  mountXMm: number;
  mountYMm: number;
  mountZMm: number;
  yawDeg: number;
  cosYaw: number;
  sinYaw: number;
  coxaMm: number;
  femurMm: number;
  tibiaMm: number;
  /** femur² + tibia², for the law of cosines. */
  linkSquaresSum: number;
  /** 2·femur·tibia, for the law of cosines. */
  twiceFemurTibia: number;
  /** Farthest the foot can be from the femur joint: femur + tibia. */
  reachMaxMm: number;
  /** Nearest the foot can be to the femur joint: |femur − tibia|. */
  reachMinMm: number;
  coxaOffsetRad: number;
  femurOffsetRad: number;
  tibiaOffsetRad: number;
  coxaOffsetDeg: number;
  femurOffsetDeg: number;
  tibiaOffsetDeg: number;
  coxaMinDeg: number;
  coxaMaxDeg: number;
  femurMinDeg: number;
  femurMaxDeg: number;
  tibiaMinDeg: number;
  tibiaMaxDeg: number;
  /** Middles of the joint ranges: a solved servo angle is taken within ±180° of them. */
  coxaMidDeg: number;
  femurMidDeg: number;
  tibiaMidDeg: number;
};

export function legConstants(leg: Leg): LegConstants {
  const { coxa, femur, tibia } = leg.joints;
  const yawRad = leg.mount.yawDeg * RAD_PER_DEG;
  return {
    id: leg.id,
    problem: legProblem(leg),
    mountXMm: leg.mount.x,
    mountYMm: leg.mount.y,
    mountZMm: leg.mount.z,
    yawDeg: leg.mount.yawDeg,
    cosYaw: Math.cos(yawRad),
    sinYaw: Math.sin(yawRad),
    coxaMm: leg.coxa,
    femurMm: leg.femur,
    tibiaMm: leg.tibia,
    linkSquaresSum: leg.femur * leg.femur + leg.tibia * leg.tibia,
    twiceFemurTibia: 2 * leg.femur * leg.tibia,
    reachMaxMm: leg.femur + leg.tibia,
    reachMinMm: Math.abs(leg.femur - leg.tibia),
    coxaOffsetRad: coxa.zeroOffsetDeg * RAD_PER_DEG,
    femurOffsetRad: femur.zeroOffsetDeg * RAD_PER_DEG,
    tibiaOffsetRad: tibia.zeroOffsetDeg * RAD_PER_DEG,
    coxaOffsetDeg: coxa.zeroOffsetDeg,
    femurOffsetDeg: femur.zeroOffsetDeg,
    tibiaOffsetDeg: tibia.zeroOffsetDeg,
    coxaMinDeg: coxa.minDeg,
    coxaMaxDeg: coxa.maxDeg,
    femurMinDeg: femur.minDeg,
    femurMaxDeg: femur.maxDeg,
    tibiaMinDeg: tibia.minDeg,
    tibiaMaxDeg: tibia.maxDeg,
    coxaMidDeg: (coxa.minDeg + coxa.maxDeg) / 2,
    femurMidDeg: (femur.minDeg + femur.maxDeg) / 2,
    tibiaMidDeg: (tibia.minDeg + tibia.maxDeg) / 2,
  };
}

const cache = new WeakMap<Leg, LegConstants>();

/**
 * legConstants, kept per leg object for the one-off solveLeg/forwardLeg calls.
 * A hit is checked field by field against the leg, so a definition edited in
 * place is never solved with stale numbers.
 */
export function cachedLegConstants(leg: Leg): LegConstants {
  const known = cache.get(leg);
  if (known !== undefined && matches(known, leg)) return known;
  const fresh = legConstants(leg);
  cache.set(leg, fresh);
  return fresh;
}

function matches(k: LegConstants, leg: Leg): boolean {
  const { mount, joints } = leg;
  const { coxa, femur, tibia } = joints;
  return (
    k.id === leg.id &&
    k.mountXMm === mount.x &&
    k.mountYMm === mount.y &&
    k.mountZMm === mount.z &&
    k.yawDeg === mount.yawDeg &&
    k.coxaMm === leg.coxa &&
    k.femurMm === leg.femur &&
    k.tibiaMm === leg.tibia &&
    k.coxaOffsetDeg === coxa.zeroOffsetDeg &&
    k.femurOffsetDeg === femur.zeroOffsetDeg &&
    k.tibiaOffsetDeg === tibia.zeroOffsetDeg &&
    k.coxaMinDeg === coxa.minDeg &&
    k.coxaMaxDeg === coxa.maxDeg &&
    k.femurMinDeg === femur.minDeg &&
    k.femurMaxDeg === femur.maxDeg &&
    k.tibiaMinDeg === tibia.minDeg &&
    k.tibiaMaxDeg === tibia.maxDeg
  );
}
