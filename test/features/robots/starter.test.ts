import { describe, expect, test } from "vitest";
import { neutralStance, parseRobot, solveLeg } from "~/kinematics";
import { starterRobot, STARTER_LEG_COUNTS } from "~/features/robots/starter";

describe("the starter robot", () => {
  test.each(STARTER_LEG_COUNTS)("with %i legs is valid and stands in its neutral stance within every joint limit", (count) => {
    const robot = starterRobot("Test", count);
    expect(parseRobot(robot).ok).toBe(true);
    expect(robot.legs).toHaveLength(count);
    const feet = neutralStance(robot);
    for (const leg of robot.legs) {
      const solution = solveLeg(robot, leg.id, feet[leg.id]);
      expect(solution.reachable, `${leg.id} reachable`).toBe(true);
      expect(solution.violations, `${leg.id} violations`).toEqual([]);
    }
  });
});
