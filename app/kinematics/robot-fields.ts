// The names people read for the fields of a robot definition: "Leg LF, tibia
// length" for `legs[0].tibia`, as the robot form labels its inputs. parseRobot
// starts each issue's message with the name and keeps the path beside it for
// programs. A leg is named by its id when the document gives it one.

type PathKey = PropertyKey;

const JOINT_FIELDS: Record<string, string> = {
  minDeg: "minimum",
  maxDeg: "maximum",
  zeroOffsetDeg: "zero offset",
  maxSpeedDegS: "maximum speed",
};

const SERVO_FIELDS: Record<string, string> = {
  channel: "channel",
  reversed: "reversal",
  centerUs: "centre pulse",
  usPerDeg: "µs per degree",
  minUs: "minimum pulse",
  maxUs: "maximum pulse",
};

const MOUNT_FIELDS: Record<string, string> = { x: "mount x", y: "mount y", z: "mount z", yawDeg: "mount yaw" };
const LINKS = new Set(["coxa", "femur", "tibia"]);
const COM_AXES = ["x", "y", "z"];

const quoted = (key: PathKey) => `"${String(key)}"`;

/** The leg at `index` as people name it: its id when the document has a usable one, else its place ("leg 3"). */
export function legName(document: unknown, index: number): string {
  const legs = (document as { legs?: unknown } | null)?.legs;
  const id = Array.isArray(legs) ? (legs[index] as { id?: unknown } | undefined)?.id : undefined;
  return typeof id === "string" && /^[A-Za-z][A-Za-z0-9_]{0,15}$/.test(id) ? id : `${index + 1}`;
}

/** The name of the field at `path` of a robot definition (the document the path reads into). */
export function robotFieldName(document: unknown, path: readonly PathKey[]): string {
  const [head, ...rest] = path;
  if (head === undefined) return "The definition";
  switch (head) {
    case "format":
      return named("Format", rest);
    case "name":
      return named("Name", rest);
    case "description":
      return named("Description", rest);
    case "standHeight":
      return named("Stand height", rest);
    case "body":
      return bodyField(rest);
    case "legs":
      return typeof rest[0] === "number" ? legField(document, rest[0], rest.slice(1)) : named("The robot's legs", rest);
    case "rest":
      return restField(rest);
    default:
      return `The definition's ${quoted(head)}`;
  }
}

// Anything below a field the form names as one (a character of a name, an item of a value).
function named(name: string, rest: readonly PathKey[]): string {
  return rest.length === 0 ? name : `${name} ${rest.map(quoted).join(" ")}`;
}

function bodyField(rest: readonly PathKey[]): string {
  const [field, axis, ...more] = rest;
  if (field === undefined) return "Body";
  if (field === "massKg") return named("Body mass", rest.slice(1));
  if (field === "com") {
    if (axis === undefined) return "Centre of mass";
    return typeof axis === "number" && axis < 3 ? named(`Centre of mass ${COM_AXES[axis]}`, more) : named("Centre of mass", rest.slice(1));
  }
  return named(`Body ${quoted(field)}`, rest.slice(1));
}

function legField(document: unknown, index: number, rest: readonly PathKey[]): string {
  const leg = `Leg ${legName(document, index)}`;
  const [field, ...more] = rest;
  if (field === undefined) return leg;
  // The id names the leg, so an id at fault is named by the leg's place.
  if (field === "id") return named(`Leg ${index + 1}, name`, more);
  if (field === "side" || field === "row") return named(`${leg}, ${field}`, more);
  if (typeof field === "string" && LINKS.has(field)) return named(`${leg}, ${field} length`, more);
  if (field === "mount") {
    const [part, ...beyond] = more;
    if (part === undefined) return `${leg}, mount`;
    return MOUNT_FIELDS[String(part)] ? named(`${leg}, ${MOUNT_FIELDS[String(part)]}`, beyond) : named(`${leg}, mount ${quoted(part)}`, beyond);
  }
  if (field === "joints") return jointField(leg, more);
  return named(`${leg}, ${quoted(field)}`, more);
}

function jointField(leg: string, rest: readonly PathKey[]): string {
  const [joint, field, ...more] = rest;
  if (joint === undefined) return `${leg}, joints`;
  if (typeof joint !== "string" || !LINKS.has(joint)) return named(`${leg}, joint ${quoted(joint)}`, rest.slice(1));
  const name = `${leg}, ${joint}`;
  if (field === undefined) return `${name} joint`;
  if (field === "servo") {
    const [part, ...beyond] = more;
    if (part === undefined) return `${name} servo`;
    return SERVO_FIELDS[String(part)] ? named(`${name} servo ${SERVO_FIELDS[String(part)]}`, beyond) : named(`${name} servo ${quoted(part)}`, beyond);
  }
  return JOINT_FIELDS[String(field)] ? named(`${name} ${JOINT_FIELDS[String(field)]}`, more) : named(`${name} joint ${quoted(field)}`, more);
}

function restField(rest: readonly PathKey[]): string {
  const [legId, joint, ...more] = rest;
  if (legId === undefined) return "Rest pose";
  const leg = `Rest pose, leg ${String(legId)}`;
  if (joint === undefined) return leg;
  return named(`${leg}, ${String(joint)}`, more);
}
