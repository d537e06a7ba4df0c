// What every gait template is: a name, the robots it suits, its default duty
// factor and its phase table (each leg's lift-off time as a fraction of the
// cycle, DESIGN.md "Gait sequence"). A new template is one new file with this
// shape and one line in templates/index.ts.
import { legRow, legSide, type LegSide, type Robot } from "../../kinematics/index";
import type { TemplateName } from "./names";

/** The robot's legs by side, each side front (row 0) to back, from the kinematics' side and row. */
export type LegLayout = {
  legIds: readonly string[];
  left: readonly string[];
  right: readonly string[];
  seat: Readonly<Record<string, { side: LegSide; row: number }>>;
};

export type GaitTemplate = {
  name: TemplateName;
  /** Static support flags of a dynamic gait are warnings (DESIGN.md). */
  dynamic: boolean;
  /** Why the template does not suit this robot, or null when it does. */
  unsuitable(layout: LegLayout): string | null;
  /** Duty factor when the parameters give none; null when they must (custom). */
  defaultDutyFactor(layout: LegLayout): number | null;
  /** Lift-off time of every leg for duty factor β; an empty table when the parameters must give it (custom). */
  phase(layout: LegLayout, dutyFactor: number): Record<string, number>;
};

export function legLayout(robot: Robot): LegLayout {
  const seat: Record<string, { side: LegSide; row: number }> = {};
  for (const leg of robot.legs) seat[leg.id] = { side: legSide(robot, leg), row: legRow(robot, leg) };
  const bySide = (side: LegSide): string[] =>
    robot.legs
      .filter((leg) => seat[leg.id].side === side)
      .sort((a, b) => seat[a.id].row - seat[b.id].row)
      .map((leg) => leg.id);
  return { legIds: robot.legs.map((leg) => leg.id), left: bySide("left"), right: bySide("right"), seat };
}

/** The fractional part, F(x) = x − ⌊x⌋, as Song and Waldron write it; rounded to 1e-12 so tables print cleanly. */
export function cycleFraction(value: number): number {
  const rounded = Math.round(value * 1e12) / 1e12;
  return rounded - Math.floor(rounded);
}

/** "needs N legs, three a side" style refusal, or null. */
export function requireLegsPerSide(layout: LegLayout, perSide: number, templateName: string): string | null {
  if (layout.left.length === perSide && layout.right.length === perSide) return null;
  return `${templateName} needs ${perSide * 2} legs, ${perSide} a side (this robot has ${layout.left.length} left and ${layout.right.length} right)`;
}

/**
 * Phases of the gaits whose legs form two alternating sets (tripod, trot,
 * alternating tetrapod): even rows of the left side with odd rows of the
 * right lift at 0, the others half a cycle later.
 */
export function alternatingSetsPhase(layout: LegLayout): Record<string, number> {
  const phase: Record<string, number> = {};
  layout.left.forEach((legId, row) => (phase[legId] = cycleFraction(row % 2 === 0 ? 0 : 1 / 2)));
  layout.right.forEach((legId, row) => (phase[legId] = cycleFraction(row % 2 === 0 ? 1 / 2 : 0)));
  return phase;
}
