// Whole-robot edits the robot editor offers on top of the kinematics core's
// leg helpers: mirror one side onto the other, copy a leg's geometry to others,
// add, remove and rename legs. Pure: they take a valid robot and return a new one.
import { copyLegGeometry, JOINT_NAMES, legRow, legSide, MAX_LEGS, mirrorLeg, type Leg, type LegSide, type Robot } from "~/kinematics";

const otherSide = (side: LegSide): LegSide => (side === "left" ? "right" : "left");

/** The leg on the other side in the same row, if there is one. */
export function counterpartOf(robot: Robot, leg: Leg): Leg | undefined {
  const side = otherSide(legSide(robot, leg));
  const row = legRow(robot, leg);
  return robot.legs.find((other) => legSide(robot, other) === side && legRow(robot, other) === row);
}

/** `LF` → `RF`, `L2` → `R2`; other ids get a suffix. Never one the robot already has. */
export function mirroredId(robot: Robot, id: string): string {
  const swapped = /^L/.test(id) ? `R${id.slice(1)}` : /^R/.test(id) ? `L${id.slice(1)}` : `${id}_M`;
  return uniqueId(robot, swapped);
}

function uniqueId(robot: Robot, wanted: string): string {
  const taken = new Set(robot.legs.map((leg) => leg.id));
  if (!taken.has(wanted)) return wanted;
  for (let suffix = 2; ; suffix += 1) {
    const candidate = `${wanted.slice(0, 14)}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

/** The `count` lowest servo channels no joint of the robot uses. */
export function freeChannels(robot: Robot, count: number): number[] {
  const used = new Set(robot.legs.flatMap((leg) => JOINT_NAMES.map((joint) => leg.joints[joint].servo.channel)));
  const out: number[] = [];
  for (let channel = 0; out.length < count && channel <= 255; channel += 1) if (!used.has(channel)) out.push(channel);
  return out;
}

export type MirrorResult = { robot: Robot; replaced: string[]; added: string[] };

/**
 * Every leg of side `from` mirrored onto the other side (mirrorLeg: y, mount yaw
 * and the coxa's limits and offset negated). A counterpart in the same row is
 * replaced but keeps its id and its servo mappings, which belong to the wiring;
 * a leg without one gets a new mirrored leg on free channels, as long as the robot
 * has room. The rest pose, if any, is mirrored with the coxa negated.
 */
export function mirrorSide(robot: Robot, from: LegSide): MirrorResult {
  const replaced: string[] = [];
  const added: string[] = [];
  let legs = [...robot.legs];
  const rest = robot.rest ? { ...robot.rest } : undefined;
  const negate = (value: number) => (value === 0 ? 0 : -value);
  for (const source of robot.legs) {
    if (legSide(robot, source) !== from) continue;
    const target = counterpartOf(robot, source);
    if (target) {
      const mirrored = mirrorLeg(source, target.id);
      for (const joint of JOINT_NAMES) mirrored.joints[joint].servo = { ...target.joints[joint].servo };
      if (target.side === undefined) delete mirrored.side;
      else mirrored.side = target.side;
      if (target.row === undefined) delete mirrored.row;
      else mirrored.row = target.row;
      legs = legs.map((leg) => (leg.id === target.id ? mirrored : leg));
      replaced.push(target.id);
      if (rest && robot.rest?.[source.id]) rest[target.id] = { ...robot.rest[source.id], coxa: negate(robot.rest[source.id].coxa) };
    } else if (legs.length < MAX_LEGS) {
      const current = { ...robot, legs };
      const [coxa, femur, tibia] = freeChannels(current, 3);
      const id = mirroredId(current, source.id);
      legs = [...legs, mirrorLeg(source, id, { coxa, femur, tibia })];
      added.push(id);
      if (rest && robot.rest?.[source.id]) rest[id] = { ...robot.rest[source.id], coxa: negate(robot.rest[source.id].coxa) };
    }
  }
  const next: Robot = { ...robot, legs };
  if (rest) next.rest = rest;
  return { robot: next, replaced, added };
}

/**
 * The link lengths and joint limits, offsets and speeds of `sourceId` copied to
 * each of `targetIds` (copyLegGeometry); legs on the other side get them mirrored.
 * Targets keep their id, mount and servo mappings.
 */
export function copyGeometryTo(robot: Robot, sourceId: string, targetIds: readonly string[]): Robot {
  const source = robot.legs.find((leg) => leg.id === sourceId);
  if (!source) return robot;
  const side = legSide(robot, source);
  const targets = new Set(targetIds.filter((id) => id !== sourceId));
  return {
    ...robot,
    legs: robot.legs.map((leg) => (targets.has(leg.id) ? copyLegGeometry(source, leg, { mirror: legSide(robot, leg) !== side }) : leg)),
  };
}

/** A copy of the last leg under a new id and free channels, mounted 30 mm further back. Null when the robot is full. */
export function addLeg(robot: Robot): Robot | null {
  if (robot.legs.length >= MAX_LEGS || robot.legs.length === 0) return null;
  const template = robot.legs[robot.legs.length - 1];
  const [coxa, femur, tibia] = freeChannels(robot, 3);
  if (tibia === undefined) return null;
  const id = uniqueId(robot, `L${robot.legs.length + 1}`);
  const leg: Leg = {
    ...structuredClone(template),
    id,
    mount: { ...template.mount, x: template.mount.x - 30 },
  };
  delete leg.row;
  leg.joints.coxa.servo.channel = coxa;
  leg.joints.femur.servo.channel = femur;
  leg.joints.tibia.servo.channel = tibia;
  const next: Robot = { ...robot, legs: [...robot.legs, leg] };
  if (robot.rest) next.rest = { ...robot.rest, [id]: { ...(robot.rest[template.id] ?? { coxa: 0, femur: 0, tibia: 0 }) } };
  return next;
}

/** The robot without leg `id` (and its rest angles). */
export function removeLeg(robot: Robot, id: string): Robot {
  const next: Robot = { ...robot, legs: robot.legs.filter((leg) => leg.id !== id) };
  if (robot.rest) {
    const { [id]: _removed, ...rest } = robot.rest;
    next.rest = rest;
  }
  return next;
}

/** A rest pose for every leg: each joint at 0° or the limit nearest to it. */
export function defaultRest(robot: Robot): NonNullable<Robot["rest"]> {
  const clamp = (min: number, max: number) => Math.min(max, Math.max(min, 0));
  return Object.fromEntries(
    robot.legs.map((leg) => [
      leg.id,
      {
        coxa: clamp(leg.joints.coxa.minDeg, leg.joints.coxa.maxDeg),
        femur: clamp(leg.joints.femur.minDeg, leg.joints.femur.maxDeg),
        tibia: clamp(leg.joints.tibia.minDeg, leg.joints.tibia.maxDeg),
      },
    ]),
  );
}
