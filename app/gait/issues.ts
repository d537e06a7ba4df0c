// Sequence problems read exactly like the robot's (`legs.LF.keys[2].t: must be
// at most 1 (got 1.2)`): one formatter serves both.
export { formatIssues as formatSequenceIssues, type DefinitionIssue as SequenceIssue } from "../kinematics/index";
