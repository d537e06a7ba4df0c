// The robot definition, format "gaitloom.robot/1" (DESIGN.md, "Robot definition").
// One zod schema is the source of truth: parseRobot validates with it and
// robotJsonSchema publishes it, so the two can never disagree.
import { z } from "zod";
import {
  BODY_HEIGHT_MM,
  BODY_POINT_MM,
  HALF_TURN_DEG,
  JOINT_SPEED_DEG_S,
  LINK_MM,
  MASS_KG,
  PULSE_US,
  SERVO_CHANNEL,
  US_PER_DEG,
  rangeText,
  type Bound,
} from "./bounds";
import { describeValue, formatIssues, type DefinitionIssue } from "./issues";
import { robotFieldName } from "./robot-fields";

export const ROBOT_FORMAT = "gaitloom.robot/1";
export const MIN_LEGS = 4;
export const MAX_LEGS = 8;

export const JOINT_NAMES = ["coxa", "femur", "tibia"] as const;
export type JointName = (typeof JOINT_NAMES)[number];

/** A point or vector in millimetres, [x, y, z]: x forward, y left, z up (REP 103). */
export type Vec3 = [number, number, number];

/** One value per joint; servo degrees unless a name says otherwise. */
export type JointAngles = { coxa: number; femur: number; tibia: number };

/**
 * Body pose relative to the neutral body frame: translation in mm, rotation in
 * degrees as R = Rz(yaw)·Ry(pitch)·Rx(roll) (fixed-axis roll, pitch, yaw, REP 103).
 */
export type BodyPose = { x: number; y: number; z: number; roll: number; pitch: number; yaw: number };

// Every number of the format lies in a physical range (bounds.ts); zod numbers are finite already.
const within = (bound: Bound) => z.number().min(bound.min).max(bound.max);
const bodyPointMm = within(BODY_POINT_MM);
const halfTurnDeg = within(HALF_TURN_DEG);
const pulseUs = within(PULSE_US);

// Leg ids end up as CSV headers and C identifiers in the exports.
const LEG_ID_PATTERN = /^[A-Za-z][A-Za-z0-9_]{0,15}$/;

const servoSchema = z
  .strictObject({
    channel: z
      .number()
      .int()
      .min(SERVO_CHANNEL.min)
      .max(SERVO_CHANNEL.max)
      .describe(`Output channel on the servo controller, ${SERVO_CHANNEL.min} to ${SERVO_CHANNEL.max}; unique across the robot.`),
    reversed: z.boolean().describe("The servo turns against the joint's positive sense: pulses step the other way."),
    centerUs: pulseUs.describe(`Pulse width at servo angle 0, ${rangeText("µs", PULSE_US)}.`),
    usPerDeg: within(US_PER_DEG).describe(
      `Pulse width change per servo degree, ${rangeText("µs/°", US_PER_DEG)}, always positive; \`reversed\` gives the sign.`,
    ),
    minUs: pulseUs.describe(`Shortest pulse the servo accepts, ${rangeText("µs", PULSE_US)}.`),
    maxUs: pulseUs.describe(`Longest pulse the servo accepts, ${rangeText("µs", PULSE_US)}.`),
  })
  .superRefine((servo, ctx) => {
    if (servo.minUs >= servo.maxUs) {
      ctx.addIssue({ code: "custom", path: ["minUs"], message: `must be below the maximum pulse (got ${servo.minUs} ≥ ${servo.maxUs})` });
    } else if (servo.centerUs < servo.minUs || servo.centerUs > servo.maxUs) {
      ctx.addIssue({
        code: "custom",
        path: ["centerUs"],
        message: `must lie within the minimum and maximum pulse (got ${servo.centerUs} outside ${servo.minUs}..${servo.maxUs})`,
      });
    }
  });

const jointSchema = z
  .strictObject({
    minDeg: halfTurnDeg.describe(`Lower joint limit in servo degrees, ${rangeText("°", HALF_TURN_DEG)}.`),
    maxDeg: halfTurnDeg.describe(`Upper joint limit in servo degrees, ${rangeText("°", HALF_TURN_DEG)}.`),
    zeroOffsetDeg: halfTurnDeg.describe(`Calibration: servoDeg = geometricDeg − zeroOffsetDeg, ${rangeText("°", HALF_TURN_DEG)}.`),
    maxSpeedDegS: within(JOINT_SPEED_DEG_S).describe(`Fastest the joint may turn, ${rangeText("°/s", JOINT_SPEED_DEG_S)}.`),
    servo: servoSchema,
  })
  .superRefine((joint, ctx) => {
    if (joint.minDeg >= joint.maxDeg) {
      ctx.addIssue({ code: "custom", path: ["minDeg"], message: `must be below the maximum (got ${joint.minDeg} ≥ ${joint.maxDeg})` });
    }
  });

