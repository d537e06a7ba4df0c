// Robot import from URDF (the Unified Robot Description Format's XML
// specification: <joint type> with <parent link>, <child link>, <origin xyz rpy>
// in metres and radians, rpy as fixed-axis roll, pitch, yaw, <axis xyz>, and
// <limit lower upper velocity> in radians and rad/s).
//
// Each leg is a chain from the base link: coxa → femur → tibia (three revolute
// joints) → a fixed joint whose origin is the foot tip. The mapping onto our
// leg plane, derived from the joint transforms Trans(xyz)·Rz·Ry·Rx(rpy):
// - coxa: origin xyz = mount, rpy yaw = mount yaw (roll and pitch must be 0),
//   axis ±z; our angle = ±q.
// - femur: origin (a, 0, d) in the coxa frame: coxa length a, mount z + d;
//   rpy pitch p allowed; axis ±y. A URDF rotation about +y lowers the knee,
//   ours raises it, so our angle = ∓q.
// - femur length and direction from the tibia origin (a₂, 0, d₂):
//   f = |(a₂, d₂)|, zero offset = atan2(d₂, a₂) − p_femur.
// - tibia length and direction from the foot origin (a₃, 0, d₃):
//   t = |(a₃, d₃)|, zero offset = 90° − p_tibia + atan2(d₃, a₃) − atan2(d₂, a₂)
//   (our tibia zero is at right angles to the femur, pointing down).
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { DEG_PER_RAD, RAD_PER_DEG } from "./angles";
import { formatPath, type DefinitionIssue } from "./issues";
import { JOINT_NAMES, parseRobot, ROBOT_FORMAT, type JointName, type Robot } from "./robot";

export type UrdfImportOptions = {
  /** The link that is the body; default: the root of the link tree. */
  baseLink?: string;
  /** Robot name; default: the URDF robot's name. */
  name?: string;
  /** Default body height above the ground (URDF has none); default 0.55 × the shortest femur + tibia. */
  standHeightMm?: number;
};

export type UrdfImportResult = { ok: true; robot: Robot; report: string[] } | { ok: false; issues: DefinitionIssue[] };

// Defaults for what URDF does not describe, said in the report (common practice
// for hobby servos: 1500 µs centre, about 500–2500 µs over 180°).
export const URDF_SERVO_DEFAULTS = { reversed: false, centerUs: 1500, usPerDeg: 11.1, minUs: 500, maxUs: 2500 } as const;
export const URDF_DEFAULT_SPEED_DEG_S = 300;
export const URDF_DEFAULT_MASS_KG = 1;

// A DOCTYPE anywhere but in a comment or CDATA section; XML names are
// case-sensitive, but the parser would read a lower-case one too.
const DOCTYPE = /<!DOCTYPE/i;
const COMMENT_OR_CDATA = /<!--[\s\S]*?-->|<!\[CDATA\[[\s\S]*?\]\]>/g;
// How deep elements may nest: URDF itself goes four or five levels
// (robot > link > visual > geometry > mesh); vendor extensions a few more.
const MAX_NESTING = 100;

const MM_PER_M = 1000;
// A URDF number closer to zero than this counts as zero (1 µm, 1 µrad).
const ZERO_LENGTH_M = 1e-6;
const ZERO_ANGLE_RAD = 1e-6;

type UrdfJoint = {
  name: string;
  type: string;
  parent: string;
  child: string;
  xyz: [number, number, number];
  rpy: [number, number, number];
  axis: [number, number, number];
  limit?: { lower: number; upper: number; velocity?: number };
};

class RefusedImport extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message);
  }
}

function refuse(path: readonly (string | number)[], message: string): never {
  throw new RefusedImport(formatPath(path), message);
}

// Twelve significant digits: drops the float noise of metres→mm and radians→degrees.
function tidy(value: number): number {
  const rounded = Number(value.toPrecision(12));
  return rounded === 0 ? 0 : rounded;
}

const roundTo = (value: number, decimals: number) => {
  const rounded = Math.round(value * 10 ** decimals) / 10 ** decimals;
  return rounded === 0 ? 0 : rounded;
};

// Degrees are kept to 0.001°, a hundredth of a table's 0.1° step.
const ANGLE_DECIMALS = 3;
// A value written to this many significant digits or more is read as a conversion from degrees.
const CONVERTED_DIGITS = 4;

