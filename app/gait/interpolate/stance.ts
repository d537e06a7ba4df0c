// Stance (DESIGN.md, "Gait sequence"): the foot stays where it touched down,
// fixed in the world, while the body moves; in the heading frame it therefore
// slides back along the body's travel, on arcs when turning.
import type { Vec3 } from "../../kinematics/index";
import { createPlanar, travelBy, type Travel } from "./travel";

const scratch = createPlanar();

/**
 * A world-fixed point given in the heading frame at one time, seen from the
 * heading frame a fraction `delta` of the cycle later: E(Δ)⁻¹·p.
 */
export function carryStance(travel: Travel, point: Readonly<Vec3>, delta: number): Vec3 {
  const frame = travelBy(travel, delta, scratch);
  const dx = point[0] - frame.x;
  const dy = point[1] - frame.y;
  return [frame.cos * dx + frame.sin * dy, -frame.sin * dx + frame.cos * dy, point[2]];
}

/**
 * The generator's placement of a foot that is down for `stanceFraction` of the
 * cycle and passes its neutral point `neutral` half-way through: at touch-down
 * it is E(d/2)·n (ahead by half the body's travel during the stance), at
 * lift-off E(d/2)⁻¹·n (behind by as much), on the arc when turning.
 */
export function placeStanceFoot(travel: Travel, neutral: Readonly<Vec3>, stanceFraction: number, at: "touch-down" | "lift-off"): Vec3 {
  return carryStance(travel, neutral, at === "touch-down" ? -stanceFraction / 2 : stanceFraction / 2);
}