const legSchema = z.strictObject({
  id: z
    .string()
    .regex(LEG_ID_PATTERN, {
      error: (issue) => `must start with a letter and hold only letters, digits and _, 16 at most (got ${describeValue(issue.input)})`,
    })
    .describe("Short leg name, e.g. LF; letters, digits and _, starting with a letter."),
  mount: z
    .strictObject({
      x: bodyPointMm.describe(`Mount point (the coxa axis) in the body frame, forward, ${rangeText("mm", BODY_POINT_MM)}.`),
      y: bodyPointMm.describe(`Mount point, to the left, ${rangeText("mm", BODY_POINT_MM)}.`),
      z: bodyPointMm.describe(`Mount point (the femur joint's height), up, ${rangeText("mm", BODY_POINT_MM)}.`),
      yawDeg: halfTurnDeg.describe(`Direction of the coxa's zero about z, counter-clockwise from forward, ${rangeText("°", HALF_TURN_DEG)}.`),
    })
    .describe("Where the leg attaches to the body and which way its coxa zero points."),
  coxa: within(LINK_MM).describe(`Coxa length, coxa axis to femur joint, ${rangeText("mm", LINK_MM)}.`),
  femur: within(LINK_MM).describe(`Femur length, femur joint to knee joint, ${rangeText("mm", LINK_MM)}.`),
  tibia: within(LINK_MM).describe(`Tibia length, knee joint to foot tip, ${rangeText("mm", LINK_MM)}.`),
  side: z.enum(["left", "right"]).optional().describe("Overrides the side taken from the mount (y > 0 is left)."),
  row: z
    .number()
    .int()
    .min(0)
    .max(MAX_LEGS - 1)
    .optional()
    .describe(`Front-to-back position on its side, 0 = front to ${MAX_LEGS - 1}; overrides the order by mount x.`),
  joints: z.strictObject({ coxa: jointSchema, femur: jointSchema, tibia: jointSchema }),
});

const restAnglesSchema = z.strictObject({ coxa: halfTurnDeg, femur: halfTurnDeg, tibia: halfTurnDeg });

const robotObjectSchema = z.strictObject({
  format: z.literal(ROBOT_FORMAT),
  name: z.string().trim().min(1).max(120),
  description: z.string().max(2000).optional(),
  body: z.strictObject({
    massKg: within(MASS_KG).describe(`Total mass of the robot, ${rangeText("kg", MASS_KG)}.`),
    com: z.tuple([bodyPointMm, bodyPointMm, bodyPointMm]).describe(`Centre of mass in the body frame, [x, y, z], each ${rangeText("mm", BODY_POINT_MM)}.`),
  }),
  standHeight: within(BODY_HEIGHT_MM).describe(`Default height of the body origin above the ground, ${rangeText("mm", BODY_HEIGHT_MM)}.`),
  legs: z.array(legSchema),
  rest: z
    .record(z.string(), restAnglesSchema)
    .optional()
    .describe(`Servo angles per leg of the robot resting on its belly, powered down, each ${rangeText("°", HALF_TURN_DEG)}; gives every leg.`),
});

