// The flags a straight walk should raise, worked out without the gait engine:
// the planned feet from DESIGN.md's formulas (helpers.straightWalkFoot), each
// solved on its own with the kinematics' solveLeg, then the limits of
// DESIGN.md applied by hand: joint limits, |Δangle|·fps against maxSpeedDegS
// between frames, and the loop's last-to-first step. straightTripod makes the
// walk with the engine as well, from the same parameters, for the comparison.
import { generateGait, solveSequence, type GaitParams } from "~/gait/index";
import { JOINT_NAMES, neutralStance, solveLeg, type Robot } from "~/kinematics/index";
import { DEMO_ROBOTS, loadDemoRobot } from "../../support/robots";
import { straightWalkFoot } from "../helpers";

export type ExpectedFlag = { kind: string; frame: number; leg: string; joint?: string; value: number; limit: number };

export function expectedStraightWalkFlags(
  robot: Robot,
  walk: {
    phase: Record<string, number>;
    dutyFactor: number;
    strideMm: number;
    stepHeightMm: number;
    bodyHeightMm: number;
    frames: number;
    fps: number;
    ease: (s: number) => number;
  },
): { flags: ExpectedFlag[]; unreachable: number } {
  const neutral = neutralStance(robot, walk.bodyHeightMm);
  const flags: ExpectedFlag[] = [];
  let unreachable = 0;
  for (const leg of robot.legs) {
    const solutions = Array.from({ length: walk.frames }, (_, frame) =>
      solveLeg(
        robot,
        leg.id,
        straightWalkFoot(
          {
            neutral: neutral[leg.id],
            liftOff: walk.phase[leg.id],
            dutyFactor: walk.dutyFactor,
            strideMm: walk.strideMm,
            stepHeightMm: walk.stepHeightMm,
            ease: walk.ease,
          },
          frame / walk.frames,
        ),
      ),
    );
    solutions.forEach((solution, frame) => {
      if (!solution.reachable) unreachable += 1;
      for (const violation of solution.violations) {
        const above = violation.valueDeg > violation.maxDeg;
        flags.push({
          kind: "joint-limit",
          frame,
          leg: leg.id,
          joint: violation.joint,
          value: violation.valueDeg,
          limit: above ? violation.maxDeg : violation.minDeg,
        });
      }
      const previous = solutions[(frame - 1 + walk.frames) % walk.frames];
      for (const joint of JOINT_NAMES) {
        const speed = Math.abs(solution.angles[joint] - previous.angles[joint]) * walk.fps;
        const limit = leg.joints[joint].maxSpeedDegS;
        if (speed > limit) flags.push({ kind: frame === 0 ? "loop-jump" : "joint-speed", frame, leg: leg.id, joint, value: speed, limit });
      }
    });
  }
  return { flags, unreachable };
}

/** A flag as a short comparable line: kind, frame, leg, joint. */
export function flagKey(flag: { kind: string; frame: number; leg?: string; joint?: string }): string {
  return `${flag.kind} frame ${flag.frame} ${flag.leg ?? "-"} ${flag.joint ?? "-"}`;
}

/**
 * A straight tripod walk of the six-legged demo robot, solved by the engine,
 * and the flags worked out for the same walk without it (the engine gives only
 * the legs' lift-off phases); `ease` is the swing's ease as a function.
 */
export function straightTripod(
  walk: { strideMm: number; cycleMs: number; fps: number; stepHeightMm: number; swingEase?: GaitParams["swingEase"] },
  ease: (s: number) => number,
) {
  const robot = loadDemoRobot(DEMO_ROBOTS.six);
  const sequence = generateGait(robot, { template: "tripod", ...walk });
  const solved = solveSequence(robot, sequence);
  const expected = expectedStraightWalkFlags(robot, {
    phase: sequence.generator.phase!,
    // The tripod's: half the cycle on the ground.
    dutyFactor: 0.5,
    strideMm: walk.strideMm,
    stepHeightMm: walk.stepHeightMm,
    bodyHeightMm: robot.standHeight,
    frames: Math.round((walk.cycleMs * walk.fps) / 1000),
    fps: walk.fps,
    ease,
  });
  return { robot, sequence, solved, expected };
}
