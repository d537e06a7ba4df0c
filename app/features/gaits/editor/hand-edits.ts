// Whether the keys differ from what the generator makes of the sequence's
// own parameters: regenerating would then overwrite someone's hand edits.
import { generateGait, type Sequence } from "../../../gait/index";
import type { Robot } from "../../../kinematics/index";
import { paramsOfSequence } from "./templates";

export function hasHandEdits(robot: Robot, sequence: Sequence): boolean {
  const params = paramsOfSequence(sequence);
  if (!params) return true;
  try {
    const generated = generateGait(robot, params);
    return JSON.stringify(generated.legs) !== JSON.stringify(sequence.legs);
  } catch {
    return true;
  }
}
