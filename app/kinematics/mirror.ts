// Leg copy helpers for the robot editor. Mirroring left↔right negates y, the
// mount yaw and the coxa's limits and offset (DESIGN.md); femur and tibia keep
// theirs because their positive senses (knee up, foot out) are the same on both sides.
import type { Joint, Leg } from "./robot";

// Avoids −0 in definitions, which would print as 0 but compare unequal in tests.
function negate(value: number): number {
  return value === 0 ? 0 : -value;
}

function mirrorCoxaJoint(joint: Joint): Joint {
  return {
    ...joint,
    minDeg: negate(joint.maxDeg),
    maxDeg: negate(joint.minDeg),
    zeroOffsetDeg: negate(joint.zeroOffsetDeg),
    servo: { ...joint.servo },
  };
}

export type ServoChannels = { coxa: number; femur: number; tibia: number };

/**
 * The leg's mirror image across the body's x–z plane under a new id. Servo
 * mappings are copied as they are (a mirror-mounted servo may need `reversed`
 * flipped: that is the hardware's business); pass `servoChannels` to give the
 * copy channels of its own, as every channel must be unique in a robot.
 */
export function mirrorLeg(leg: Leg, newId: string, servoChannels?: ServoChannels): Leg {
  const mirrored: Leg = {
    ...leg,
    id: newId,
    mount: { x: leg.mount.x, y: negate(leg.mount.y), z: leg.mount.z, yawDeg: negate(leg.mount.yawDeg) },
    joints: {
      coxa: mirrorCoxaJoint(leg.joints.coxa),
      femur: { ...leg.joints.femur, servo: { ...leg.joints.femur.servo } },
      tibia: { ...leg.joints.tibia, servo: { ...leg.joints.tibia.servo } },
    },
  };
  if (leg.side) mirrored.side = leg.side === "left" ? "right" : "left";
  if (servoChannels) {
    mirrored.joints.coxa.servo.channel = servoChannels.coxa;
    mirrored.joints.femur.servo.channel = servoChannels.femur;
    mirrored.joints.tibia.servo.channel = servoChannels.tibia;
  }
  return mirrored;
}

/**
 * `target` with the link lengths and the joint limits, offsets and speeds of
 * `source`; the target keeps its id, mount, side, row and servo mappings.
 * With `mirror` the coxa's limits and offset are negated, for a leg on the other side.
 */
export function copyLegGeometry(source: Leg, target: Leg, options: { mirror?: boolean } = {}): Leg {
  const copyJoint = (from: Joint, to: Joint): Joint => ({
    minDeg: from.minDeg,
    maxDeg: from.maxDeg,
    zeroOffsetDeg: from.zeroOffsetDeg,
    maxSpeedDegS: from.maxSpeedDegS,
    servo: { ...to.servo },
  });
  const coxa = copyJoint(source.joints.coxa, target.joints.coxa);
  return {
    ...target,
    mount: { ...target.mount },
    coxa: source.coxa,
    femur: source.femur,
    tibia: source.tibia,
    joints: {
      coxa: options.mirror ? mirrorCoxaJoint(coxa) : coxa,
      femur: copyJoint(source.joints.femur, target.joints.femur),
      tibia: copyJoint(source.joints.tibia, target.joints.tibia),
    },
  };
}