/** How a number was written, as far as its shortest decimal form tells: its significant digits, and half a unit of its last digit. */
function writtenPrecision(value: number): { digits: number; halfStep: number } {
  const match = /^-?(\d+)(?:\.(\d+))?(?:e([+-]\d+))?$/.exec(String(value));
  if (!match) return { digits: 0, halfStep: 0 };
  const [, whole, fraction = "", exponent = "0"] = match;
  const digits = `${whole}${fraction}`.replace(/^0+/, "").length;
  return { digits, halfStep: 0.5 * 10 ** -(fraction.length - Number(exponent)) };
}

/**
 * Degrees from a URDF value in radians (an angle, or a speed in rad/s), as the
 * file means it. Radians written to four or more significant digits are
 * usually whole degrees converted and cut short (0.7854 for 45°, which is
 * 45.0001052296°): such a value reads as the degree value with the fewest
 * decimals, up to three, that lies within its last digit's rounding. A value
 * written shorter (0.5) is taken as written. Either way, to 0.001° (decision 014).
 */
function degreesFromRadians(radians: number): number {
  const exact = radians * DEG_PER_RAD;
  const { digits, halfStep } = writtenPrecision(radians);
  if (digits >= CONVERTED_DIGITS) {
    // A few ulps on top of the written step: the product with RAD_PER_DEG rounds too.
    const tolerance = halfStep + 4 * Number.EPSILON * Math.abs(radians);
    for (let decimals = 0; decimals < ANGLE_DECIMALS; decimals += 1) {
      const candidate = roundTo(exact, decimals);
      if (Math.abs(candidate * RAD_PER_DEG - radians) <= tolerance) return candidate;
    }
  }
  return roundTo(exact, ANGLE_DECIMALS);
}

/** A number as the report shows it: at most three decimals. */
const shown = (value: number) => String(roundTo(value, 3));

type XmlNode = Record<string, unknown>;

function asNodes(value: unknown): XmlNode[] {
  if (value === undefined || value === null) return [];
  return (Array.isArray(value) ? value : [value]).filter((item): item is XmlNode => typeof item === "object" && item !== null);
}

function attribute(node: XmlNode | undefined, name: string): string | undefined {
  const value = node?.[`@_${name}`];
  return value === undefined ? undefined : String(value);
}

function triple(text: string | undefined, fallback: [number, number, number], where: (string | number)[]): [number, number, number] {
  if (text === undefined) return fallback;
  const parts = text.trim().split(/\s+/).map(Number);
  if (parts.length !== 3 || parts.some((part) => !Number.isFinite(part))) refuse(where, `must be three numbers (got "${text}")`);
  return [parts[0], parts[1], parts[2]];
}

function readJoint(node: XmlNode): UrdfJoint {
  const name = attribute(node, "name") ?? "";
  const where = ["joint", name];
  if (!name) refuse(["joint"], "a <joint> has no name");
  const parent = attribute(asNodes(node.parent)[0], "link");
  const child = attribute(asNodes(node.child)[0], "link");
  if (!parent || !child) refuse(where, `joint "${name}" needs <parent link> and <child link>`);
  const origin = asNodes(node.origin)[0];
  const limitNode = asNodes(node.limit)[0];
  const numberOf = (text: string | undefined, fallback: number, key: string): number => {
    if (text === undefined) return fallback;
    const value = Number(text);
    if (!Number.isFinite(value)) refuse([...where, "limit", key], `joint "${name}": limit ${key} must be a number (got "${text}")`);
    return value;
  };
  return {
    name,
    type: attribute(node, "type") ?? "",
    parent,
    child,
    xyz: triple(attribute(origin, "xyz"), [0, 0, 0], [...where, "origin", "xyz"]),
    rpy: triple(attribute(origin, "rpy"), [0, 0, 0], [...where, "origin", "rpy"]),
    // The specification's default axis is (1, 0, 0).
    axis: triple(attribute(asNodes(node.axis)[0], "xyz"), [1, 0, 0], [...where, "axis"]),
    limit: limitNode
      ? {
          // The specification lets lower and upper default to 0.
          lower: numberOf(attribute(limitNode, "lower"), 0, "lower"),
          upper: numberOf(attribute(limitNode, "upper"), 0, "upper"),
          velocity: attribute(limitNode, "velocity") === undefined ? undefined : numberOf(attribute(limitNode, "velocity"), 0, "velocity"),
        }
      : undefined,
  };
}

