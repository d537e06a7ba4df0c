// Random joint sets inside a leg's limits, kept ≥ 1° away from a straight
// (geometric tibia +90°) or fully folded (−90°) leg, with the foot clear of the
// coxa axis, so that the documented branch gives them back exactly.
import type { JointAngles, Leg } from "../../../app/kinematics";
import type { Random } from "./prng";

const RAD = Math.PI / 180;
export const SINGULARITY_CLEARANCE_DEG = 1;

export function sampleJointSet(random: Random, leg: Leg): JointAngles {
  const { coxa, femur, tibia } = leg.joints;
  for (;;) {
    const angles = {
      coxa: random.between(coxa.minDeg, coxa.maxDeg),
      femur: random.between(femur.minDeg, femur.maxDeg),
      tibia: random.between(tibia.minDeg, tibia.maxDeg),
    };
    const tibiaGeometricDeg = angles.tibia + tibia.zeroOffsetDeg;
    if (Math.abs(tibiaGeometricDeg) > 90 - SINGULARITY_CLEARANCE_DEG) continue;
    const femurRad = (angles.femur + femur.zeroOffsetDeg) * RAD;
    const tibiaDirectionRad = femurRad - Math.PI / 2 + tibiaGeometricDeg * RAD;
    const radiusMm = leg.coxa + leg.femur * Math.cos(femurRad) + leg.tibia * Math.cos(tibiaDirectionRad);
    if (radiusMm < 5) continue;
    return angles;
  }
}
