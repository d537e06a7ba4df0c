// Issue 16, item 5: the top view's leg labels do not overlap one another.
import { expect, test } from "vitest";
import { neutralStance, type Vec3 } from "~/kinematics";
import { legPostures } from "~/components/robot-view/leg-postures";
import { topFrame } from "~/components/robot-view/frame";
import { labelBox, placeLegLabels } from "~/components/robot-view/leg-labels";
import { loadDemoRobot, type DemoRobotFile } from "../../support/robots";

const overlaps = (a: ReturnType<typeof labelBox>, b: ReturnType<typeof labelBox>) =>
  a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;

for (const file of ["pier-crawler", "quay-walker", "hull-climber"] as DemoRobotFile[]) {
  test(`${file}: labels of the neutral stance and of feet drawn together sit apart`, () => {
    const robot = loadDemoRobot(file);
    const frame = topFrame(robot, 360, 360);
    const stance = neutralStance(robot, robot.standHeight);
    // All feet pulled in to one spot near the body: the worst case for labels.
    const bunched: Record<string, Vec3> = Object.fromEntries(
      robot.legs.map((leg, index) => [leg.id, [20 + index * 2, index % 2 ? 8 : -8, -robot.standHeight]]),
    );
    for (const feet of [stance, bunched]) {
      const postures = legPostures(robot, feet);
      const labels = placeLegLabels(
        postures.map((posture) => ({ id: posture.legId, text: posture.legId, foot: frame.toScreen(posture.points.foot[0], posture.points.foot[1]) })),
        frame.toScreen(0, 0),
      );
      expect(labels).toHaveLength(robot.legs.length);
      for (let i = 0; i < labels.length; i += 1) {
        for (let j = i + 1; j < labels.length; j += 1) {
          expect(overlaps(labelBox(labels[i]), labelBox(labels[j])), `${labels[i].id} and ${labels[j].id}`).toBe(false);
        }
      }
    }
  });
}
