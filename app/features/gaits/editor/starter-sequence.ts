// The sequence a gait starts from when it has neither a draft nor a version:
// the first template that suits the robot, at the engine's default parameters.
import { generateGait, type Sequence } from "../../../gait/index";
import type { Robot } from "../../../kinematics/index";
import { suitableTemplates } from "./templates";

export function starterSequence(robot: Robot, name?: string): Sequence {
  const [first] = suitableTemplates(robot);
  // Every robot of four to eight legs has a side-by-side wave at least; custom needs phases we do not have here.
  return generateGait(robot, { template: first?.name ?? "wave", ...(name ? { name } : {}) });
}