export const robotSchema = robotObjectSchema
  .superRefine((robot, ctx) => {
    const count = robot.legs.length;
    if (count < MIN_LEGS || count > MAX_LEGS) {
      ctx.addIssue({ code: "custom", path: ["legs"], message: `must number ${MIN_LEGS} to ${MAX_LEGS} (got ${count})` });
    }
    const firstIndexOfId = new Map<string, number>();
    robot.legs.forEach((leg, index) => {
      const earlier = firstIndexOfId.get(leg.id);
      if (earlier !== undefined) {
        ctx.addIssue({ code: "custom", path: ["legs", index, "id"], message: `must be unique (got "${leg.id}", also leg ${earlier + 1})` });
      } else {
        firstIndexOfId.set(leg.id, index);
      }
    });
    const channelOwner = new Map<number, string>();
    robot.legs.forEach((leg, index) => {
      for (const jointName of JOINT_NAMES) {
        const channel = leg.joints[jointName].servo.channel;
        const owner = channelOwner.get(channel);
        const here = `the ${leg.id} ${jointName}`;
        if (owner !== undefined) {
          ctx.addIssue({
            code: "custom",
            path: ["legs", index, "joints", jointName, "servo", "channel"],
            message: `must be unique across the robot (got ${channel}, also used by ${owner})`,
          });
        } else {
          channelOwner.set(channel, here);
        }
      }
    });
    const seatOwner = new Map<string, string>();
    robot.legs.forEach((leg, index) => {
      const seat = `${legSide(robot, leg)} ${legRow(robot, leg)}`;
      const owner = seatOwner.get(seat);
      if (owner !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["legs", index, leg.row === undefined ? "side" : "row"],
          message: `clashes with ${owner}: both are row ${legRow(robot, leg)} on the ${legSide(robot, leg)} side`,
        });
      } else {
        seatOwner.set(seat, leg.id);
      }
    });
    if (robot.rest) {
      for (const restId of Object.keys(robot.rest)) {
        if (!firstIndexOfId.has(restId)) {
          ctx.addIssue({ code: "custom", path: ["rest", restId], message: `must name a leg (no leg "${restId}")` });
        }
      }
      robot.legs.forEach((leg) => {
        const angles = robot.rest?.[leg.id];
        if (!angles) {
          ctx.addIssue({ code: "custom", path: ["rest", leg.id], message: "is missing: the rest pose gives every leg" });
          return;
        }
        for (const jointName of JOINT_NAMES) {
          const { minDeg, maxDeg } = leg.joints[jointName];
          const value = angles[jointName];
          // Limits that are themselves wrong are reported on the joint already.
          if (minDeg < maxDeg && (value < minDeg || value > maxDeg)) {
            ctx.addIssue({
              code: "custom",
              path: ["rest", leg.id, jointName],
              message: `must lie within the joint limits ${minDeg}..${maxDeg} (got ${value})`,
            });
          }
        }
      });
    }
  })
  .meta({
    title: "Gaitloom robot definition",
    description: "A legged robot for Gaitloom: millimetres and degrees, x forward, y left, z up. Servo degrees are geometric degrees minus zeroOffsetDeg.",
  });

export type Robot = z.output<typeof robotSchema>;
export type Leg = Robot["legs"][number];
export type Joint = Leg["joints"]["coxa"];
export type Servo = Joint["servo"];
export type LegSide = "left" | "right";

export type { DefinitionIssue };
export type ParseRobotResult = { ok: true; robot: Robot } | { ok: false; issues: DefinitionIssue[] };

/** Validates an untrusted robot definition (already JSON-decoded). */
export function parseRobot(json: unknown): ParseRobotResult {
  const result = robotSchema.safeParse(json, { reportInput: true });
  if (result.success) return { ok: true, robot: result.data };
  return { ok: false, issues: formatIssues(result.error.issues, (path) => robotFieldName(json, path)) };
}

let generatedJsonSchema: Record<string, unknown> | undefined;

/**
 * The JSON Schema of the robot definition, generated from the zod schema
 * (draft 2020-12). Rules across fields (unique ids and channels, minDeg < maxDeg,
 * …) are beyond JSON Schema: parseRobot checks them.
 */
export function robotJsonSchema(): Record<string, unknown> {
  generatedJsonSchema ??= z.toJSONSchema(robotSchema, { io: "input", target: "draft-2020-12" }) as Record<string, unknown>;
  return structuredClone(generatedJsonSchema);
}

/** Finds a leg by id; throws for an id the robot does not have (a caller's bug, not user input). */
export function findLeg(robot: Robot, legId: string): Leg {
  for (const leg of robot.legs) if (leg.id === legId) return leg;
  throw new RangeError(`robot "${robot.name}" has no leg "${legId}" (legs: ${robot.legs.map((leg) => leg.id).join(", ")})`);
}

/** The leg's side: its own `side`, else from the mount (y > 0 is left, y ≤ 0 right). */
export function legSide(robot: Pick<Robot, "legs">, leg: Leg): LegSide {
  // The robot is not needed today; it is in the signature to match legRow, which needs it.
  void robot;
  if (leg.side) return leg.side;
  return leg.mount.y > 0 ? "left" : "right";
}

/**
 * The leg's front-to-back place on its side, 0 = front: its own `row`, else its
 * rank by mount x (larger x first) among the legs of the same side, ties in list order.
 */
export function legRow(robot: Pick<Robot, "legs">, leg: Leg): number {
  if (leg.row !== undefined) return leg.row;
  const side = legSide(robot, leg);
  const index = robot.legs.indexOf(leg);
  let row = 0;
  robot.legs.forEach((other, otherIndex) => {
    if (other === leg || legSide(robot, other) !== side) return;
    if (other.mount.x > leg.mount.x || (other.mount.x === leg.mount.x && otherIndex < index)) row += 1;
  });
  return row;
}