/** The sign of a unit axis along `index` (0 x, 1 y, 2 z), or 0 if the axis points elsewhere. */
function axisSign(axis: [number, number, number], index: number): number {
  const length = Math.hypot(axis[0], axis[1], axis[2]);
  if (length === 0) return 0;
  for (let other = 0; other < 3; other += 1) {
    if (other !== index && Math.abs(axis[other] / length) > ZERO_ANGLE_RAD) return 0;
  }
  return Math.sign(axis[index]);
}

function checkRevolute(joint: UrdfJoint, role: JointName): void {
  const where = ["joint", joint.name];
  if (joint.type === "continuous") refuse([...where, "type"], `joint "${joint.name}" (${role}) is continuous: a leg joint must be revolute, with limits`);
  if (joint.type !== "revolute")
    refuse([...where, "type"], `joint "${joint.name}" (${role}) is ${joint.type || "of no type"}: only revolute joints make a leg`);
  if (!joint.limit) refuse([...where, "limit"], `joint "${joint.name}" (${role}) has no <limit lower upper>: a leg joint needs its limits`);
}

function degrees(rad: number): string {
  return `${shown(rad * DEG_PER_RAD)}°`;
}

/** Imports a robot from URDF XML; refuses chains it cannot map, naming the joint. */
export function importUrdf(xml: string, options: UrdfImportOptions = {}): UrdfImportResult {
  try {
    return importOrRefuse(xml, options);
  } catch (error) {
    if (error instanceof RefusedImport) return { ok: false, issues: [{ path: error.path, message: error.message }] };
    throw error;
  }
}

function importOrRefuse(xml: string, options: UrdfImportOptions): UrdfImportResult {
  const valid = XMLValidator.validate(xml);
  if (valid !== true) refuse([], `not well-formed XML: ${valid.err.msg} (line ${valid.err.line}, column ${valid.err.col})`);
  if (DOCTYPE.test(xml.replace(COMMENT_OR_CDATA, ""))) {
    refuse([], "has a DOCTYPE declaration: URDF declares none, and entities are not read (a DOCTYPE is how XML bombs and external entity reads come in)");
  }
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "@_", parseAttributeValue: false, maxNestedTags: MAX_NESTING });
  let document: XmlNode;
  try {
    document = parser.parse(xml) as XmlNode;
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    if (/nested tags/i.test(reason)) refuse([], `nests elements more than ${MAX_NESTING} deep: URDF needs only a few levels`);
    refuse([], `could not be read: ${reason}`);
  }
  const robotNode = asNodes(document.robot)[0];
  if (!robotNode) refuse([], "no <robot> element: not a URDF document");

  const links = asNodes(robotNode.link);
  const joints = asNodes(robotNode.joint).map(readJoint);
  const report: string[] = [];

  const childJoints = new Map<string, UrdfJoint[]>();
  for (const joint of joints) childJoints.set(joint.parent, [...(childJoints.get(joint.parent) ?? []), joint]);
  const childLinks = new Set<string>();
  for (const joint of joints) {
    if (childLinks.has(joint.child))
      refuse(["joint", joint.name, "child"], `link "${joint.child}" is the child of two joints (one is "${joint.name}"): URDF links form a tree`);
    childLinks.add(joint.child);
  }
  const linkNames = links.map((link) => attribute(link, "name") ?? "");

  let baseLink = options.baseLink;
  if (baseLink === undefined) {
    const roots = linkNames.filter((name) => !childLinks.has(name));
    if (roots.length !== 1) refuse(["link"], `expected one root link, found ${roots.length} (${roots.join(", ") || "none"}); pass baseLink`);
    baseLink = roots[0];
  } else if (!linkNames.includes(baseLink)) {
    refuse(["link", baseLink], `no link named "${baseLink}"`);
  }

  // `seen` guards against a loop back through a given base link.
  const hasMovableBelow = (link: string, seen = new Set<string>()): boolean => {
    if (seen.has(link)) return false;
    seen.add(link);
    return (childJoints.get(link) ?? []).some((joint) => joint.type !== "fixed" || hasMovableBelow(joint.child, seen));
  };

  // One child joint that moves, out of a link's children; fixed attachments without moving parts are ignored.
  const nextMovable = (link: string, after: UrdfJoint): UrdfJoint | undefined => {
    const children = childJoints.get(link) ?? [];
    for (const joint of children) {
      if (joint.type === "fixed" && hasMovableBelow(joint.child)) {
        refuse(["joint", joint.name], `joint "${joint.name}" is fixed inside the leg after "${after.name}": put the leg's revolute joints link to link`);
      }
    }
    const movable = children.filter((joint) => joint.type !== "fixed");
    if (movable.length > 1) {
      refuse(
        ["joint", after.name],
        `link "${link}" after joint "${after.name}" branches into ${movable.map((joint) => `"${joint.name}"`).join(", ")}: a leg is one chain`,
      );
    }
    return movable[0];
  };

  const legs: Robot["legs"] = [];
  const usedIds = new Set<string>();
  let massKg = 0;
  for (const link of links) {
    const mass = Number(attribute(asNodes(asNodes(link.inertial)[0]?.mass)[0], "value"));
    if (Number.isFinite(mass) && mass > 0) massKg += mass;
  }

  for (const coxa of childJoints.get(baseLink) ?? []) {
    if (coxa.type === "fixed") {
      if (hasMovableBelow(coxa.child)) {
        refuse(["joint", coxa.name], `joint "${coxa.name}" is fixed between the base and a leg: the coxa joint must hang on the base link "${baseLink}"`);
      }
      report.push(`ignored fixed joint "${coxa.name}" to "${coxa.child}" (no moving parts)`);
      continue;
    }
    checkRevolute(coxa, "coxa");
    const femur = nextMovable(coxa.child, coxa);
    if (!femur) refuse(["joint", coxa.name], `the chain from coxa joint "${coxa.name}" ends after 1 joint: a leg has three revolute joints`);
    checkRevolute(femur, "femur");
    const tibia = nextMovable(femur.child, femur);
    if (!tibia)
      refuse(["joint", femur.name], `the chain from coxa joint "${coxa.name}" ends after 2 joints at "${femur.name}": a leg has three revolute joints`);
    checkRevolute(tibia, "tibia");
    const extra = nextMovable(tibia.child, tibia);
    if (extra) refuse(["joint", extra.name], `joint "${extra.name}" follows tibia joint "${tibia.name}": a leg has exactly three revolute joints`);
    const footJoints = (childJoints.get(tibia.child) ?? []).filter((joint) => joint.type === "fixed");
    const foot = footJoints.length === 1 ? footJoints[0] : footJoints.find((joint) => /foot|tip|toe/i.test(`${joint.name} ${joint.child}`));
    if (!foot) {
      refuse(
        ["joint", tibia.name],
        footJoints.length === 0
          ? `tibia joint "${tibia.name}" has no fixed joint to a foot tip after it: the tibia is measured from the knee to the foot tip`
          : `tibia joint "${tibia.name}" is followed by ${footJoints.length} fixed joints: name the foot tip's "foot", "tip" or "toe"`,
      );
    }

    const coxaSign = axisSign(coxa.axis, 2);
    if (coxaSign === 0) refuse(["joint", coxa.name, "axis"], `coxa joint "${coxa.name}": axis (${coxa.axis.join(" ")}) is not along ±z`);
    for (const joint of [femur, tibia]) {
      if (axisSign(joint.axis, 1) === 0) {
        refuse(["joint", joint.name, "axis"], `${joint === femur ? "femur" : "tibia"} joint "${joint.name}": axis (${joint.axis.join(" ")}) is not along ±y`);
      }
    }
    if (Math.abs(coxa.rpy[0]) > ZERO_ANGLE_RAD || Math.abs(coxa.rpy[1]) > ZERO_ANGLE_RAD) {
      refuse(
        ["joint", coxa.name, "origin", "rpy"],
        `coxa joint "${coxa.name}": origin roll and pitch must be 0 (got ${degrees(coxa.rpy[0])}, ${degrees(coxa.rpy[1])}): the coxa turns about the body's vertical`,
      );
    }
    for (const joint of [femur, tibia]) {
      if (Math.abs(joint.rpy[0]) > ZERO_ANGLE_RAD || Math.abs(joint.rpy[2]) > ZERO_ANGLE_RAD) {
        refuse(
          ["joint", joint.name, "origin", "rpy"],
          `joint "${joint.name}": origin roll and yaw must be 0 (got ${degrees(joint.rpy[0])}, ${degrees(joint.rpy[2])}): femur and tibia turn in the leg plane`,
        );
      }
    }
    const offPlane: [UrdfJoint, number][] = [
      [femur, femur.xyz[1]],
      [tibia, tibia.xyz[1]],
      [foot, foot.xyz[1]],
    ];
    for (const [joint, sideways] of offPlane) {
      if (Math.abs(sideways) > ZERO_LENGTH_M) {
        refuse(["joint", joint.name, "origin", "xyz"], `joint "${joint.name}" sits ${tidy(sideways * MM_PER_M)} mm off the leg plane (origin y must be 0)`);
      }
    }
    if (femur.xyz[0] <= ZERO_LENGTH_M) {
      refuse(
        ["joint", femur.name, "origin", "xyz"],
        `femur joint "${femur.name}" must sit out along the coxa (origin x > 0, got ${tidy(femur.xyz[0] * MM_PER_M)} mm)`,
      );
    }
    const femurMm = Math.hypot(tibia.xyz[0], tibia.xyz[2]) * MM_PER_M;
    const tibiaMm = Math.hypot(foot.xyz[0], foot.xyz[2]) * MM_PER_M;
    if (femurMm <= ZERO_LENGTH_M * MM_PER_M)
      refuse(["joint", tibia.name, "origin", "xyz"], `tibia joint "${tibia.name}" sits on the femur joint: femur length 0`);
    if (tibiaMm <= ZERO_LENGTH_M * MM_PER_M) refuse(["joint", foot.name, "origin", "xyz"], `foot joint "${foot.name}" sits on the knee: tibia length 0`);

    // Our femur and tibia turn about the leg frame's −y, a URDF axis (0, ±1, 0) about ±y.
    const signs: Record<JointName, number> = { coxa: coxaSign, femur: -axisSign(femur.axis, 1), tibia: -axisSign(tibia.axis, 1) };
    const kneeDirectionRad = Math.atan2(tibia.xyz[2], tibia.xyz[0]);
    const zeroOffsetsRad: Record<JointName, number> = {
      coxa: 0,
      femur: kneeDirectionRad - femur.rpy[1],
      tibia: Math.PI / 2 - tibia.rpy[1] + Math.atan2(foot.xyz[2], foot.xyz[0]) - kneeDirectionRad,
    };
    const urdfJoints: Record<JointName, UrdfJoint> = { coxa, femur, tibia };

    const legIndex = legs.length;
    const id = legIdFrom(coxa.name, legIndex, usedIds);
    usedIds.add(id);
    const jointsOut = {} as Robot["legs"][number]["joints"];
    const notes: string[] = [];
    JOINT_NAMES.forEach((jointName, jointIndex) => {
      const joint = urdfJoints[jointName];
      const limit = joint.limit!;
      const sign = signs[jointName];
      const ends = [sign * degreesFromRadians(limit.lower), sign * degreesFromRadians(limit.upper)];
      const velocity = limit.velocity !== undefined && limit.velocity > 0 ? degreesFromRadians(limit.velocity) : undefined;
      jointsOut[jointName] = {
        minDeg: Math.min(ends[0], ends[1]) || 0,
        maxDeg: Math.max(ends[0], ends[1]) || 0,
        zeroOffsetDeg: tidy(wrapHalfTurn(zeroOffsetsRad[jointName] * DEG_PER_RAD)),
        maxSpeedDegS: velocity ?? URDF_DEFAULT_SPEED_DEG_S,
        servo: { channel: legIndex * 3 + jointIndex, ...URDF_SERVO_DEFAULTS },
      };
      if (sign < 0)
        notes.push(`leg ${id}: ${jointName} "${joint.name}" axis (${joint.axis.join(" ")}) turns against our sense: its angles and limits are negated`);
      if (velocity === undefined)
        notes.push(`leg ${id}: ${jointName} "${joint.name}" gives no limit velocity: maxSpeedDegS set to ${URDF_DEFAULT_SPEED_DEG_S}`);
    });
    const leg: Robot["legs"][number] = {
      id,
      mount: {
        x: tidy(coxa.xyz[0] * MM_PER_M),
        y: tidy(coxa.xyz[1] * MM_PER_M),
        z: tidy((coxa.xyz[2] + femur.xyz[2]) * MM_PER_M),
        yawDeg: wrapHalfTurn(degreesFromRadians(coxa.rpy[2])),
      },
      coxa: tidy(femur.xyz[0] * MM_PER_M),
      femur: tidy(femurMm),
      tibia: tidy(tibiaMm),
      joints: jointsOut,
    };
    legs.push(leg);
    report.push(
      `leg ${id}: ${coxa.name} → ${femur.name} → ${tibia.name} → foot "${foot.name}"; ` +
        `mount (${shown(leg.mount.x)}, ${shown(leg.mount.y)}, ${shown(leg.mount.z)}) mm, yaw ${shown(leg.mount.yawDeg)}°; ` +
        `coxa ${shown(leg.coxa)} mm, femur ${shown(leg.femur)} mm, tibia ${shown(leg.tibia)} mm; ` +
        `zero offsets femur ${shown(jointsOut.femur.zeroOffsetDeg)}°, tibia ${shown(jointsOut.tibia.zeroOffsetDeg)}°`,
      ...notes,
    );
  }
  if (legs.length === 0) refuse(["link", baseLink], `no revolute joints hang on the base link "${baseLink}": no legs found`);

  const baseNode = links[linkNames.indexOf(baseLink)];
  const comOrigin = asNodes(asNodes(baseNode?.inertial)[0]?.origin)[0];
  const comM = triple(attribute(comOrigin, "xyz"), [0, 0, 0], ["link", baseLink, "inertial", "origin", "xyz"]);
  const standHeight = options.standHeightMm ?? Math.round(0.55 * Math.min(...legs.map((leg) => leg.femur + leg.tibia)));
  const name = options.name ?? attribute(robotNode, "name") ?? "Imported robot";

  report.unshift(`base link "${baseLink}" is the body frame; ${legs.length} legs found`);
  report.push(
    massKg > 0 ? `body mass ${tidy(massKg)} kg: the sum of the links' inertial masses` : `no inertial masses: body mass set to ${URDF_DEFAULT_MASS_KG} kg`,
    comOrigin ? `centre of mass from the base link's inertial origin` : `no inertial origin on the base link: centre of mass set to the body origin`,
    options.standHeightMm === undefined
      ? `standHeight not in URDF: set to ${standHeight} mm (0.55 × the shortest femur + tibia)`
      : `standHeight ${standHeight} mm as given`,
    `servo mapping not in URDF: channels 0–${legs.length * 3 - 1} in leg order (coxa, femur, tibia), not reversed, centre ${URDF_SERVO_DEFAULTS.centerUs} µs, ` +
      `${URDF_SERVO_DEFAULTS.usPerDeg} µs/°, range ${URDF_SERVO_DEFAULTS.minUs}–${URDF_SERVO_DEFAULTS.maxUs} µs`,
  );

  const candidate = {
    format: ROBOT_FORMAT,
    name,
    body: { massKg: massKg > 0 ? tidy(massKg) : URDF_DEFAULT_MASS_KG, com: comM.map((value) => tidy(value * MM_PER_M)) },
    standHeight,
    legs,
  };
  const parsed = parseRobot(candidate);
  if (!parsed.ok) return { ok: false, issues: parsed.issues.map((issue) => ({ path: issue.path, message: `after import: ${issue.message}` })) };
  return { ok: true, robot: parsed.robot, report };
}

function wrapHalfTurn(angleDeg: number): number {
  const wrapped = angleDeg - 360 * Math.round(angleDeg / 360);
  return wrapped === -180 ? 180 : wrapped;
}

// "fl_coxa_joint" → "FL"; falls back to L1, L2, … when nothing usable is left.
function legIdFrom(jointName: string, legIndex: number, usedIds: Set<string>): string {
  const stem = jointName
    .replace(/[_-]?joint$/i, "")
    .replace(/[_-]?(coxa|hip)$/i, "")
    .replace(/[^A-Za-z0-9_]+/g, "_")
    .replace(/^_+|_+$/g, "")
    .toUpperCase()
    .slice(0, 16);
  if (/^[A-Z][A-Z0-9_]*$/.test(stem) && !usedIds.has(stem)) return stem;
  let fallback = legIndex + 1;
  while (usedIds.has(`L${fallback}`)) fallback += 1;
  return `L${fallback}`;
}
